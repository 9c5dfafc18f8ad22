import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { PUNCH_KINDS, type BreakKind, type PunchKind } from '../punches/punches.schema.js';
import { shopLocalInstant } from '../time/workweek.js';
import {
  buildLedger,
  impliedJobOffs,
  jobOffsFor,
  jobOffsWith,
  punchImpact,
  PUNCH_REFUSALS,
  technicianState,
  type Ledger,
  type LedgerPunch,
  type LedgerSettings,
} from './ledger.js';

const even: LedgerSettings = { concurrentSplit: 'even', minimumMealMinutes: 30 };
const at = (hhmm: string) => `2026-03-10T${hhmm}:00Z`;
const hours = (seconds: number) => seconds / 3600;
let counter = 0;
function punch(kind: PunchKind, time: string, extra: Partial<LedgerPunch> = {}): LedgerPunch {
  const needsLine = kind === 'job-on' || kind === 'job-off';
  return {
    id: `p${String(++counter).padStart(4, '0')}`,
    technicianId: 7,
    kind,
    jobLineId: needsLine ? 1 : null,
    breakKind: kind === 'break-start' ? 'meal' : null,
    at: time.length === 5 ? at(time) : time,
    supersedes: null,
    ...extra,
  };
}
const on = (line: number, time: string) => punch('job-on', time, { jobLineId: line });
const off = (line: number, time: string) => punch('job-off', time, { jobLineId: line });
const pause = (kind: BreakKind, time: string) => punch('break-start', time, { breakKind: kind });

/** Lines 1 and 2 open together from 10:00 to 11:00. */
const overlap = [
  punch('shift-in', '08:00'),
  on(1, '09:00'),
  on(2, '10:00'),
  off(1, '11:00'),
  off(2, '12:00'),
  punch('shift-out', '12:00'),
];

