import type { BoardPerson, BoardQueueItem } from '@baytime/shared';
import { secondsSince } from './server-clock';
import { formatSpan } from './board-time';

export interface PersonChip {
  id: number;
  name: string;
  detail: string;
  status: BoardPerson['status'];
}

const ORDER: Record<BoardPerson['status'], number> = { idle: 0, 'on-break': 1, 'on-job': 2 };

/** People on shift, idle ones first (longest idle first): they are the ones a foreman looks for. */
export function personChips(people: readonly BoardPerson[], nowMs: number): PersonChip[] {
  return [...people]
    .sort((a, b) => ORDER[a.status] - ORDER[b.status] || Date.parse(a.since) - Date.parse(b.since))
    .map((person) => {
      const span = formatSpan(secondsSince(person.since, nowMs));
      const detail =
        person.status === 'on-job'
          ? (person.bayName ?? person.jobLineTitle ?? 'on a job')
          : person.status === 'idle'
            ? `idle ${span}`
            : `break ${span}`;
      return { id: person.id, name: person.name, detail, status: person.status };
    });
}

export interface QueueSummary {
  count: number;
  oldestSeconds: number | null;
  /** Open lines forecast to miss their promised time. */
  late: number;
}

export function queueSummary(queue: readonly BoardQueueItem[], nowMs: number, late = 0): QueueSummary {
  if (!queue.length) return { count: 0, oldestSeconds: null, late };
  const oldest = Math.min(...queue.map((item) => Date.parse(item.waitingSince)).filter(Number.isFinite));
  return {
    count: queue.length,
    oldestSeconds: Number.isFinite(oldest) ? Math.max(0, Math.floor((nowMs - oldest) / 1000)) : null,
    late,
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
