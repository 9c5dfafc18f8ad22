import type { ShiftStatus } from '../punches/my-day.schema.js';
import {
  MAX_PUNCH_CLOCK_SKEW_SECONDS,
  type BreakKind,
  type PunchDto,
  type PunchKind,
} from '../punches/punches.schema.js';
import type { ShopSettings } from '../shop/shop.schema.js';

export type LedgerPunch = Pick<
  PunchDto,
  'id' | 'technicianId' | 'kind' | 'jobLineId' | 'breakKind' | 'at' | 'supersedes'
> &
  Partial<Pick<PunchDto, 'voids'>>;
/** How a ledger counts: the split of time on several lines at once, and the shortest bona fide meal. */
export type LedgerRules = Pick<ShopSettings, 'concurrentSplit' | 'minimumMealMinutes'>;
export interface LedgerSettings extends LedgerRules {
  /**
   * The rules in force before the current ones, oldest first, each until an instant (ms): time is counted
   * under the rules of its moment, so a change of them never re-reads the past. None: the current rules
   * count all of it.
   */
  earlier?: readonly (LedgerRules & { until: number })[];
}

/** The rules in force at an instant (ms). */
export function ledgerRulesAt(settings: LedgerSettings, at: number): LedgerRules {
  return settings.earlier?.find((rules) => at < rules.until) ?? settings;
}

/**
 * The ledger settings alone, as one string: what is counted from a ledger and kept must be counted
 * afresh when it changes. A new ledger setting fails to compile here until it is part of it.
 */
export function ledgerSettingsKey(settings: LedgerSettings): string {
  const ledger: Record<keyof LedgerSettings, unknown> = {
    concurrentSplit: settings.concurrentSplit,
    minimumMealMinutes: settings.minimumMealMinutes,
    earlier: settings.earlier ?? [],
  };
  return JSON.stringify(ledger);
}

export interface LedgerInterval {
  from: Date;
  to: Date;
  /** Still running: `to` is `now`. */
  open: boolean;
  /** The punch that opened it. */
  startPunchId: string;
}
export interface BreakInterval extends LedgerInterval {
  /** How it counts: a "meal" shorter than the shop's minimum bona fide meal counts as paid rest. */
  kind: BreakKind;
  /** The kind the technician chose; null when the punch said none (it then counts as rest, never unpaid). */
  declared: BreakKind | null;
  /** What closed it: its own break-end, or a shift-out (a break never ended); null while open. */
  endedBy: 'break-end' | 'shift-out' | null;
}
export interface JobInterval extends LedgerInterval {
  jobLineId: number;
}
export interface LedgerAnomaly {
  punchId: string;
  reason: string;
}

export interface LedgerTotals {
  /** Shift time less bona fide meal breaks; rest breaks and short "meals" stay in (29 CFR 785.18/785.19). */
  attendanceSeconds: number;
  /** Wall time clocked on any job line, counted once however many lines were open. */
  clockedSeconds: number;
  /** Seconds per job line, after the shop's concurrent split rule. */
  jobSeconds: Record<number, number>;
  idleSeconds: number;
  mealBreakSeconds: number;
  restBreakSeconds: number;
}

export interface Ledger {
  shifts: LedgerInterval[];
  breaks: BreakInterval[];
  jobs: JobInterval[];
  /** Punches that were impossible where they fell in time, with the reason; they change nothing. */
  anomalies: LedgerAnomaly[];
  totals: LedgerTotals;
  /** Totals of the intervals clipped to [from, to). */
  within(from: Date, to: Date): LedgerTotals;
}

export interface TechnicianState {
  status: ShiftStatus;
  /** Start of the current shift or break; end of the last shift when off; null before any shift. */
  since: Date | null;
  breakKind: BreakKind | null;
  openJobLineIds: number[];
}

export const PUNCH_REFUSALS = {
  notOnShift: 'You are not on shift',
  onBreak: 'You are on a break: end it first',
  noBreak: 'No break to end',
  alreadyOnShift: 'You are already on shift',
  alreadyOnBreak: 'You are already on a break',
  notOnLine: 'You are not clocked on that line',
  alreadyOnLine: 'You are already clocked on that line',
  noLine: 'Say which job line',
} as const;