describe(buildLedger.name, () => {
  const day = [
    punch('shift-in', '08:00'),
    on(1, '08:15'),
    pause('rest', '10:00'),
    punch('break-end', '10:15'),
    on(2, '10:15'),
    pause('meal', '12:00'),
    punch('break-end', '12:30'),
    on(1, '12:30'),
    off(1, '16:00'),
    punch('shift-out', '17:00'),
  ];
  const ledger = buildLedger(day, new Date(at('18:00')), even);

  it('turns a day of punches into intervals', () => {
    expect(ledger.shifts).toEqual([
      { from: new Date(at('08:00')), to: new Date(at('17:00')), open: false, startPunchId: day[0]!.id },
    ]);
    expect(ledger.breaks).toEqual([
      {
        kind: 'rest',
        declared: 'rest',
        endedBy: 'break-end',
        from: new Date(at('10:00')),
        to: new Date(at('10:15')),
        open: false,
        startPunchId: day[2]!.id,
      },
      {
        kind: 'meal',
        declared: 'meal',
        endedBy: 'break-end',
        from: new Date(at('12:00')),
        to: new Date(at('12:30')),
        open: false,
        startPunchId: day[5]!.id,
      },
    ]);
    expect(ledger.jobs.map((j) => j.jobLineId)).toEqual([1, 2, 1]);
    expect(ledger.anomalies).toEqual([]);
  });

  // 29 CFR 785.18 (text checked in a DOL archive copy): rest periods of 5 to about 20 minutes are hours
  // worked. 29 CFR 785.19 (from memory, matched by a secondary summary): a bona fide meal period is not.
  it('counts rest breaks as attendance and meal breaks not', () => {
    expect(hours(ledger.totals.attendanceSeconds)).toBe(8.5);
    expect(hours(ledger.totals.restBreakSeconds)).toBe(0.25);
    expect(hours(ledger.totals.mealBreakSeconds)).toBe(0.5);
  });

  describe('breaks classified by length as well as by button', () => {
    // 29 CFR 785.19(a) (text checked in the eCFR): a bona fide meal period is ordinarily 30 minutes or more,
    // and coffee or snack breaks are not meal periods; 785.18: rest periods of 5 to about 20 minutes are
    // hours worked. The example: shift 07:00–15:30 with a "meal" 11:00–11:20 → 8.5 h, not 8.17 h.
    it('counts a 20-minute "meal" as paid rest: 8.5 h worked', () => {
      const shift = [
        punch('shift-in', '07:00'),
        pause('meal', '11:00'),
        punch('break-end', '11:20'),
        punch('shift-out', '15:30'),
      ];
      const result = buildLedger(shift, new Date(at('16:00')), even);
      expect(hours(result.totals.attendanceSeconds)).toBe(8.5);
      expect(result.totals.mealBreakSeconds).toBe(0);
      expect(result.totals.restBreakSeconds).toBe(20 * 60);
      expect(result.breaks[0]).toMatchObject({ kind: 'rest', declared: 'meal' });
    });

    // 8.5 h shift less a 30-minute bona fide meal = 8 h (785.19(a): 30 minutes ordinarily long enough).
    it('keeps a meal of the minimum length unpaid, and follows the shop minimum', () => {
      const shift = [
        punch('shift-in', '07:00'),
        pause('meal', '11:00'),
        punch('break-end', '11:30'),
        punch('shift-out', '15:30'),
      ];
      expect(hours(buildLedger(shift, new Date(at('16:00')), even).totals.attendanceSeconds)).toBe(8);
      const stricter = { ...even, minimumMealMinutes: 45 };
      expect(hours(buildLedger(shift, new Date(at('16:00')), stricter).totals.attendanceSeconds)).toBe(8.5);
    });

    it('never counts a break of no stated kind as unpaid', () => {
      const shift = [
        punch('shift-in', '07:00'),
        punch('break-start', '11:00', { breakKind: null }),
        punch('break-end', '11:45'),
        punch('shift-out', '15:00'),
      ];
      const result = buildLedger(shift, new Date(at('16:00')), even);
      expect(hours(result.totals.attendanceSeconds)).toBe(8);
      expect(result.breaks[0]).toMatchObject({ kind: 'rest', declared: null });
    });

    it('counts an open meal as a meal so far', () => {
      const result = buildLedger(
        [punch('shift-in', '07:00'), pause('meal', '11:00')],
        new Date(at('11:10')),
        even,
      );
      expect(result.breaks[0]).toMatchObject({ kind: 'meal', open: true, endedBy: null });
      expect(hours(result.totals.attendanceSeconds)).toBe(4);
    });
  });

  it('drops a punch voided by a later row, and the voiding row stands for nothing', () => {
    const shiftIn = punch('shift-in', '08:00');
    const stray = punch('shift-out', '09:00');
    const voided = punch('shift-out', '09:00', { supersedes: stray.id, voids: true });
    const result = buildLedger(
      [shiftIn, stray, voided, punch('shift-out', '12:00')],
      new Date(at('13:00')),
      even,
    );
    expect(result.anomalies).toEqual([]);
    expect(hours(result.totals.attendanceSeconds)).toBe(4);
  });

  it('counts clocked time per line and idle time on shift', () => {
    expect(hours(ledger.totals.clockedSeconds)).toBe(7);
    expect(ledger.totals.jobSeconds).toEqual({ 1: 5.25 * 3600, 2: 1.75 * 3600 });
    expect(hours(ledger.totals.idleSeconds)).toBe(1.5);
  });

  describe('concurrent job lines', () => {
    it("splits overlapping time evenly under 'even'", () => {
      const totals = buildLedger(overlap, new Date(at('12:00')), even).totals;
      expect(totals.jobSeconds).toEqual({ 1: 1.5 * 3600, 2: 1.5 * 3600 });
      expect(hours(totals.clockedSeconds)).toBe(3);
    });

    it("gives each line the full time under 'full' but counts wall time once", () => {
      const totals = buildLedger(overlap, new Date(at('12:00')), { ...even, concurrentSplit: 'full' }).totals;
      expect(totals.jobSeconds).toEqual({ 1: 2 * 3600, 2: 2 * 3600 });
      expect(hours(totals.clockedSeconds)).toBe(3);
      expect(hours(totals.idleSeconds)).toBe(1);
    });

    it('reads two open lines as two, whatever the jobs-at-once limit: the limit is kept when punching', () => {
      const result = buildLedger(overlap.slice(0, 3), new Date(at('11:00')), even);
      expect(result.jobs.map((j) => [j.jobLineId, j.open])).toEqual([
        [1, true],
        [2, true],
      ]);
    });
  });
});

