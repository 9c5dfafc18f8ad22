import { describe, expect, it } from 'vitest';
import { buildLedger, type LedgerPunch } from '../ledger/ledger.js';
import type { BreakKind, PunchKind } from '../punches/punches.schema.js';
import { ledgerExceptions } from './ledger-exceptions.js';

const ledgerSettings = { concurrentSplit: 'even' as const, minimumMealMinutes: 30 };
const settings = { timeZone: 'UTC', longShiftHours: 14, ...ledgerSettings };
let serial = 0;
const punch = (kind: PunchKind, time: string, breakKind: BreakKind | null = null): LedgerPunch => ({
  id: `e${++serial}`,
  technicianId: 1,
  kind,
  jobLineId: null,
  breakKind,
  at: `2026-03-10T${time}:00Z`,
  supersedes: null,
});
const from = new Date('2026-03-08T00:00:00Z');
const to = new Date('2026-03-15T00:00:00Z');
const kinds = (punches: LedgerPunch[], now: string) =>
  ledgerExceptions(
    buildLedger(punches, new Date(now), ledgerSettings),
    from,
    to,
    new Date(now),
    settings,
  ).map((found) => found.kind);

describe(ledgerExceptions.name, () => {
  it('lists nothing for a clean day', () => {
    const day = [
      punch('shift-in', '07:00'),
      punch('break-start', '11:00', 'meal'),
      punch('break-end', '11:30'),
      punch('shift-out', '15:30'),
    ];
    expect(kinds(day, '2026-03-10T18:00:00Z')).toEqual([]);
  });

  // 29 CFR 785.19(a): a meal under 30 minutes is not bona fide; 785.18: rests run about 5 to 20 minutes.
  it('lists a short meal and a rest over 20 minutes', () => {
    const day = [
      punch('shift-in', '07:00'),
      punch('break-start', '09:00', 'rest'),
      punch('break-end', '09:25'),
      punch('break-start', '11:00', 'meal'),
      punch('break-end', '11:20'),
      punch('shift-out', '15:30'),
    ];
    const found = ledgerExceptions(
      buildLedger(day, new Date('2026-03-10T18:00:00Z'), ledgerSettings),
      from,
      to,
      new Date('2026-03-10T18:00:00Z'),
      settings,
    );
    expect(found.map((f) => [f.kind, f.key])).toEqual([
      ['long-rest', `long-rest:${day[1]!.id}`],
      ['short-meal', `short-meal:${day[3]!.id}`],
    ]);
    expect(found[1]!.text).toBe(
      "Meal break at Tue, Mar 10, 11:00 am lasted 20 min, under the shop's 30-minute minimum: counted as paid rest",
    );
  });

  it('names the shortest meal in force when the meal began, not one set after it', () => {
    const day = [
      punch('shift-in', '07:00'),
      punch('break-start', '11:00', 'meal'),
      punch('break-end', '11:20'),
      punch('shift-out', '15:30'),
    ];
    // 30 minutes until 1 pm that day, 15 since: the 20-minute meal fell under the 30-minute rule.
    const changed = {
      ...settings,
      minimumMealMinutes: 15,
      earlier: [{ ...ledgerSettings, until: Date.parse('2026-03-10T13:00:00Z') }],
    };
    const now = new Date('2026-03-10T18:00:00Z');
    const [found] = ledgerExceptions(buildLedger(day, now, changed), from, to, now, changed);
    expect(found?.text).toBe(
      "Meal break at Tue, Mar 10, 11:00 am lasted 20 min, under the shop's 30-minute minimum: counted as paid rest",
    );
  });

  it('gives a break left open for hours in hours and minutes', () => {
    const day = [punch('shift-in', '07:00'), punch('break-start', '08:47', 'rest')];
    const now = new Date('2026-03-10T19:00:00Z');
    const [found] = ledgerExceptions(buildLedger(day, now, ledgerSettings), from, to, now, settings);
    // 8:47 am to 7:00 pm is 10 h 13 min.
    expect(found?.text).toBe('Rest break from Tue, Mar 10, 8:47 am is still open after 10 h 13 min');
  });

  it('lists a break the shift-out closed, an open meal past 2 h and a shift open past the limit', () => {
    expect(
      kinds(
        [punch('shift-in', '07:00'), punch('break-start', '12:00', 'meal'), punch('shift-out', '15:00')],
        '2026-03-10T18:00:00Z',
      ),
    ).toEqual(['open-break']);
    expect(
      kinds([punch('shift-in', '07:00'), punch('break-start', '12:00', 'meal')], '2026-03-10T14:01:00Z'),
    ).toEqual(['open-break']);
    expect(
      kinds([punch('shift-in', '07:00'), punch('break-start', '12:00', 'meal')], '2026-03-10T13:59:00Z'),
    ).toEqual([]);
    expect(kinds([punch('shift-in', '07:00')], '2026-03-10T21:01:00Z')).toEqual(['open-shift']);
    expect(kinds([punch('shift-in', '07:00')], '2026-03-10T20:59:00Z')).toEqual([]);
  });
});
