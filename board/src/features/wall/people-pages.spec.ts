import { describe, expect, it } from 'vitest';
import type { BoardPerson } from '@baytime/shared';
import {
  packPages,
  peopleLayout,
  personChips,
  queueSummary,
  queueWait,
  shiftCounts,
  stripPages,
} from './people-pages';
import { defaultGridArea, unitPx } from './wall-layout';

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

  it('keeps room for the longest idle or break time of the hour, then for any longer time, and names the bay of one on a job', () => {
    const people = [
      person(1, 'idle', '2026-03-02T14:59:40Z'),
      person(2, 'on-break', '2026-03-02T14:59:40Z'),
      person(3, 'on-job', '2026-03-02T14:00:00Z', 'Bay 2'),
    ];
    const widest = (minutes: number) =>
      personChips(people, now + minutes * 60_000).map((chip) => chip.widestDetail);
    const first = widest(0);
    expect(first).toEqual(['idle 00m', 'break 00m', 'Bay 2']);
    const later = widest(60);
    expect(later).toEqual(['idle 00h 00m', 'break 00h 00m', 'Bay 2']);
    for (let minutes = 0; minutes < 99 * 24 * 60; minutes += 53) {
      const chips = personChips(people, now + minutes * 60_000);
      // Twenty seconds in at the start: the hour turns 59m 40s later.
      expect(chips.map((chip) => chip.widestDetail)).toEqual(minutes < 59 ? first : later);
      // The wall's digits are all one width: a detail no longer than its widest is no wider.
      for (const chip of chips) expect(chip.detail.length).toBeLessThanOrEqual(chip.widestDetail.length);
    }
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
    expect(queueSummary([], now)).toEqual({ count: 0, oldestSeconds: null });
    expect(queueSummary([item(1, '2026-03-02T14:30:00Z'), item(2, '2026-03-02T13:00:00Z')], now)).toEqual({
      count: 2,
      oldestSeconds: 7200,
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

describe(stripPages.name, () => {
  it('packs only the chips shown, by their own widths, and names them by their place among all', () => {
    const widths = [40, 40, 40, 90, 10];
    expect(stripPages(widths, 100, 5)).toEqual(packPages(widths, 100, 5));
    // 40 + 5 + 40 + 5 + 10: the three shown fit one turn, where all five took four.
    expect(stripPages(widths, 100, 5, [0, 2, 4])).toEqual([[0, 2, 4]]);
    expect(stripPages(widths, 100, 5, [3, 4])).toEqual([[3], [4]]);
    expect(stripPages(widths, 100, 5, [])).toEqual([]);
  });

  it('packs the same people into the same pages through each one’s first hour, and through the rest of the day', () => {
    const people = [
      person(1, 'idle', '2026-03-02T14:59:30Z'),
      person(2, 'idle', '2026-03-02T14:50:00Z'),
      person(3, 'on-break', '2026-03-02T14:58:00Z'),
      person(4, 'idle', '2026-03-02T14:59:50Z'),
      person(5, 'on-job', '2026-03-02T14:00:00Z', 'Bay 2'),
    ];
    // A chip's width from its characters, as the strip measures it at the width it packs by.
    const widths = (nowMs: number) =>
      personChips(people, nowMs).map((chip) => 4 + 2 * (chip.name.length + chip.widestDetail.length));
    const packed = (nowMs: number) => stripPages(widths(nowMs), 70, 1);
    const first = packed(now);
    expect(first.length).toBeGreaterThan(1);
    // Person 2 turns an hour idle 50 minutes in, the last of them 60 minutes in.
    for (let minutes = 1; minutes < 50; minutes += 7) expect(packed(now + minutes * 60_000)).toEqual(first);
    const afterHour = packed(now + 61 * 60_000);
    for (let minutes = 61; minutes < 12 * 60; minutes += 7)
      expect(packed(now + minutes * 60_000)).toEqual(afterHour);
  });

  it('puts two chips on a page of the demo shop’s strip at 1920 × 1080, beside its queue note, while their idle times are minutes', () => {
    // Measured in chromium on the demo wall at 1920 × 1080 (Barlow Semi Condensed): the strip is 1903 px, its
    // page mark "6/6" 115.8 px, its gaps 10.8 px; the queue note is as wide as its widest wait. Sam O. and Jo W.
    // idle 36m and 30m, Marcus L. idle 12m, Priya C. on a break 20m, Luis B. and Dana O. on jobs; the queue's
    // oldest line has waited 48m.
    const measured: Record<string, number> = {
      'Sam O. idle 00m': 592,
      'Sam O. idle 00h 00m': 706,
      'Jo W. idle 00m': 548,
      'Jo W. idle 00h 00m': 662,
      'Marcus L. idle 00m': 679,
      'Marcus L. idle 00h 00m': 794,
      'Priya C. break 00m': 662,
      'Priya C. break 00h 00m': 776,
      'Luis B. Bay 2': 494,
      'Dana O. Bay 1': 521,
      'Queue 3 · oldest 00h 00m': 874.8,
      'Queue 3 · oldest 00m': 740.8,
      'Queue 3 · 00h 00m': 664.9,
      'Queue 3 · 00m': 530.9,
    };
    const demo: BoardPerson[] = [
      { ...person(1, 'idle', '2026-03-02T14:24:00Z'), name: 'Sam O.' },
      { ...person(2, 'idle', '2026-03-02T14:30:00Z'), name: 'Jo W.' },
      { ...person(3, 'idle', '2026-03-02T14:48:00Z'), name: 'Marcus L.' },
      { ...person(4, 'on-break', '2026-03-02T14:40:00Z'), name: 'Priya C.' },
      { ...person(5, 'on-job', '2026-03-02T13:00:00Z', 'Bay 2'), name: 'Luis B.' },
      { ...person(6, 'on-job', '2026-03-02T13:10:00Z', 'Bay 1'), name: 'Dana O.' },
    ];
    const wait = queueWait({ count: 3, oldestSeconds: 48 * 60 })!;
    const gap = 10.8;
    const room = 1903 - measured[`Queue 3${wait.lead}${wait.widest}`]! - gap - 115.8 - gap;
    const widths = personChips(demo, now).map((chip) => measured[`${chip.name} ${chip.widestDetail}`]!);
    expect(stripPages(widths, room, gap)).toEqual([[0, 1], [2], [3, 4], [5]]);
  });
});

describe(queueWait.name, () => {
  it('tells the oldest wait, keeping the room of minutes alone for its first hour, then of any span', () => {
    expect(queueWait({ count: 0, oldestSeconds: null })).toBeNull();
    expect(queueWait({ count: 3, oldestSeconds: 48 * 60 })).toEqual({
      lead: ' · ',
      text: '48m',
      widest: '00m',
    });
    expect(queueWait({ count: 3, oldestSeconds: 65 * 60 })).toEqual({
      lead: ' · ',
      text: '1h 05m',
      widest: '00h 00m',
    });
  });
});

describe(peopleLayout.name, () => {
  const fullHd = { width: 1920, height: 1080 };
  const area = defaultGridArea(fullHd);
  /** Cap height in CSS px of body text at a scale: Barlow's caps are 0.7 em, body text is 7.4 units. */
  const capsPx = (scale: number) => 7.4 * scale * 0.7 * unitPx(fullHd);

  it('puts a dozen people on one page at full size', () => {
    expect(peopleLayout(12, area)).toEqual({ columns: 2, rows: 6, perPage: 12, pages: 1, scale: 1 });
  });

  it('puts 27 people on one page at the smallest legible size', () => {
    const layout = peopleLayout(27, area);
    expect(layout).toMatchObject({ columns: 3, rows: 9, perPage: 27, pages: 1 });
    // DISPLAY.md: text on the wall never below 44 px caps at 1080p (16 arcminutes at 6 m).
    expect(capsPx(layout.scale)).toBeGreaterThanOrEqual(44);
  });

  it('balances 40 people over two pages of 20, in columns of 7, 7 and 6', () => {
    expect(peopleLayout(40, area)).toMatchObject({ columns: 3, rows: 7, perPage: 20, pages: 2 });
  });

  it('has a place for everyone on every page, whatever the count', () => {
    for (let count = 0; count <= 150; count++) {
      const { columns, rows, perPage, pages } = peopleLayout(count, area);
      expect(pages * perPage).toBeGreaterThanOrEqual(count);
      expect(columns * rows).toBeGreaterThanOrEqual(perPage);
    }
  });
});

describe(shiftCounts.name, () => {
  it('counts the people on shift by what they are doing, leaving out what nobody does', () => {
    expect(
      shiftCounts([
        person(1, 'on-job', '2026-03-02T14:00:00Z', 'Bay 2'),
        person(2, 'idle', '2026-03-02T14:50:00Z'),
        person(3, 'on-job', '2026-03-02T14:55:00Z', 'Bay 3'),
      ]),
    ).toBe('3 on shift: 1 idle, 2 on jobs');
    expect(shiftCounts([person(1, 'on-break', '2026-03-02T14:00:00Z')])).toBe('1 on shift: 1 on a break');
    expect(shiftCounts([])).toBe('0 on shift');
  });
});