describe('rules that changed', () => {
  // The shop counted a full hour on each line until 10:30, and splits evenly from then on.
  const changed: LedgerSettings = {
    ...even,
    earlier: [{ concurrentSplit: 'full', minimumMealMinutes: 15, until: Date.parse(at('10:30')) }],
  };

  it('counts time on several lines under the split rule of its moment', () => {
    // By hand: line 1 has 09:00–10:00 alone, 10:00–10:30 in full and 10:30–11:00 halved: 1.75 h; line 2 the same
    // mirrored. The wall time clocked is 3 h either way.
    const totals = buildLedger(overlap, new Date(at('12:00')), changed).totals;
    expect(totals.jobSeconds).toEqual({ 1: 1.75 * 3600, 2: 1.75 * 3600 });
    expect(hours(totals.clockedSeconds)).toBe(3);
  });

  it('judges a meal by the shortest bona fide meal of the moment it began', () => {
    const day = [
      punch('shift-in', '08:00'),
      pause('meal', '10:00'),
      punch('break-end', '10:20'),
      pause('meal', '12:00'),
      punch('break-end', '12:20'),
      punch('shift-out', '13:00'),
    ];
    const ledger = buildLedger(day, new Date(at('13:00')), changed);
    expect(ledger.breaks.map((b) => b.kind)).toEqual(['meal', 'rest']);
  });
});

describe(jobOffsFor.name, () => {
  const onOne = [punch('shift-in', '08:00'), on(1, '09:00')];

  it('closes the open line at the same instant when only one may be open', () => {
    const next = on(2, '10:00');
    expect(jobOffsFor(onOne, next, 1)).toEqual([{ jobLineId: 1, at: at('10:00'), causedBy: next.id }]);
    expect(jobOffsFor(onOne, next, 2)).toEqual([]);
  });

  it('closes the oldest lines down to the limit, a lowered limit included', () => {
    const three = [...onOne, on(2, '09:30'), on(3, '09:45')];
    const next = on(4, '10:00');
    expect(jobOffsFor(three, next, 3).map((o) => o.jobLineId)).toEqual([1]);
    expect(jobOffsFor(three, next, 1).map((o) => o.jobLineId)).toEqual([1, 2, 3]);
  });

  it('judges a late clock-on by the lines open where it falls, not by the latest ones', () => {
    const day = [...onOne, off(1, '11:00'), on(2, '12:00')];
    expect(jobOffsFor(day, on(3, '10:00'), 1).map((o) => [o.jobLineId, o.at])).toEqual([[1, at('10:00')]]);
    expect(jobOffsFor(day, on(3, '11:30'), 1)).toEqual([]);
  });

  it('implies none for any other punch, or a clock-on that does not fit', () => {
    expect(jobOffsFor(onOne, off(1, '10:00'), 1)).toEqual([]);
    expect(jobOffsFor([...onOne, pause('rest', '09:30')], on(2, '10:00'), 1)).toEqual([]);
  });
});

describe(jobOffsWith.name, () => {
  // On line 1 from 9:00, switched to line 2 at 10:00 with one job at a time (line 1's job-off on record).
  const switched = () => [punch('shift-in', '08:00'), on(1, '09:00'), on(2, '10:00'), off(1, '10:00')];

  it('closes a clock-on added in the past where the next clock-on on record closed the lines open then', () => {
    const day = switched();
    const added = on(3, '09:30');
    const offs = jobOffsWith(day, added, () => 1);
    expect(offs.map((o) => [o.jobLineId, o.at, o.causedBy])).toEqual([
      [1, at('09:30'), added.id],
      [3, at('10:00'), day[2]!.id],
    ]);
  });

  it('holds each later clock-on to the limit of its own moment', () => {
    // Two at a time until 9:45, one after: the 10:00 switch closes line 3 too; at two throughout, nothing.
    const limitAt = (instant: Date) => (instant.getTime() < Date.parse(at('09:45')) ? 2 : 1);
    const day = switched();
    expect(jobOffsWith(day, on(3, '09:30'), limitAt).map((o) => [o.jobLineId, o.at])).toEqual([
      [3, at('10:00')],
    ]);
    expect(jobOffsWith(day, on(3, '09:30'), () => 2)).toEqual([]);
  });
});