/** A refusal said of someone else's punch: "You are already on shift" becomes "Kai Morrell is already on shift". */
export function refusalAbout(refusal: string, name: string): string {
  return refusal.replace(/^You are\b/, `${name} is`);
}

/**
 * Punches at the same instant (a paper timesheet's "job off 12:00, lunch 12:00") in the order a day runs:
 * the shift opens, a break ends and a job closes before a job opens, a break starts or the shift closes.
 */
export const SAME_INSTANT_ORDER: Record<PunchKind, number> = {
  'shift-in': 0,
  'break-end': 1,
  'job-off': 2,
  'job-on': 3,
  'break-start': 4,
  'shift-out': 5,
};

/**
 * Effective punches in time order: duplicates once, superseded ones dropped, ties broken by id. A row that
 * `voids` the punch it supersedes takes it out without standing in for it.
 */
function effectivePunches(punches: readonly LedgerPunch[]): LedgerPunch[] {
  const byId = new Map<string, LedgerPunch>();
  for (const punch of punches) if (!byId.has(punch.id)) byId.set(punch.id, punch);
  const superseded = new Set([...byId.values()].map((p) => p.supersedes).filter((id) => id !== null));
  return [...byId.values()]
    .filter((p) => !superseded.has(p.id) && !p.voids)
    .map((p) => ({ punch: p, ms: Date.parse(p.at) }))
    .sort(
      (a, b) =>
        a.ms - b.ms ||
        SAME_INSTANT_ORDER[a.punch.kind] - SAME_INSTANT_ORDER[b.punch.kind] ||
        (a.punch.id < b.punch.id ? -1 : a.punch.id > b.punch.id ? 1 : 0),
    )
    .map(({ punch }) => punch);
}

const seconds = (from: number, to: number) => Math.max(0, to - from) / 1000;

/** [from, to) cut where the rules change, each piece under one set of rules. */
function underOneRule(settings: LedgerSettings, from: number, to: number): [number, number][] {
  const cuts = (settings.earlier ?? []).map((rules) => rules.until).filter((at) => at > from && at < to);
  return [from, ...cuts].map((start, i) => [start, cuts[i] ?? to]);
}

function totalsOf(
  ledger: Pick<Ledger, 'shifts' | 'breaks' | 'jobs'>,
  settings: LedgerSettings,
  from: number,
  to: number,
): LedgerTotals {
  const clip = (i: LedgerInterval) => seconds(Math.max(i.from.getTime(), from), Math.min(i.to.getTime(), to));
  const sum = (list: LedgerInterval[]) => list.reduce((total, i) => total + clip(i), 0);
  const mealBreakSeconds = sum(ledger.breaks.filter((b) => b.kind === 'meal'));
  const restBreakSeconds = sum(ledger.breaks.filter((b) => b.kind === 'rest'));
  const attendanceSeconds = Math.max(0, sum(ledger.shifts) - mealBreakSeconds);

  // Sweep the job boundaries in time order: between two of them the set of open lines is constant.
  // Only jobs that overlap the window take part, so a week of a year-long ledger costs a week's work.
  const events = ledger.jobs
    .filter((j) => j.to.getTime() > from && j.from.getTime() < to)
    .flatMap((j) => [
      { at: Math.max(j.from.getTime(), from), line: j.jobLineId, delta: 1 },
      { at: Math.min(j.to.getTime(), to), line: j.jobLineId, delta: -1 },
    ])
    .sort((a, b) => a.at - b.at);
  const jobSeconds: Record<number, number> = {};
  for (const job of ledger.jobs) jobSeconds[job.jobLineId] ??= 0;
  const open = new Map<number, number>();
  let clockedSeconds = 0;
  let previous = -Infinity;
  for (const event of events) {
    if (open.size > 0 && event.at > previous) {
      clockedSeconds += seconds(previous, event.at);
      for (const [start, end] of underOneRule(settings, previous, event.at)) {
        const wall = seconds(start, end);
        const even = ledgerRulesAt(settings, start).concurrentSplit === 'even';
        for (const line of open.keys()) jobSeconds[line]! += even ? wall / open.size : wall;
      }
    }
    previous = event.at;
    const count = (open.get(event.line) ?? 0) + event.delta;
    if (count > 0) open.set(event.line, count);
    else open.delete(event.line);
  }
  return {
    attendanceSeconds,
    clockedSeconds,
    jobSeconds,
    idleSeconds: Math.max(0, attendanceSeconds - clockedSeconds),
    mealBreakSeconds,
    restBreakSeconds,
  };
}

