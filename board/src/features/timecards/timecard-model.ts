import {
  SAME_INSTANT_ORDER,
  shopLocalInstant,
  type Timecard,
  type TimecardPunch,
  type TimecardTotals,
} from '@baytime/shared';
import { clockValue, formatHours } from './timecard-format';

export interface PunchRow {
  punch: TimecardPunch;
  /** The correction that replaced this punch (it stays on the card, struck through). */
  replacedBy: TimecardPunch | null;
  /** For a correction: the punch it replaced. */
  replaces: TimecardPunch | null;
  /** Added or changed by a foreman or owner, with a reason. */
  correction: boolean;
  /** Why the ledger did not count the punch. */
  notCounted: string | null;
  /** "RO 4497 · Battery and charging system test" for job punches. */
  job: string | null;
}

export type IntervalKind = 'shift' | 'meal' | 'rest' | 'job';

export interface CardInterval {
  kind: IntervalKind;
  from: Date;
  to: Date;
  open: boolean;
  /** Job intervals: the RO and line. */
  label: string | null;
  jobLineId: number | null;
  /** Job intervals: 0 for the first track; concurrent jobs go on further tracks. */
  lane: number;
  /** Job intervals: its seconds within the week, and what the line is credited for them after the split. */
  credit: { seconds: number; counted: number } | null;
}

export interface CardDay {
  day: string;
  from: Date;
  to: Date;
  totals: TimecardTotals;
  punches: PunchRow[];
  /** Intervals that start in this workday (the first day also takes those begun before the week). */
  intervals: CardInterval[];
  /** The same intervals clipped to the day, plus those running into it from the day before. */
  covering: CardInterval[];
  active: boolean;
}

export interface JobLineRef {
  jobLineId: number;
  label: string;
}

const ms = (value: string | Date) => new Date(value).getTime();

/** Each workday's bounds: from the week's start hour on that local day to the same hour on the next. */
export function workdayBounds(
  card: Pick<Timecard, 'days' | 'from' | 'to' | 'timeZone'>,
): { from: Date; to: Date }[] {
  const startClock = clockValue(card.from, card.timeZone);
  const starts = card.days.map((day, index) =>
    index === 0 ? new Date(card.from) : shopLocalInstant(day.day, startClock, card.timeZone),
  );
  return starts.map((from, index) => ({ from, to: starts[index + 1] ?? new Date(card.to) }));
}

function dayIndexOf(instant: number, bounds: { from: Date; to: Date }[]): number {
  const index = bounds.findIndex((day) => instant >= day.from.getTime() && instant < day.to.getTime());
  if (index >= 0) return index;
  return instant < (bounds[0]?.from.getTime() ?? 0) ? 0 : bounds.length - 1;
}

/** The job lines a card mentions, labelled "RO 4497 · title". */
export function jobLinesOf(card: Pick<Timecard, 'lines'>): Map<number, string> {
  return new Map(card.lines.map((line) => [line.jobLineId, `RO ${line.repairOrderNumber} · ${line.title}`]));
}

/** Greedy tracks so concurrent jobs never draw over each other. */
export function assignLanes<T extends { from: Date; to: Date }>(
  items: readonly T[],
): (T & { lane: number })[] {
  const laneEnds: number[] = [];
  return [...items]
    .sort((a, b) => a.from.getTime() - b.from.getTime())
    .map((item) => {
      let lane = laneEnds.findIndex((end) => end <= item.from.getTime());
      if (lane < 0) lane = laneEnds.push(0) - 1;
      laneEnds[lane] = item.to.getTime();
      return { ...item, lane };
    });
}

export function punchRows(card: Timecard): PunchRow[] {
  const byId = new Map(card.punches.map((punch) => [punch.id, punch]));
  const notCounted = new Map(card.anomalies.map((anomaly) => [anomaly.punchId, anomaly.reason]));
  const lines = jobLinesOf(card);
  // A voiding row only takes the punch it names out of the count: it shows on that punch, not as one.
  return card.punches
    .filter((punch) => !punch.voids)
    .sort(
      (a, b) =>
        ms(a.at) - ms(b.at) ||
        SAME_INSTANT_ORDER[a.kind] - SAME_INSTANT_ORDER[b.kind] ||
        ms(a.recordedAt) - ms(b.recordedAt),
    )
    .map((punch) => ({
      punch,
      replacedBy: punch.supersededBy ? (byId.get(punch.supersededBy) ?? null) : null,
      replaces: punch.supersedes ? (byId.get(punch.supersedes) ?? null) : null,
      correction: punch.reason !== null,
      notCounted: notCounted.get(punch.id) ?? null,
      job: punch.jobLineId === null ? null : (lines.get(punch.jobLineId) ?? `Job line ${punch.jobLineId}`),
    }));
}

export function cardIntervals(card: Timecard): CardInterval[] {
  const plain = (kind: IntervalKind, interval: { from: string; to: string; open: boolean }) => ({
    kind,
    from: new Date(interval.from),
    to: new Date(interval.to),
    open: interval.open,
    label: null,
    jobLineId: null,
    lane: 0,
    credit: null,
  });
  const jobs = assignLanes(
    card.jobs.map((job) => ({
      kind: 'job' as const,
      from: new Date(job.from),
      to: new Date(job.to),
      open: job.open,
      label: `RO ${job.repairOrderNumber} · ${job.title}`,
      jobLineId: job.jobLineId,
      credit: { seconds: job.seconds, counted: job.countedSeconds },
    })),
  );
  return [
    ...card.shifts.map((shift) => plain('shift', shift)),
    ...card.breaks.map((item) => plain(item.kind, item)),
    ...jobs,
  ].sort((a, b) => a.from.getTime() - b.from.getTime() || kindOrder(a.kind) - kindOrder(b.kind));
}