describe(impliedJobOffs.name, () => {
  it('finds each job-off the old reading implied, and none once they are on record', () => {
    const switches = [punch('shift-in', '08:00'), on(1, '09:00'), on(2, '10:00'), off(2, '11:00')];
    const implied = impliedJobOffs(switches, 1);
    expect(implied).toEqual([{ jobLineId: 1, at: at('10:00'), causedBy: switches[2]!.id }]);
    const recorded = [...switches, off(1, '10:00')];
    expect(impliedJobOffs(recorded, 1)).toEqual([]);
    // On record, the day reads as it was counted, and the reading takes no limit that could change it.
    expect(buildLedger(recorded, new Date(at('12:00')), even).totals.jobSeconds).toEqual({
      1: 3600,
      2: 3600,
    });
  });
});

describe(buildLedger.name, () => {
  it('closes jobs at a break and everything at shift-out', () => {
    const result = buildLedger(
      [punch('shift-in', '08:00'), on(1, '08:00'), pause('meal', '12:00'), punch('shift-out', '12:30')],
      new Date(at('13:00')),
      even,
    );
    expect(result.jobs[0]!.to).toEqual(new Date(at('12:00')));
    expect(result.breaks[0]).toMatchObject({ to: new Date(at('12:30')), open: false, endedBy: 'shift-out' });
    expect(result.shifts[0]!.open).toBe(false);
  });

  it('runs open intervals to now', () => {
    const result = buildLedger([punch('shift-in', '08:00'), on(4, '09:00')], new Date(at('10:30')), even);
    expect(result.shifts[0]).toMatchObject({
      from: new Date(at('08:00')),
      to: new Date(at('10:30')),
      open: true,
    });
    expect(result.totals.jobSeconds).toEqual({ 4: 1.5 * 3600 });
  });

  it('gives zero length, not negative, to a punch a little ahead of now', () => {
    const result = buildLedger([punch('shift-in', '08:01')], new Date(at('08:00')), even);
    expect(result.totals.attendanceSeconds).toBe(0);
  });

  it('reports impossible punches and ignores them', () => {
    const bad = [
      on(1, '07:00'),
      punch('shift-in', '08:00'),
      punch('shift-in', '08:05'),
      punch('break-end', '08:10'),
      off(3, '08:15'),
      pause('meal', '12:00'),
      on(1, '12:10'),
      pause('rest', '12:15'),
      punch('break-end', '12:30'),
      on(1, '12:30'),
      on(1, '12:40'),
      punch('job-on', '12:45', { jobLineId: null }),
    ];
    const result = buildLedger(bad, new Date(at('13:00')), even);
    expect(result.anomalies.map((a) => a.reason)).toEqual([
      PUNCH_REFUSALS.notOnShift,
      PUNCH_REFUSALS.alreadyOnShift,
      PUNCH_REFUSALS.noBreak,
      PUNCH_REFUSALS.notOnLine,
      PUNCH_REFUSALS.onBreak,
      PUNCH_REFUSALS.alreadyOnBreak,
      PUNCH_REFUSALS.alreadyOnLine,
      PUNCH_REFUSALS.noLine,
    ]);
    expect(hours(result.totals.attendanceSeconds)).toBe(4.5);
    expect(result.totals.jobSeconds).toEqual({ 1: 0.5 * 3600 });
  });

  it('takes punches at the same instant in the order a day runs, whatever their ids', () => {
    const same = [
      punch('shift-in', '08:00', { id: 'z1' }),
      on(1, '08:00'),
      off(1, '12:00'),
      punch('break-start', '12:00', { id: 'a1', breakKind: 'meal' }),
      punch('break-end', '12:30', { id: 'z2' }),
      punch('job-on', '12:30', { id: 'a2', jobLineId: 1 }),
      punch('shift-out', '16:00', { id: 'a3' }),
      off(1, '16:00'),
    ];
    const result = buildLedger(same, new Date(at('17:00')), even);
    expect(result.anomalies).toEqual([]);
    expect(hours(result.totals.clockedSeconds)).toBe(7.5);
  });

  it('counts a duplicated punch once', () => {
    const shiftIn = punch('shift-in', '08:00');
    const result = buildLedger([shiftIn, shiftIn, punch('shift-out', '09:00')], new Date(at('10:00')), even);
    expect(result.anomalies).toEqual([]);
    expect(hours(result.totals.attendanceSeconds)).toBe(1);
  });

  describe('corrections', () => {
    const shiftIn = punch('shift-in', '08:00');
    const shiftOut = punch('shift-out', '16:00');

    it('replaces a superseded punch', () => {
      const moved = punch('shift-in', '07:30', { supersedes: shiftIn.id });
      const result = buildLedger([shiftOut, moved, shiftIn], new Date(at('18:00')), even);
      expect(hours(result.totals.attendanceSeconds)).toBe(8.5);
    });

    it('follows a chain of corrections', () => {
      const first = punch('shift-in', '07:30', { supersedes: shiftIn.id });
      const second = punch('shift-in', '07:45', { supersedes: first.id });
      const result = buildLedger([shiftIn, shiftOut, second, first], new Date(at('18:00')), even);
      expect(hours(result.totals.attendanceSeconds)).toBe(8.25);
    });

    it('adds a missed punch when it supersedes nothing', () => {
      const missed = pause('meal', '12:00');
      const end = punch('break-end', '12:30');
      const result = buildLedger([shiftIn, shiftOut, missed, end], new Date(at('18:00')), even);
      expect(hours(result.totals.attendanceSeconds)).toBe(7.5);
    });
  });

  // US Department of Labor hours-worked guidance on daylight saving time: an 11:00 pm–7:30 am shift with a
  // 30-minute lunch is 7 h on spring-forward night and 9 h on fall-back night.
  it.each([
    ['2026-03-07', '2026-03-08', 7],
    ['2026-10-31', '2026-11-01', 9],
  ])('counts the overnight shift from %s to %s as %i h of attendance', (start, end, expected) => {
    const tz = 'America/Chicago';
    const local = (d: string, t: string) => shopLocalInstant(d, t, tz).toISOString();
    const night = [
      punch('shift-in', local(start, '23:00')),
      pause('meal', local(end, '03:00')),
      punch('break-end', local(end, '03:30')),
      punch('shift-out', local(end, '07:30')),
    ];
    expect(hours(buildLedger(night, new Date(local(end, '12:00')), even).totals.attendanceSeconds)).toBe(
      expected,
    );
  });

  it('clips totals to a window', () => {
    const overnight = [
      punch('shift-in', at('20:00')),
      on(1, at('22:00')),
      punch('shift-out', '2026-03-11T02:00:00Z'),
    ];
    const result = buildLedger(overnight, new Date('2026-03-11T12:00:00Z'), even);
    const first = result.within(new Date(at('00:00')), new Date('2026-03-11T00:00:00Z'));
    const second = result.within(new Date('2026-03-11T00:00:00Z'), new Date('2026-03-12T00:00:00Z'));
    expect([hours(first.attendanceSeconds), hours(first.clockedSeconds), hours(first.idleSeconds)]).toEqual([
      4, 2, 2,
    ]);
    expect([hours(second.attendanceSeconds), hours(second.clockedSeconds)]).toEqual([2, 2]);
    expect(second.jobSeconds).toEqual({ 1: 2 * 3600 });
  });

  it('refuses punches of several technicians', () => {
    expect(() =>
      buildLedger(
        [punch('shift-in', '08:00'), punch('shift-in', '08:00', { technicianId: 8 })],
        new Date(),
        even,
      ),
    ).toThrow('A ledger is for one technician');
  });
});