/**
 * One technician's punches → shift, break and job intervals and their totals. Order of arrival never
 * matters; open intervals run to `now` (or to their own start when a tablet clock ran ahead). Every
 * job-off is on record: the shop's jobs-at-once rule is kept when punches are written (`jobOffsFor`),
 * so changing it never re-reads the past.
 */
export function buildLedger(punches: readonly LedgerPunch[], now: Date, settings: LedgerSettings): Ledger {
  return readLedger(punches, now, settings, () => Infinity, []);
}

/** Settings for reading job intervals alone: how breaks count does not change them. */
const INTERVALS_ONLY: LedgerSettings = { concurrentSplit: 'even', minimumMealMinutes: 0 };

/** A job-off that a clock-on beyond the shop's jobs-at-once limit implies: the oldest open line closes. */
export interface ImpliedJobOff {
  jobLineId: number;
  at: string;
  /** The clock-on that closes it. */
  causedBy: string;
}

/**
 * The job-offs a clock-on beyond `maxConcurrentJobs` implies, through a technician's punches. Punches
 * were once read that way without the job-off on record; these are what must be recorded for the past
 * to read the same under any later limit.
 */
export function impliedJobOffs(punches: readonly LedgerPunch[], maxConcurrentJobs: number): ImpliedJobOff[] {
  const implied: ImpliedJobOff[] = [];
  readLedger(punches, new Date(0), INTERVALS_ONLY, () => maxConcurrentJobs, implied);
  return implied;
}

/**
 * The job-offs to record with `punch` so the technician stays within `maxConcurrentJobs` open lines:
 * a clock-on at the limit closes the oldest open line at the same instant. None for any other punch.
 */
export function jobOffsFor(
  existing: readonly LedgerPunch[],
  punch: LedgerPunch,
  maxConcurrentJobs: number,
): ImpliedJobOff[] {
  if (punch.kind !== 'job-on') return [];
  const implied: ImpliedJobOff[] = [];
  // The punches on record were kept to the limit of their day: only the new one meets today's.
  const limitOf = (each: LedgerPunch) => (each.id === punch.id ? maxConcurrentJobs : Infinity);
  readLedger([...existing, punch], new Date(0), INTERVALS_ONLY, limitOf, implied);
  return implied;
}

/**
 * The job-offs to record with `punch`, each clock-on held to the jobs-at-once limit of its moment: those
 * `punch` implies (`jobOffsFor`), and for a clock-on dated before others on record, those each later
 * clock-on implies once it is in, so a line opened in the past closes where the next clock-on closed the
 * lines open then.
 */
export function jobOffsWith(
  existing: readonly LedgerPunch[],
  punch: LedgerPunch,
  limitAt: (at: Date) => number,
): ImpliedJobOff[] {
  const offs = jobOffsFor(existing, punch, limitAt(new Date(punch.at)));
  const at = Date.parse(punch.at);
  // A clock-on made now, the kiosk's every one, has nothing after it to read.
  if (punch.kind !== 'job-on' || !existing.some((each) => each.kind === 'job-on' && Date.parse(each.at) > at))
    return offs;
  const asPunch = (off: ImpliedJobOff): LedgerPunch => ({
    id: `${off.causedBy}:off:${off.jobLineId}`,
    technicianId: punch.technicianId,
    kind: 'job-off',
    jobLineId: off.jobLineId,
    breakKind: null,
    at: off.at,
    supersedes: null,
  });
  let list = [...existing, ...offs.map(asPunch), punch];
  const later = effectivePunches(existing).filter(
    (each) => each.kind === 'job-on' && Date.parse(each.at) > at,
  );
  for (const clockOn of later) {
    const more = jobOffsFor(
      list.filter((each) => each.id !== clockOn.id),
      clockOn,
      limitAt(new Date(clockOn.at)),
    );
    offs.push(...more);
    list = [...list, ...more.map(asPunch)];
  }
  return offs;
}

