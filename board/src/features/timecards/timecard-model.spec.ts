import { describe, expect, it } from 'vitest';
import type { Timecard, TimecardPunch } from '@baytime/shared';
import {
  assignLanes,
  cardDays,
  jobLineChoices,
  overlappedJobSeconds,
  punchRows,
  sharedCredit,
  timelineSegments,
  timelineWindow,
  workdayBounds,
} from './timecard-model';

const zero = {
  attendanceSeconds: 0,
  clockedSeconds: 0,
  idleSeconds: 0,
  mealBreakSeconds: 0,
  restBreakSeconds: 0,
};
const days = [
  '2026-11-29',
  '2026-11-30',
  '2026-12-01',
  '2026-12-02',
  '2026-12-03',
  '2026-12-04',
  '2026-12-05',
];

function punch(
  id: string,
  kind: TimecardPunch['kind'],
  at: string,
  extra: Partial<TimecardPunch> = {},
): TimecardPunch {
  return {
    id,
    technicianId: 4,
    kind,
    jobLineId: null,
    breakKind: null,
    at,
    recordedAt: at,
    recordedBy: 4,
    supersedes: null,
    reason: null,
    voids: false,
    supersededBy: null,
    recordedByName: 'Dana Okafor',
    ...extra,
  };
}

/** A Sunday-start week in Chicago (UTC−6 in winter): Monday 7:25 AM is 13:25Z. */
function card(overrides: Partial<Timecard> = {}): Timecard {
  return {
    technician: { id: 4, name: 'Dana Okafor' },
    week: '2026-W48',
    weekName: 'Week of Sun, Nov 29',
    from: '2026-11-29T06:00:00.000Z',
    to: '2026-12-06T06:00:00.000Z',
    timeZone: 'America/Chicago',
    punches: [
      punch('a', 'shift-in', '2026-11-30T13:25:00Z', { supersededBy: 'c' }),
      punch('b', 'job-on', '2026-11-30T13:40:00Z', { jobLineId: 97 }),
      punch('c', 'shift-in', '2026-11-30T13:20:00Z', {
        supersedes: 'a',
        reason: 'Forgot to badge at the door',
        recordedBy: 2,
        recordedByName: 'Theo Varga',
        recordedAt: '2026-12-01T15:00:00Z',
      }),
      // Tuesday 11:30 PM local is Wednesday 05:30Z: it belongs to Tuesday's workday.
      punch('d', 'shift-out', '2026-12-02T05:30:00Z'),
      punch('e', 'job-off', '2026-12-02T05:31:00Z', { jobLineId: 55 }),
    ],
    shifts: [{ from: '2026-11-30T13:20:00Z', to: '2026-12-02T05:30:00Z', open: false }],
    breaks: [{ from: '2026-11-30T18:00:00Z', to: '2026-11-30T18:30:00Z', open: false, kind: 'meal' }],
    jobs: [
      {
        from: '2026-11-30T13:40:00Z',
        to: '2026-11-30T16:05:00Z',
        open: false,
        jobLineId: 97,
        title: 'Battery test',
        repairOrderNumber: '4497',
        seconds: 8700,
        // 15:00–16:05 shared with line 98 and split evenly: 8,700 − 3,900 / 2.
        countedSeconds: 6750,
      },
      {
        from: '2026-11-30T15:00:00Z',
        to: '2026-11-30T17:00:00Z',
        open: false,
        jobLineId: 98,
        title: 'Thermostat',
        repairOrderNumber: '4498',
        seconds: 7200,
        countedSeconds: 5250,
      },
    ],
    lines: [
      { jobLineId: 97, title: 'Battery test', repairOrderNumber: '4497' },
      { jobLineId: 98, title: 'Thermostat', repairOrderNumber: '4498' },
      { jobLineId: 55, title: 'Wiper blades', repairOrderNumber: '4455' },
    ],
    days: days.map((day) => ({ day, ...zero })),
    totals: zero,
    anomalies: [{ punchId: 'e', reason: 'You are not clocked on that line' }],
    flags: [],
    audit: [],
    held: [],
    exceptions: [],
    closed: false,
    summary: {
      labour: {
        attendanceHours: 0,
        clockedHours: 0,
        flaggedHours: 0,
        matchedClockedHours: 0,
        workInProgressHours: 0,
        productivity: null,
        efficiency: null,
        proficiency: null,
      },
      pay: null,
      closed: false,
      caution: 'An estimate',
    },
    ...overrides,
  };
}