describe(technicianState.name, () => {
  const now = new Date(at('12:00'));

  it('is off before any shift', () => {
    expect(technicianState(buildLedger([], now, even))).toEqual({
      status: 'off',
      since: null,
      breakKind: null,
      openJobLineIds: [],
    });
  });

  it('is on shift with the open lines', () => {
    const ledger = buildLedger([punch('shift-in', '08:00'), on(3, '09:00'), on(5, '09:30')], now, even);
    expect(technicianState(ledger)).toEqual({
      status: 'on-shift',
      since: new Date(at('08:00')),
      breakKind: null,
      openJobLineIds: [3, 5],
    });
  });

  it('is on a break since its start', () => {
    const ledger = buildLedger([punch('shift-in', '08:00'), pause('rest', '10:00')], now, even);
    expect(technicianState(ledger)).toMatchObject({
      status: 'on-break',
      since: new Date(at('10:00')),
      breakKind: 'rest',
    });
  });

  it('is off since the last shift-out', () => {
    const ledger = buildLedger([punch('shift-in', '08:00'), punch('shift-out', '11:00')], now, even);
    expect(technicianState(ledger)).toMatchObject({ status: 'off', since: new Date(at('11:00')) });
  });
});

describe(`${punchImpact.name}: refusals`, () => {
  const onShift = [punch('shift-in', '08:00'), on(1, '08:30')];

  it.each([
    ['job-on when off shift', [], on(1, '09:00'), 'You are not on shift'],
    [
      'job-on during a break',
      [...onShift, pause('meal', '12:00')],
      on(2, '12:10'),
      'You are on a break: end it first',
    ],
    ['break-end with no break', onShift, punch('break-end', '09:00'), 'No break to end'],
    ['shift-in twice', onShift, punch('shift-in', '09:00'), 'You are already on shift'],
    ['job-off on another line', onShift, off(2, '09:00'), 'You are not clocked on that line'],
  ])('refuses %s', (_, existing, next, reason) => {
    expect(punchImpact(existing, [next], even).refusal).toBe(reason);
  });

  it('accepts a possible punch', () => {
    expect(punchImpact(onShift, [off(1, '09:00')], even)).toEqual({
      refusal: null,
      displaced: [],
      lowersCounted: false,
    });
  });

  it('judges a late offline punch where it falls in time', () => {
    const existing = [punch('shift-in', '08:00'), punch('shift-out', '12:00')];
    expect(punchImpact(existing, [on(1, '09:00')], even).refusal).toBeNull();
    expect(punchImpact(existing, [on(1, '13:00')], even).refusal).toBe('You are not on shift');
  });
});