function readLedger(
  punches: readonly LedgerPunch[],
  now: Date,
  settings: LedgerSettings,
  limitOf: (jobOn: LedgerPunch) => number,
  implied: ImpliedJobOff[],
): Ledger {
  if (new Set(punches.map((p) => p.technicianId)).size > 1) throw new Error('A ledger is for one technician');
  const shifts: LedgerInterval[] = [];
  const breaks: BreakInterval[] = [];
  const jobs: JobInterval[] = [];
  const anomalies: LedgerAnomaly[] = [];
  let openShift: { from: number; punchId: string } | null = null;
  let openBreak: { from: number; declared: BreakKind | null; punchId: string } | null = null;
  const openJobs = new Map<number, { from: number; punchId: string }>(); // insertion order is oldest first

  const span = (start: { from: number; punchId: string }, to: number, open = false): LedgerInterval => ({
    from: new Date(start.from),
    to: new Date(Math.max(start.from, to)),
    open,
    startPunchId: start.punchId,
  });
  const closeJob = (jobLineId: number, at: number, open = false) => {
    jobs.push({ ...span(openJobs.get(jobLineId)!, at, open), jobLineId });
    openJobs.delete(jobLineId);
  };
  const closeJobs = (at: number, open = false) =>
    [...openJobs.keys()].forEach((id) => closeJob(id, at, open));
  const closeBreak = (at: number, endedBy: BreakInterval['endedBy']) => {
    if (!openBreak) return;
    const interval = span(openBreak, at, endedBy === null);
    // 29 CFR 785.19(a): a bona fide meal period is ordinarily 30 minutes or more; shorter ones, and breaks
    // of no stated kind, are rest periods and hours worked (785.18). An open meal counts as a meal so far.
    const meal =
      openBreak.declared === 'meal' &&
      (endedBy === null ||
        interval.to.getTime() - interval.from.getTime() >=
          ledgerRulesAt(settings, openBreak.from).minimumMealMinutes * 60_000);
    breaks.push({ ...interval, kind: meal ? 'meal' : 'rest', declared: openBreak.declared, endedBy });
    openBreak = null;
  };

  const apply = (punch: LedgerPunch): string | null => {
    const at = Date.parse(punch.at);
    const line = punch.jobLineId;
    if (punch.kind === 'shift-in') {
      if (openShift !== null) return PUNCH_REFUSALS.alreadyOnShift;
      openShift = { from: at, punchId: punch.id };
      return null;
    }
    if (openShift === null) return PUNCH_REFUSALS.notOnShift;
    switch (punch.kind) {
      case 'shift-out':
        closeJobs(at);
        closeBreak(at, 'shift-out');
        shifts.push(span(openShift, at));
        openShift = null;
        return null;
      case 'break-start':
        if (openBreak) return PUNCH_REFUSALS.alreadyOnBreak;
        closeJobs(at);
        openBreak = { from: at, declared: punch.breakKind, punchId: punch.id };
        return null;
      case 'break-end':
        if (!openBreak) return PUNCH_REFUSALS.noBreak;
        closeBreak(at, 'break-end');
        return null;
      case 'job-on':
        if (openBreak) return PUNCH_REFUSALS.onBreak;
        if (line === null) return PUNCH_REFUSALS.noLine;
        if (openJobs.has(line)) return PUNCH_REFUSALS.alreadyOnLine;
        while (openJobs.size >= limitOf(punch)) {
          const oldest = openJobs.keys().next().value!;
          implied.push({ jobLineId: oldest, at: punch.at, causedBy: punch.id });
          closeJob(oldest, at);
        }
        openJobs.set(line, { from: at, punchId: punch.id });
        return null;
      case 'job-off':
        if (line === null || !openJobs.has(line)) return PUNCH_REFUSALS.notOnLine;
        closeJob(line, at);
        return null;
    }
  };
  for (const punch of effectivePunches(punches)) {
    const reason = apply(punch);
    if (reason) anomalies.push({ punchId: punch.id, reason });
  }
  const end = now.getTime();
  closeJobs(end, true);
  closeBreak(end, null);
  if (openShift !== null) shifts.push(span(openShift, end, true));

  const intervals = { shifts, breaks, jobs };
  let totals: LedgerTotals | undefined;
  return {
    ...intervals,
    anomalies,
    // Counted when first read: a fit check reads only the anomalies.
    get totals() {
      return (totals ??= totalsOf(intervals, settings, -Infinity, Infinity));
    },
    within: (from, to) => totalsOf(intervals, settings, from.getTime(), to.getTime()),
  };
}

