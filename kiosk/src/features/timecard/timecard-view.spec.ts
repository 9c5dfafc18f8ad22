// @vitest-environment node
import { describe, expect, it } from 'vitest';
import type { Timecard, TimecardPunch } from '@baytime/shared';
import { buildWeekView, payableNote, weekFigures } from './timecard-view';

const zero = {
  attendanceSeconds: 0,
  clockedSeconds: 0,
  idleSeconds: 0,
  mealBreakSeconds: 0,
  restBreakSeconds: 0,
};

function punch(id: string, at: string, changes: Partial<TimecardPunch> = {}): TimecardPunch {
  return {
    id,
    technicianId: 4,
    kind: 'shift-in',
    jobLineId: null,
    breakKind: null,
    at,
    recordedAt: at,
    recordedBy: 4,
    supersedes: null,
    reason: null,
    voids: false,
    supersededBy: null,
    recordedByName: 'Rhea Mollander',
    ...changes,
  };
}

function card(changes: Partial<Timecard> = {}): Timecard {
  const days = [
    '2026-11-29',
    '2026-11-30',
    '2026-12-01',
    '2026-12-02',
    '2026-12-03',
    '2026-12-04',
    '2026-12-05',
  ];
  return {
    technician: { id: 4, name: 'Rhea Mollander' },
    week: '2026-W48',
    weekName: 'Week of Sun, Nov 29',
    from: '2026-11-29T06:00:00.000Z',
    to: '2026-12-06T06:00:00.000Z',
    timeZone: 'America/Chicago',
    punches: [],
    shifts: [],
    breaks: [],
    jobs: [],
    lines: [],
    days: days.map((day) => ({ day, ...zero })),
    totals: zero,
    anomalies: [],
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
    ...changes,
  };
}

describe(buildWeekView.name, () => {
  it('shows the week’s range in the shop’s zone and names the empty days', () => {
    const view = buildWeekView(card());
    expect(view.range).toBe('Nov 29 – Dec 5');
    expect(view.days).toEqual([]);
    expect(view.emptyDays).toEqual(['Sun', 'Mon', 'Tue', 'Wed', 'Thu', 'Fri', 'Sat']);
  });

  it('puts each punch on the day its shift began, even past midnight, in the shop’s time', () => {
    const view = buildWeekView(
      card({
        punches: [
          punch('a', '2026-11-30T22:00:00.000Z'),
          punch('b', '2026-12-01T06:30:00.000Z', { kind: 'shift-out' }),
        ],
        shifts: [{ from: '2026-11-30T22:00:00.000Z', to: '2026-12-01T06:30:00.000Z', open: false }],
        days: card().days.map((d) => (d.day === '2026-11-30' ? { ...d, attendanceSeconds: 30_600 } : d)),
      }),
    );
    expect(view.days.map((d) => d.day)).toEqual(['2026-11-30']);
    expect(view.days[0]!.label).toBe('Monday, Nov 30');
    expect(view.days[0]!.punches.map((p) => [p.time, p.words])).toEqual([
      ['4:00 pm', 'Shift start'],
      ['12:30 am', 'Shift end'],
    ]);
  });

  it('names the line of a job punch and the kind of a break', () => {
    const view = buildWeekView(
      card({
        punches: [
          punch('a', '2026-11-30T14:00:00.000Z', { kind: 'job-on', jobLineId: 97 }),
          punch('b', '2026-11-30T18:00:00.000Z', { kind: 'break-start', breakKind: 'meal' }),
        ],
        jobs: [
          {
            from: '2026-11-30T14:00:00.000Z',
            to: '2026-11-30T16:00:00.000Z',
            open: false,
            jobLineId: 97,
            title: 'Battery and charging system test',
            repairOrderNumber: '4497',
            seconds: 7200,
            countedSeconds: 7200,
          },
        ],
      }),
    );
    expect(view.days[0]!.punches.map((p) => [p.words, p.detail])).toEqual([
      ['Clock on', 'RO 4497 · Battery and charging system test'],
      ['Break start · meal', null],
    ]);
  });

  it('strikes a superseded punch with the correction’s reason and says who corrected it', () => {
    const view = buildWeekView(
      card({
        punches: [
          punch('old', '2026-11-30T22:45:00.000Z', { kind: 'shift-out', supersededBy: 'new' }),
          punch('new', '2026-11-30T22:30:00.000Z', {
            kind: 'shift-out',
            supersedes: 'old',
            reason: 'Left at 4:30, tapped late',
            recordedBy: 2,
            recordedByName: 'Sam Ferreira',
          }),
        ],
      }),
    );
    const [corrected, original] = view.days[0]!.punches;
    expect(original).toMatchObject({ id: 'old', supersededBecause: 'Left at 4:30, tapped late', note: null });
    expect(corrected).toMatchObject({
      id: 'new',
      supersededBecause: null,
      note: { kind: 'correction', by: 'Sam Ferreira', reason: 'Left at 4:30, tapped late' },
    });
  });

  it('shows a punch the office took out of the count, without the voiding row', () => {
    const view = buildWeekView(
      card({
        punches: [
          punch('b', '2026-12-02T15:00:00.000Z', { kind: 'job-on', jobLineId: 3, supersededBy: 'v' }),
          punch('v', '2026-12-02T15:00:00.000Z', {
            kind: 'job-on',
            jobLineId: 3,
            supersedes: 'b',
            voids: true,
            reason: 'Displaced by a late punch the office accepted',
          }),
        ],
      }),
    );
    expect(view.days[0]!.punches).toEqual([
      expect.objectContaining({
        id: 'b',
        takenOut: true,
        supersededBecause: 'Displaced by a late punch the office accepted',
      }),
    ]);
  });

  it('marks a punch that was not counted, with the reason', () => {
    const view = buildWeekView(
      card({
        punches: [punch('x', '2026-12-02T15:00:00.000Z', { kind: 'job-on', jobLineId: 3 })],
        anomalies: [{ punchId: 'x', reason: 'You are not on shift' }],
      }),
    );
    expect(view.days[0]!.punches[0]!.notCounted).toBe('You are not on shift');
  });

  // 29 CFR 778.111(a), the pieceworker example as the pay summary gives it: 49.1 flagged h, 46 h clocked
  // (efficiency 49.1 ÷ 46 = 106.7 %), $575.30 for the week. The kiosk shows those very figures.
  it('shows the figures of the reports, and the pay only when the shop shows it', () => {
    const labour = {
      ...card().summary.labour,
      attendanceHours: 50,
      clockedHours: 46,
      flaggedHours: 49.1,
      matchedClockedHours: 46,
      efficiency: 49.1 / 46,
    };
    const pay = { payableCents: 575_30, flaggedHours: 49.1 } as Timecard['summary']['pay'];
    expect(weekFigures(card({ summary: { labour, pay, closed: false, caution: 'An estimate' } }))).toEqual([
      { label: 'Flagged', value: '49.1 h' },
      { label: 'Clocked on jobs', value: '46.0 h' },
      { label: 'Efficiency', value: '107%' },
      { label: 'Estimated pay', value: '$575.30' },
    ]);
    expect(weekFigures(card({ summary: { labour, pay: null, closed: false, caution: '' } })).at(-1)).toEqual({
      label: 'Efficiency',
      value: '107%',
    });
    // Closed on 49.1 h; a line of the week reopened since, it flags 47.1 h today: both show.
    const reopened = { ...labour, flaggedHours: 47.1 };
    expect(
      weekFigures(card({ summary: { labour: reopened, pay, closed: true, caution: '' } })).map(
        (f) => f.label,
      ),
    ).toEqual(['Flagged', 'Clocked on jobs', 'Efficiency', 'Flagged when the week closed', 'Estimated pay']);
    expect(weekFigures(card({ summary: { labour, pay, closed: true, caution: '' } }))).toHaveLength(4);
  });
});