describe(punchImpact.name, () => {
  // The example: an offline tablet uploads a shift-out stamped before the day's last job punches.
  const day = [punch('shift-in', '08:00'), on(1, '14:00'), off(1, '16:00'), punch('shift-out', '17:00')];

  it('names the counted punches a late shift-out would make impossible', () => {
    const late = punch('shift-out', '13:00');
    const impact = punchImpact(day, [late], even);
    expect(impact.refusal).toBeNull();
    expect(impact.displaced.map((p) => p.id)).toEqual([day[1]!.id, day[2]!.id, day[3]!.id]);
    expect(impact.lowersCounted).toBe(true);
  });

  it('sees a late meal that a later shift-out would stretch over counted time', () => {
    const meal = pause('meal', '12:00');
    const impact = punchImpact([punch('shift-in', '08:00'), punch('shift-out', '17:00')], [meal], even);
    expect(impact).toEqual({ refusal: null, displaced: [], lowersCounted: true });
  });

  it('takes a difference within the clock slack between tablets (2 min) for no change', () => {
    // A rest break tapped on another tablet closes the job a minute before the shift-out that closed it.
    const shift = [punch('shift-in', '08:00'), on(1, '08:00'), punch('shift-out', '12:00')];
    expect(punchImpact(shift, [pause('rest', '11:59')], even)).toEqual({
      refusal: null,
      displaced: [],
      lowersCounted: false,
    });
    expect(punchImpact(shift, [pause('rest', '11:57')], even).lowersCounted).toBe(true);
  });

  it('lets a punch after the last counted one change nothing counted', () => {
    const meal = pause('meal', '12:00');
    const impact = punchImpact([punch('shift-in', '08:00'), on(1, '09:00')], [meal], even);
    expect(impact).toEqual({ refusal: null, displaced: [], lowersCounted: false });
  });

  it('gives the refusal of a punch that does not fit itself', () => {
    expect(punchImpact([], [on(1, '09:00')], even).refusal).toBe(PUNCH_REFUSALS.notOnShift);
  });

  it('judges a punch at the same instant as the last counted one in full', () => {
    // Same instant, same kind: the order falls to the ids, and the new one can come first.
    const shift = [punch('shift-in', '08:00', { id: 'b1' }), punch('shift-out', '12:00', { id: 'b2' })];
    const again = punch('shift-out', '12:00', { id: 'a1' });
    expect(punchImpact(shift, [again], even).displaced).toEqual([shift[1]]);
  });

  it('does not count a punch a correction replaces as displaced', () => {
    const moved = punch('shift-out', '16:30', { supersedes: day[3]!.id });
    expect(punchImpact(day, [moved], even).displaced).toEqual([]);
  });
});

