import { describe, expect, it } from 'vitest';
import type { BoardPerson } from '@baytime/shared';
import { packPages, personChips, queueSummary } from './people-pages';

const now = Date.parse('2026-03-02T15:00:00Z');
const person = (
  id: number,
  status: BoardPerson['status'],
  since: string,
  bayName: string | null = null,
): BoardPerson => ({
  id,
  name: `P${id}`,
  status,
  since,
  bayName,
  jobLineTitle: null,
});

describe(personChips.name, () => {
  it('lists idle people first, longest idle first, then breaks, then people on jobs', () => {
    const chips = personChips(
      [
        person(1, 'on-job', '2026-03-02T14:00:00Z', 'Bay 2'),
        person(2, 'idle', '2026-03-02T14:50:00Z'),
        person(3, 'on-break', '2026-03-02T14:55:00Z'),
        person(4, 'idle', '2026-03-02T14:20:00Z'),
      ],
      now,
    );
    expect(chips.map((chip) => `${chip.name} ${chip.detail}`)).toEqual([
      'P4 idle 40m',
      'P2 idle 10m',
      'P3 break 5m',
      'P1 Bay 2',
    ]);
  });
});

describe(queueSummary.name, () => {
  it('counts the queue and finds the oldest wait', () => {
    const item = (id: number, waitingSince: string) => ({
      jobLineId: id,
      repairOrderNumber: '1',
      title: 't',
      priority: 'normal' as const,
      waitingSince,
    });
    expect(queueSummary([], now)).toEqual({ count: 0, oldestSeconds: null, late: 0 });
    expect(queueSummary([item(1, '2026-03-02T14:30:00Z'), item(2, '2026-03-02T13:00:00Z')], now, 3)).toEqual({
      count: 2,
      oldestSeconds: 7200,
      late: 3,
    });
  });
});

describe(packPages.name, () => {
  it('fills each page in order and starts a new one when the next item does not fit', () => {
    expect(packPages([40, 40, 40, 90, 10], 100, 5)).toEqual([[0, 1], [2], [3], [4]]);
    expect(packPages([30, 30, 30], 100, 5)).toEqual([[0, 1, 2]]);
    expect(packPages([], 100, 5)).toEqual([]);
  });
});
