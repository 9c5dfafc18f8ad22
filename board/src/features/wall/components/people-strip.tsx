import { useLayoutEffect, useRef, useState } from 'react';
import type { BoardPerson } from '@baytime/shared';
import { Glyph, type GlyphName } from '@/components/glyph';
import {
  packPages,
  personChips,
  queueWait,
  stripPages,
  type PersonChip,
  type QueueSummary,
} from '../people-pages';
import { PageMarks } from './page-marks';
import { SteadyText } from './steady-text';
import styles from './wall.module.css';

export interface PeopleStripProps {
  people: readonly BoardPerson[];
  nowMs: number;
  /** Counts up every few seconds: turns the page when the people do not fit on one line. */
  turn: number;
  /** Lines waiting for a technician; null while the link is lost and the count may be stale. */
  queue: QueueSummary | null;
  /** Told how many turns the strip needs to show everyone, whenever that changes. */
  onPageCount?: (pages: number) => void;
  /**
   * Only those idle or on a break: everyone has pages of their own, and those on jobs are on their
   * bays' tiles. The turns told to `onPageCount` still count everyone, so the choice holds steady.
   */
  offJobsOnly?: boolean;
}

const GLYPHS: Record<BoardPerson['status'], GlyphName> = {
  idle: 'idle',
  'on-break': 'cup',
  'on-job': 'wrench',
};

export function PeopleStrip({ people, nowMs, turn, queue, onPageCount, offJobsOnly }: PeopleStripProps) {
  const chips = personChips(people, nowMs);
  const measureRef = useRef<HTMLDivElement>(null);
  const boxRef = useRef<HTMLDivElement>(null);
  const [room, setRoom] = useState<{ widths: number[]; available: number; gap: number } | null>(null);
  // Packed by each chip at its widest, which holds still while the people do: a turn shows the next page.
  const shape = chips.map((chip) => `${chip.id}:${chip.status}:${chip.name}:${chip.widestDetail}`).join('|');

  useLayoutEffect(() => {
    const measure = () => {
      const box = boxRef.current;
      const row = measureRef.current;
      if (!box || !row) return;
      const widths = Array.from(row.children, (child) => (child as HTMLElement).offsetWidth);
      const gap = parseFloat(getComputedStyle(row).columnGap) || 0;
      setRoom({ widths, available: box.clientWidth, gap });
      onPageCount?.(packPages(widths, box.clientWidth, gap).length);
    };
    measure();
    const observer = new ResizeObserver(measure);
    if (boxRef.current) observer.observe(boxRef.current);
    // A chip also changes width with the same words: another state's outline, other digits, a font arriving.
    for (const chip of measureRef.current?.children ?? []) observer.observe(chip);
    return () => observer.disconnect();
  }, [shape, onPageCount]);

  const offJobs = offJobsOnly
    ? chips.flatMap((chip, index) => (chip.status === 'on-job' ? [] : [index]))
    : undefined;
  const pages = room ? stripPages(room.widths, room.available, room.gap, offJobs) : [];
  const page = pages.length ? pages[turn % pages.length] : undefined;
  const shownIndices = page ?? (offJobs ? [] : chips.map((_, index) => index));
  const shown = shownIndices.flatMap((index) => {
    const chip = chips[index];
    return chip ? [{ chip, brief: room !== null && (room.widths[index] ?? 0) > room.available }] : [];
  });

  return (
    <footer className={styles.strip}>
      {queue && <QueueNote queue={queue} />}
      <div className={styles.chips} ref={boxRef}>
        <div className={styles.chipsMeasure} ref={measureRef} aria-hidden="true">
          {chips.map((chip) => (
            <PersonChipView key={chip.id} chip={{ ...chip, detail: chip.widestDetail }} />
          ))}
        </div>
        {chips.length === 0 ? (
          <div className={styles.chip}>Nobody on shift</div>
        ) : offJobs?.length === 0 ? (
          <div className={styles.chip}>Everyone on shift is on a job</div>
        ) : (
          shown.map(({ chip, brief }) => <PersonChipView key={chip.id} chip={chip} brief={brief} />)
        )}
      </div>
      <PageMarks
        page={pages.length ? turn % pages.length : 0}
        pages={pages.length}
        announced={false}
        dots={false}
        className={styles.stripPages}
      />
    </footer>
  );
}

export interface PersonChipViewProps {
  chip: PersonChip;
  /** The glyph and name only: for a chip too wide for the strip even alone, rather than cut off. */
  brief?: boolean;
  className?: string;
}

export function PersonChipView({ chip, brief = false, className }: PersonChipViewProps) {
  return (
    <div className={`${styles.chip} ${chip.status === 'idle' ? styles.chipIdle : ''} ${className ?? ''}`}>
      <Glyph name={GLYPHS[chip.status]} className={styles.glyph} />
      <span className={styles.chipName}>{chip.name}</span>
      {!brief && <span className={styles.chipDetail}>{chip.detail}</span>}
    </div>
  );
}

function QueueNote({ queue }: { queue: QueueSummary }) {
  const wait = queueWait(queue);
  return (
    <div className={styles.queue}>
      <Glyph name="queue" className={styles.glyph} />
      {queue.count === 0 ? (
        <span>Queue empty</span>
      ) : (
        <span>
          Queue <span className={styles.queueCount}>{queue.count}</span>
          {wait && (
            <span className={styles.queueWait}>
              {wait.lead}
              <SteadyText text={wait.text} widest={wait.widest} />
            </span>
          )}
        </span>
      )}
    </div>
  );
}