describe(`${buildLedger.name} properties`, () => {
  const base = Date.parse('2026-03-10T06:00:00Z');
  const punchesArb = fc
    .array(
      fc.record({
        kind: fc.constantFrom(...PUNCH_KINDS),
        minute: fc.integer({ min: 0, max: 16 * 60 }),
        line: fc.integer({ min: 1, max: 4 }),
        breakKind: fc.constantFrom<BreakKind>('meal', 'rest'),
        supersedes: fc.option(fc.nat(), { freq: 5 }),
      }),
      { maxLength: 40 },
    )
    .map((rows) =>
      rows.map((row, i): LedgerPunch => ({
        id: `q${String(i).padStart(3, '0')}`,
        technicianId: 1,
        kind: row.kind,
        jobLineId: row.kind === 'job-on' || row.kind === 'job-off' ? row.line : null,
        breakKind: row.kind === 'break-start' ? row.breakKind : null,
        at: new Date(base + row.minute * 60_000).toISOString(),
        supersedes:
          row.supersedes === null || row.supersedes >= i
            ? null
            : `q${String(row.supersedes).padStart(3, '0')}`,
      })),
    );
  const settingsArb = fc.record({
    concurrentSplit: fc.constantFrom('even' as const, 'full' as const),
    minimumMealMinutes: fc.integer({ min: 10, max: 60 }),
  });
  const now = new Date(base + 17 * 3600_000);
  const plain = ({ shifts, breaks, jobs, anomalies, totals }: Ledger) => ({
    shifts,
    breaks,
    jobs,
    anomalies,
    totals,
  });
  const sum = (record: Record<number, number>) => Object.values(record).reduce((a, b) => a + b, 0);

  it('splits clocked time so it adds up to the wall time clocked', () => {
    fc.assert(
      fc.property(punchesArb, settingsArb, (punches, settings) => {
        const { totals } = buildLedger(punches, now, settings);
        if (settings.concurrentSplit === 'even')
          expect(sum(totals.jobSeconds)).toBeCloseTo(totals.clockedSeconds, 6);
        else expect(sum(totals.jobSeconds)).toBeGreaterThanOrEqual(totals.clockedSeconds - 1e-6);
        for (const seconds of Object.values(totals.jobSeconds))
          expect(seconds).toBeLessThanOrEqual(totals.clockedSeconds + 1e-6);
      }),
    );
  });

  it('never gives a negative figure and keeps attendance ≥ clocked', () => {
    fc.assert(
      fc.property(punchesArb, settingsArb, (punches, settings) => {
        const { totals, shifts, breaks, jobs } = buildLedger(punches, now, settings);
        const figures = [
          totals.attendanceSeconds,
          totals.clockedSeconds,
          totals.idleSeconds,
          totals.mealBreakSeconds,
        ];
        for (const figure of [...figures, totals.restBreakSeconds, ...Object.values(totals.jobSeconds)])
          expect(figure).toBeGreaterThanOrEqual(0);
        for (const interval of [...shifts, ...breaks, ...jobs])
          expect(interval.to >= interval.from).toBe(true);
        expect(totals.attendanceSeconds).toBeGreaterThanOrEqual(totals.clockedSeconds - 1e-6);
      }),
    );
  });

  it('changes nothing when a punch is replayed', () => {
    fc.assert(
      fc.property(
        punchesArb.filter((p) => p.length > 0),
        fc.nat(),
        settingsArb,
        (punches, pick, settings) => {
          const replayed = [...punches, punches[pick % punches.length]!];
          expect(plain(buildLedger(replayed, now, settings))).toEqual(
            plain(buildLedger(punches, now, settings)),
          );
        },
      ),
    );
  });

  it('changes nothing when the punches arrive in another order', () => {
    fc.assert(
      fc.property(
        punchesArb.chain((punches) =>
          fc.tuple(fc.constant(punches), fc.shuffledSubarray(punches, { minLength: punches.length })),
        ),
        settingsArb,
        ([punches, shuffled], settings) => {
          expect(plain(buildLedger(shuffled, now, settings))).toEqual(
            plain(buildLedger(punches, now, settings)),
          );
        },
      ),
    );
  });

  it('adds up windows to the whole', () => {
    fc.assert(
      fc.property(
        punchesArb,
        settingsArb,
        fc.integer({ min: 0, max: 17 * 60 }),
        (punches, settings, minute) => {
          const ledger = buildLedger(punches, now, settings);
          const cut = new Date(base + minute * 60_000);
          const before = ledger.within(new Date(base - 3600_000), cut);
          const after = ledger.within(cut, now);
          expect(before.attendanceSeconds + after.attendanceSeconds).toBeCloseTo(
            ledger.totals.attendanceSeconds,
            6,
          );
          expect(before.clockedSeconds + after.clockedSeconds).toBeCloseTo(ledger.totals.clockedSeconds, 6);
        },
      ),
    );
  });

  it('judges a punch as the ledgers before and after it tell, a new one at the end of the day included', () => {
    const nextArb = fc.record({
      kind: fc.constantFrom(...PUNCH_KINDS),
      // After the last counted punch, at the same instant, or among the day's punches.
      minutesAfterLast: fc.oneof(fc.constant(0), fc.integer({ min: -120, max: 60 })),
      line: fc.integer({ min: 1, max: 4 }),
      corrects: fc.option(fc.nat(), { freq: 4 }),
      reusesId: fc.option(fc.nat(), { freq: 8 }),
    });
    fc.assert(
      fc.property(punchesArb, settingsArb, nextArb, (existing, settings, next) => {
        const superseded = new Set(existing.map((p) => p.supersedes));
        const counted = existing.filter((p) => !superseded.has(p.id)).map((p) => Date.parse(p.at));
        const countedUntil = Math.max(base, ...counted);
        const pick = (n: number | null) =>
          n === null || existing.length === 0 ? null : existing[n % existing.length]!.id;
        const candidate: LedgerPunch = {
          id: pick(next.reusesId) ?? 'next',
          technicianId: 1,
          kind: next.kind,
          jobLineId: next.kind === 'job-on' || next.kind === 'job-off' ? next.line : null,
          breakKind: next.kind === 'break-start' ? 'meal' : null,
          at: new Date(countedUntil + next.minutesAfterLast * 60_000).toISOString(),
          supersedes: pick(next.corrects),
        };
        // The definition: what the counted punches' ledger up to the last of them becomes with this one.
        const horizon = new Date(Math.max(countedUntil, Date.parse(candidate.at)));
        const [before, after] = [
          buildLedger(existing, horizon, settings),
          buildLedger([...existing, candidate], horizon, settings),
        ];
        const wasAnomaly = new Set(before.anomalies.map((a) => a.punchId));
        const window = [new Date(base - 3600_000), new Date(countedUntil)] as const;
        const [was, will] = [before.within(...window), after.within(...window)];
        const slack = 120;
        expect(punchImpact(existing, [candidate], settings)).toEqual({
          refusal: after.anomalies.find((a) => a.punchId === candidate.id)?.reason ?? null,
          displaced: after.anomalies
            .filter((a) => a.punchId !== candidate.id && !wasAnomaly.has(a.punchId))
            .map((a) => existing.find((p) => p.id === a.punchId)),
          lowersCounted:
            will.attendanceSeconds < was.attendanceSeconds - slack ||
            will.clockedSeconds < was.clockedSeconds - slack,
        });
      }),
      { numRuns: 1500 },
    );
  });
});