describe('timecard model', () => {
  it('splits the week at the start hour of each local day', () => {
    const bounds = workdayBounds(card());
    expect(bounds).toHaveLength(7);
    expect(bounds[1]!.from.toISOString()).toBe('2026-11-30T06:00:00.000Z');
    expect(bounds[6]!.to.toISOString()).toBe('2026-12-06T06:00:00.000Z');
  });

  it('links a correction with the punch it replaced and keeps both', () => {
    const rows = punchRows(card());
    const original = rows.find((row) => row.punch.id === 'a')!;
    const correction = rows.find((row) => row.punch.id === 'c')!;
    expect(original.replacedBy?.id).toBe('c');
    expect(original.correction).toBe(false);
    expect(correction.replaces?.id).toBe('a');
    expect(correction.correction).toBe(true);
    // In time order: the corrected 7:20 before the original 7:25.
    expect(rows.map((row) => row.punch.id)).toEqual(['c', 'a', 'b', 'd', 'e']);
  });

  it('shows a punch taken out of the count on that punch, not the voiding row as a punch of its own', () => {
    const base = card();
    const rows = punchRows(
      card({
        punches: [
          ...base.punches.map((p) => (p.id === 'b' ? { ...p, supersededBy: 'v' } : p)),
          punch('v', 'job-on', base.punches.find((p) => p.id === 'b')!.at, {
            supersedes: 'b',
            voids: true,
            reason: 'Displaced by a late punch the office accepted',
          }),
        ],
      }),
    );
    expect(rows.map((row) => row.punch.id)).toEqual(['c', 'a', 'b', 'd', 'e']);
    expect(rows.find((row) => row.punch.id === 'b')!.replacedBy).toMatchObject({ id: 'v', voids: true });
  });

  it('names job lines, a punch out of the count’s too, and says why a punch was not counted', () => {
    const rows = punchRows(card());
    expect(rows.find((row) => row.punch.id === 'b')!.job).toBe('RO 4497 · Battery test');
    const stray = rows.find((row) => row.punch.id === 'e')!;
    expect(stray.job).toBe('RO 4455 · Wiper blades');
    expect(stray.notCounted).toBe('You are not clocked on that line');
  });

  it('lists punches at one instant in the order the day runs: a clock-off before the clock-on it made', () => {
    const at = '2026-12-03T16:23:00Z';
    const rows = punchRows(
      card({
        punches: [
          punch('on', 'job-on', at, { jobLineId: 98 }),
          punch('off', 'job-off', at, { jobLineId: 97 }),
        ],
      }),
    );
    expect(rows.map((row) => row.punch.id)).toEqual(['off', 'on']);
  });

  it('puts punches on the workday they happened in the shop’s time zone', () => {
    const week = cardDays(card());
    expect(week[0]!.active).toBe(false);
    expect(week[1]!.punches.map((row) => row.punch.id)).toEqual(['c', 'a', 'b']);
    expect(week[2]!.punches.map((row) => row.punch.id)).toEqual(['d', 'e']);
    // The long shift starts Monday and is drawn across Monday and Tuesday.
    expect(week[1]!.intervals.filter((i) => i.kind === 'shift')).toHaveLength(1);
    expect(week[2]!.intervals.filter((i) => i.kind === 'shift')).toHaveLength(0);
    expect(week[2]!.covering.find((i) => i.kind === 'shift')!.from.toISOString()).toBe(
      '2026-12-01T06:00:00.000Z',
    );
  });

  it('gives each job shared with another line the credit the split rule gave it', () => {
    const monday = cardDays(card())[1]!;
    const jobs = monday.intervals.filter((i) => i.kind === 'job');
    expect(jobs.map((job) => sharedCredit(job))).toEqual([
      { seconds: 8700, counted: 6750 },
      { seconds: 7200, counted: 5250 },
    ]);
    expect(sharedCredit({ credit: { seconds: 7200, counted: 7200 } })).toBeNull();
    // Ten seconds off two hours reads "2.0 h" either way; 40 s of a minute does not read as the minute.
    expect(sharedCredit({ credit: { seconds: 7200, counted: 7190 } })).toBeNull();
    expect(sharedCredit({ credit: { seconds: 60, counted: 40 } })).toEqual({ seconds: 60, counted: 40 });
    expect(sharedCredit({ credit: null })).toBeNull();
  });

  it('puts overlapping jobs on separate tracks', () => {
    const at = (h: number) => new Date(Date.UTC(2026, 0, 1, h));
    const lanes = assignLanes([
      { from: at(8), to: at(10) },
      { from: at(9), to: at(11) },
      { from: at(10), to: at(12) },
    ]).map((item) => item.lane);
    expect(lanes).toEqual([0, 1, 0]);
  });

  it('draws every day on one hour-aligned axis', () => {
    const week = cardDays(card());
    const window = timelineWindow(week);
    // Monday 7:20 AM to Tuesday midnight-crossing shift: the axis runs to the end of the workday.
    expect(window.startMinute).toBe(0);
    expect(window.endMinute).toBe(24 * 60);
    const monday = timelineSegments(week[1]!, { startMinute: 7 * 60, endMinute: 17 * 60 });
    const meal = monday.find((segment) => segment.kind === 'meal')!;
    // 12:00–12:30 local on a 7:00–17:00 axis: 50 % in, 5 % wide.
    expect(meal.left).toBeCloseTo(50);
    expect(meal.width).toBeCloseTo(5);
    const shift = monday.find((segment) => segment.kind === 'shift')!;
    expect(shift.left + shift.width).toBeCloseTo(100);
  });

  it('widens a short day to at least eight hours', () => {
    const short = card({
      punches: [],
      shifts: [{ from: '2026-11-30T15:00:00Z', to: '2026-11-30T17:00:00Z', open: false }],
      breaks: [],
      jobs: [],
    });
    const window = timelineWindow(cardDays(short));
    expect(window.endMinute - window.startMinute).toBe(8 * 60);
    expect(window.startMinute).toBeLessThanOrEqual(9 * 60);
    expect(window.endMinute).toBeGreaterThanOrEqual(11 * 60);
  });

  it('offers the card’s lines first, then open lines, each once', () => {
    const choices = jobLineChoices(card(), [
      { jobLineId: 98, label: 'RO 4498 · Thermostat' },
      { jobLineId: 120, label: 'RO 4510 · Brake pads' },
    ]);
    expect(choices.map((choice) => choice.jobLineId)).toEqual([97, 98, 55, 120]);
  });

  it('counts how long a day’s jobs ran at the same time, which "On jobs" counts once', () => {
    const job = (from: string, to: string, jobLineId: number) => ({
      kind: 'job' as const,
      from: new Date(from),
      to: new Date(to),
      open: false,
      label: null,
      jobLineId,
      lane: 0,
      credit: null,
    });
    // Clocked on one line 9:00–11:00 and another 10:00–12:00: three hours on jobs, one of them on both.
    const covering = [
      job('2026-12-04T15:00:00Z', '2026-12-04T17:00:00Z', 254),
      job('2026-12-04T16:00:00Z', '2026-12-04T18:00:00Z', 255),
    ];
    const totals = { ...zero, clockedSeconds: 3 * 3600 };
    expect(overlappedJobSeconds({ covering, totals })).toBe(3600);
    expect(
      overlappedJobSeconds({ covering: covering.slice(0, 1), totals: { ...zero, clockedSeconds: 7200 } }),
    ).toBe(0);
  });
});