describe(payableNote.name, () => {
  // The server's pay row for a week where a closed week was overpaid: 2 h worked, $20.00 of pay, an adjustment
  // of −$59.00 for the earlier week, so −$39.00 payable, below 2 h × $7.25 = $14.50 (29 CFR 531.35, from memory).
  const adjusted = {
    hoursWorked: 2,
    adjustmentCents: -59_00,
    payableCents: -39_00,
    payableCaution: 'Payable -$39.00 is below the minimum wage for 2 h worked …',
  };

  it('tells the technician in plain words when the office’s pay row carries a payable caution', () => {
    expect(payableNote(adjusted)).toBe(
      'After an adjustment of -$59.00 for an earlier week, this week’s estimated pay (-$39.00) is below the ' +
        'minimum wage for the 2.0\u00a0h you worked. Ask the office to confirm it with payroll before payday.',
    );
  });

  it('leaves out the adjustment when there was none to name', () => {
    expect(payableNote({ ...adjusted, adjustmentCents: 0, payableCents: 10_00 })).toBe(
      'This week’s estimated pay ($10.00) is below the minimum wage for the 2.0\u00a0h you worked. Ask the ' +
        'office to confirm it with payroll before payday.',
    );
  });

  it('calls the pay negative in a week without hours worked', () => {
    expect(payableNote({ ...adjusted, hoursWorked: 0, payableCents: -59_00 })).toBe(
      'After an adjustment of -$59.00 for an earlier week, this week’s estimated pay (-$59.00) is negative, ' +
        'with no hours worked this week. Ask the office to confirm it with payroll before payday.',
    );
  });

  it('says nothing when the server gives no caution or the shop hides pay', () => {
    // The rule is the server's: figures that look low without its caution get no note here.
    expect(payableNote({ ...adjusted, payableCaution: null })).toBeNull();
    expect(payableNote(null)).toBeNull();
  });
});