const kindOrder = (kind: IntervalKind) => ['shift', 'meal', 'rest', 'job'].indexOf(kind);

/** The card split into its seven workdays, punches and intervals placed where they happened. */
export function cardDays(card: Timecard): CardDay[] {
  const bounds = workdayBounds(card);
  const rows = punchRows(card);
  const intervals = cardIntervals(card);
  return card.days.map((day, index) => {
    const { from, to } = bounds[index]!;
    const punches = rows.filter((row) => dayIndexOf(ms(row.punch.at), bounds) === index);
    const own = intervals.filter((interval) => dayIndexOf(interval.from.getTime(), bounds) === index);
    const covering = intervals
      .filter((interval) => interval.to > from && interval.from < to)
      .map((interval) => ({
        ...interval,
        from: new Date(Math.max(interval.from.getTime(), from.getTime())),
        to: new Date(Math.min(interval.to.getTime(), to.getTime())),
      }));
    const { day: key, ...totals } = day;
    return {
      day: key,
      from,
      to,
      totals,
      punches,
      intervals: own,
      covering,
      active: punches.length > 0 || covering.length > 0 || totals.attendanceSeconds > 0,
    };
  });
}

/**
 * A job interval's credit when the split rule shared it with other lines (it is credited less than it
 * ran), or null: under an even split the shares of a day add up to its time on jobs.
 */
export function sharedCredit(interval: Pick<CardInterval, 'credit'>): CardInterval['credit'] {
  const { credit } = interval;
  // A share that reads as the whole length at the card's precision would say nothing.
  return credit && formatHours(credit.counted) !== formatHours(credit.seconds) ? credit : null;
}

/**
 * Seconds the day's jobs ran at the same time: each job's own span counts them, "On jobs" once, and the
 * shop's split rule shares them between the lines.
 */
export function overlappedJobSeconds(day: Pick<CardDay, 'covering' | 'totals'>): number {
  const spans = day.covering
    .filter((interval) => interval.kind === 'job')
    .reduce((sum, job) => sum + (job.to.getTime() - job.from.getTime()) / 1000, 0);
  return Math.max(0, Math.round(spans - day.totals.clockedSeconds));
}

export interface TimelineWindow {
  /** Minutes after the workday's start. */
  startMinute: number;
  endMinute: number;
}

const DEFAULT_WINDOW: TimelineWindow = { startMinute: 7 * 60, endMinute: 17 * 60 };
const MIN_SPAN_MINUTES = 8 * 60;

/** One time axis for the whole week: whole hours around everything that happened, at least 8 h. */
export function timelineWindow(days: readonly CardDay[]): TimelineWindow {
  let start = Infinity;
  let end = -Infinity;
  for (const day of days)
    for (const interval of day.covering) {
      start = Math.min(start, (interval.from.getTime() - day.from.getTime()) / 60_000);
      end = Math.max(end, (interval.to.getTime() - day.from.getTime()) / 60_000);
    }
  if (!Number.isFinite(start)) return DEFAULT_WINDOW;
  let startMinute = Math.max(0, Math.floor(start / 60) * 60);
  let endMinute = Math.min(24 * 60, Math.ceil(end / 60) * 60);
  if (endMinute - startMinute < MIN_SPAN_MINUTES) {
    const missing = MIN_SPAN_MINUTES - (endMinute - startMinute);
    startMinute = Math.max(0, startMinute - Math.ceil(missing / 120) * 60);
    endMinute = Math.min(24 * 60, startMinute + MIN_SPAN_MINUTES);
  }
  return { startMinute, endMinute };
}

export interface TimelineSegment extends CardInterval {
  /** Percent of the window from the left edge, and wide. */
  left: number;
  width: number;
}

/** Where each of a day's intervals sits on the week's time axis; parts outside the window are cut. */
export function timelineSegments(day: CardDay, window: TimelineWindow): TimelineSegment[] {
  const span = window.endMinute - window.startMinute;
  const toPercent = (instant: Date) => {
    const minute = (instant.getTime() - day.from.getTime()) / 60_000;
    return (Math.min(Math.max(minute, window.startMinute), window.endMinute) - window.startMinute) / span;
  };
  return day.covering
    .map((interval) => {
      const left = toPercent(interval.from) * 100;
      return { ...interval, left, width: toPercent(interval.to) * 100 - left };
    })
    .filter((segment) => segment.width > 0);
}

/** Job lines to offer for a punch: those on the card first, then the open ones, each once. */
export function jobLineChoices(card: Timecard, open: readonly JobLineRef[]): JobLineRef[] {
  const seen = new Set<number>();
  const choices: JobLineRef[] = [];
  for (const [jobLineId, label] of jobLinesOf(card)) {
    seen.add(jobLineId);
    choices.push({ jobLineId, label });
  }
  for (const line of open) if (!seen.has(line.jobLineId)) choices.push(line);
  return choices;
}