/** Where a technician stands at `now`: off, on shift or on a break, since when, and the open lines. */
export function technicianState(ledger: Ledger): TechnicianState {
  const shift = ledger.shifts.find((s) => s.open);
  const onBreak = ledger.breaks.find((b) => b.open);
  const lastShift = ledger.shifts.at(-1);
  return {
    status: onBreak ? 'on-break' : shift ? 'on-shift' : 'off',
    since: onBreak?.from ?? shift?.from ?? lastShift?.to ?? null,
    breakKind: onBreak?.kind ?? null,
    openJobLineIds: ledger.jobs.filter((j) => j.open).map((j) => j.jobLineId),
  };
}

export interface PunchImpact {
  /** Why the punch itself cannot be recorded where it falls, in plain words; null when it fits. */
  refusal: string | null;
  /** Punches that count now and would no longer fit once this one is in, in time order. */
  displaced: LedgerPunch[];
  /**
   * The attendance or clocked time already counted (up to the last counted punch) would drop by more than
   * the clock slack between tablets (MAX_PUNCH_CLOCK_SKEW_SECONDS).
   */
  lowersCounted: boolean;
}

/**
 * What recording `added` (a punch, with the job-offs it implies) would do to the punches already counted.
 * A punch that arrives late (an offline replay, a correction) can fit where it falls and still make later
 * punches impossible: those are the displaced ones, and the counted hours of the past must never change
 * without a person deciding.
 */
export function punchImpact(
  existing: readonly LedgerPunch[],
  added: readonly LedgerPunch[],
  settings: LedgerSettings,
): PunchImpact {
  const lastCounted = effectivePunches(existing).at(-1);
  const countedUntil = lastCounted ? Date.parse(lastCounted.at) : -Infinity;
  const addedIds = new Set(added.map((punch) => punch.id));
  const latest = Math.max(...added.map((punch) => Date.parse(punch.at)));
  const horizon = new Date(Math.max(countedUntil, latest));
  const after = buildLedger([...existing, ...added], horizon, settings);
  const refusal = after.anomalies.find((a) => addedIds.has(a.punchId))?.reason ?? null;
  // Punches after every counted one that correct none leave their order, so their fit and time, as it was.
  if (
    added.every((punch) => Date.parse(punch.at) > countedUntil && punch.supersedes === null && !punch.voids)
  )
    return { refusal, displaced: [], lowersCounted: false };
  const before = buildLedger(existing, horizon, settings);
  const wasAnomaly = new Set(before.anomalies.map((a) => a.punchId));
  const byId = new Map(existing.map((p) => [p.id, p]));
  const displaced = after.anomalies
    .filter((a) => !addedIds.has(a.punchId) && !wasAnomaly.has(a.punchId))
    .map((a) => byId.get(a.punchId)!);
  const window = [new Date(-8.64e15), new Date(Math.max(countedUntil, -8.64e15))] as const;
  const [was, will] = [before.within(...window), after.within(...window)];
  // Two tablets' clocks may differ by a little: a change that small is not a change of counted time.
  const slack = MAX_PUNCH_CLOCK_SKEW_SECONDS;
  const lowersCounted =
    will.attendanceSeconds < was.attendanceSeconds - slack ||
    will.clockedSeconds < was.clockedSeconds - slack;
  return { refusal, displaced, lowersCounted };
}
