import type { BoardPerson, BoardQueueItem } from '@baytime/shared';
import { secondsSince } from './server-clock';
import { formatSpan, widestSpanUntilHour } from './board-time';
import { MIN_TILE_SCALE, WALL_METRICS, type GridArea } from './wall-layout';

export interface PersonChip {
  id: number;
  name: string;
  detail: string;
  /**
   * The detail as wide as it can get while the person does the same thing and their span keeps its
   * shape (minutes, then hours): the strip packs its pages by it, so an idle time that ticks from "<1m"
   * to "59m", or on from "1h 05m", never changes how many pages it has.
   */
  widestDetail: string;
  status: BoardPerson['status'];
}

const ORDER: Record<BoardPerson['status'], number> = { idle: 0, 'on-break': 1, 'on-job': 2 };

/** People on shift, idle ones first (longest idle first): they are the ones a foreman looks for. */
export function personChips(people: readonly BoardPerson[], nowMs: number): PersonChip[] {
  return [...people]
    .sort((a, b) => ORDER[a.status] - ORDER[b.status] || Date.parse(a.since) - Date.parse(b.since))
    .map((person) => {
      const seconds = secondsSince(person.since, nowMs);
      const detail = (span: string) =>
        person.status === 'on-job'
          ? (person.bayName ?? person.jobLineTitle ?? 'on a job')
          : person.status === 'idle'
            ? `idle ${span}`
            : `break ${span}`;
      return {
        id: person.id,
        name: person.name,
        detail: detail(formatSpan(seconds)),
        widestDetail: detail(widestSpanUntilHour(seconds)),
        status: person.status,
      };
    });
}

export interface QueueSummary {
  count: number;
  oldestSeconds: number | null;
}

export function queueSummary(queue: readonly BoardQueueItem[], nowMs: number): QueueSummary {
  if (!queue.length) return { count: 0, oldestSeconds: null };
  const oldest = Math.min(...queue.map((item) => Date.parse(item.waitingSince)).filter(Number.isFinite));
  return {
    count: queue.length,
    oldestSeconds: Number.isFinite(oldest) ? Math.max(0, Math.floor((nowMs - oldest) / 1000)) : null,
  };
}

export interface QueueWait {
  /** What joins the wait to the count. */
  lead: string;
  text: string;
  /** The room the wait keeps, so the chips beside it hold still while it ticks. */
  widest: string;
}

/**
 * The oldest wait on the strip's queue note, "Queue 3 · 48m". Terse, and with the room of minutes alone
 * for its first hour: the note's width comes out of the chips' room, and " · oldest " with room for
 * "00h 00m" left the demo shop's strip at 1920 px one chip a page.
 */
export function queueWait(queue: QueueSummary): QueueWait | null {
  if (queue.oldestSeconds === null) return null;
  return {
    lead: ' · ',
    text: formatSpan(queue.oldestSeconds),
    widest: widestSpanUntilHour(queue.oldestSeconds),
  };
}

/** Packs measured widths into pages that fit `available`, keeping order; a too-wide item gets its own page. */
export function packPages(widths: readonly number[], available: number, gap: number): number[][] {
  const pages: number[][] = [];
  let current: number[] = [];
  let used = 0;
  widths.forEach((width, index) => {
    const need = current.length ? used + gap + width : width;
    if (current.length && need > available) {
      pages.push(current);
      current = [index];
      used = width;
    } else {
      current.push(index);
      used = need;
    }
  });
  if (current.length) pages.push(current);
  return pages;
}

/**
 * The strip's turns: every chip, or only `shown` ones (their indices among all chips), packed by the
 * widths measured for all of them.
 */
export function stripPages(
  widths: readonly number[],
  available: number,
  gap: number,
  shown?: readonly number[],
): number[][] {
  if (!shown) return packPages(widths, available, gap);
  return packPages(
    shown.map((index) => widths[index] ?? 0),
    available,
    gap,
  ).map((page) => page.map((at) => shown[at]!));
}

/**
 * Turns of the strip (five seconds each) beyond which the people also get pages of their own among the
 * bays' pages. A small shop's strip may take half a minute to show everyone, and keeps its bays on the
 * screen all the time; a big shop's would take minutes.
 */
export const MOST_STRIP_PAGES = 6;

/**
 * A person's row on a page of people, in board units at full text size: body text with room around
 * it, and a short name, a glyph and a bay or an idle time side by side.
 */
export const PERSON_ROW_UNITS = { height: 9.4, width: 60 } as const;

export interface PeopleLayout {
  columns: number;
  rows: number;
  perPage: number;
  pages: number;
  /** Share of the full text sizes, MIN_TILE_SCALE to 1, as on the tiles. */
  scale: number;
}

/**
 * Pages of people, filled column by column under a heading row: full-size text while everyone fits on
 * one page, else text at the tiles' smallest legible size, and as many pages as that still needs.
 */
export function peopleLayout(count: number, area: GridArea): PeopleLayout {
  const fit = (scale: number) => {
    const rows = Math.max(1, Math.floor(area.height / (PERSON_ROW_UNITS.height * scale)) - 1);
    const columns = Math.max(
      1,
      Math.floor((area.width + WALL_METRICS.gap) / (PERSON_ROW_UNITS.width * scale + WALL_METRICS.gap)),
    );
    return { rows, columns, scale };
  };
  const full = fit(1);
  const chosen = count <= full.rows * full.columns ? full : fit(MIN_TILE_SCALE);
  const pages = Math.max(1, Math.ceil(count / (chosen.rows * chosen.columns)));
  const perPage = Math.max(1, Math.ceil(count / pages));
  // Balanced columns: twenty people in three columns are 7, 7 and 6 deep, not 9, 9 and 2.
  return { ...chosen, rows: Math.min(chosen.rows, Math.ceil(perPage / chosen.columns)), perPage, pages };
}

/** "27 on shift: 8 idle, 4 on a break, 15 on jobs", the heading of a page of people. */
export function shiftCounts(people: readonly BoardPerson[]): string {
  const count = (status: BoardPerson['status']) => people.filter((person) => person.status === status).length;
  const onJobs = count('on-job');
  const parts = [
    [count('idle'), 'idle'],
    [count('on-break'), 'on a break'],
    [onJobs, onJobs === 1 ? 'on a job' : 'on jobs'],
  ] as const;
  const told = parts.filter(([n]) => n > 0).map(([n, words]) => `${n} ${words}`);
  return `${people.length} on shift${told.length ? `: ${told.join(', ')}` : ''}`;
}
