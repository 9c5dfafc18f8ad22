import {
  flaggedWhenClosed,
  formatBookHours,
  punchWords,
  type PayReportTechnician,
  type Timecard,
  type TimecardPunch,
  type TimecardTotals,
} from '@baytime/shared';
import { clockTime, localDay } from '@/lib/format';

export interface PunchRow {
  id: string;
  time: string;
  /** "Shift start", "Clock on", "Break start · meal". */
  words: string;
  /** "RO 4497 · Battery and charging system test" for a job punch. */
  detail: string | null;
  /** A later correction replaced it: shown struck through, with the correction's reason. */
  supersededBecause: string | null;
  /** The office took it out of the count without a replacement (it no longer fitted the card). */
  takenOut: boolean;
  /** Someone else recorded it (a correction, or a missed punch added): who and why. */
  note: { kind: 'correction' | 'added'; by: string; reason: string } | null;
  /** It did not fit where it fell and was not counted, with the reason. */
  notCounted: string | null;
}

export interface WeekDay extends TimecardTotals {
  day: string;
  /** "Monday, Nov 30". */
  label: string;
  punches: PunchRow[];
}

export interface WeekView {
  /** "Nov 29 – Dec 5". */
  range: string;
  days: WeekDay[];
  /** Days without any time or punch, by their short names: "Sun, Sat". */
  emptyDays: string[];
}

function dayLabel(day: string, options: Intl.DateTimeFormatOptions): string {
  const [y, m, d] = day.split('-').map(Number) as [number, number, number];
  return new Intl.DateTimeFormat('en-US', { ...options, timeZone: 'UTC' }).format(Date.UTC(y, m - 1, d));
}

/**
 * A timecard as the technician reads it: one block per workday with its punches, each punch on
 * the day its shift began (a shift past midnight stays on one day), corrections beside what they
 * replaced.
 */
export function buildWeekView(card: Timecard): WeekView {
  const { timeZone } = card;
  const jobs = new Map(card.jobs.map((j) => [j.jobLineId, j]));
  const notCounted = new Map(card.anomalies.map((a) => [a.punchId, a.reason]));
  const byId = new Map(card.punches.map((p) => [p.id, p]));
  const shiftStarts = card.shifts.map((s) => ({ from: Date.parse(s.from), to: Date.parse(s.to) }));

  const dayOf = (punch: TimecardPunch): string => {
    const at = Date.parse(punch.at);
    const shift = shiftStarts.find((s) => s.from <= at && at <= s.to);
    return localDay(shift ? shift.from : at, timeZone);
  };

  const rows = new Map<string, PunchRow[]>();
  const sorted = [...card.punches].sort(
    (a, b) => Date.parse(a.at) - Date.parse(b.at) || a.recordedAt.localeCompare(b.recordedAt),
  );
  for (const punch of sorted) {
    // A voiding row only takes the punch it names out of the count: it shows on that punch, not as one.
    if (punch.voids) continue;
    const job = punch.jobLineId === null ? undefined : jobs.get(punch.jobLineId);
    const replacement = punch.supersededBy ? byId.get(punch.supersededBy) : undefined;
    const row: PunchRow = {
      id: punch.id,
      time: clockTime(punch.at, timeZone),
      words: punchWords(punch),
      detail: job ? `RO ${job.repairOrderNumber} · ${job.title}` : null,
      supersededBecause: punch.supersededBy ? (replacement?.reason ?? 'Corrected by the office') : null,
      takenOut: replacement?.voids ?? false,
      note:
        punch.supersedes !== null || punch.reason !== null
          ? {
              kind: punch.supersedes !== null ? 'correction' : 'added',
              by: punch.recordedByName,
              reason: punch.reason ?? '',
            }
          : null,
      notCounted: notCounted.get(punch.id) ?? null,
    };
    const key = dayOf(punch);
    rows.set(key, [...(rows.get(key) ?? []), row]);
  }

  const days: WeekDay[] = [];
  const emptyDays: string[] = [];
  const known = new Set(card.days.map((d) => d.day));
  for (const day of card.days) {
    const punches = rows.get(day.day) ?? [];
    if (punches.length === 0 && day.attendanceSeconds === 0 && day.clockedSeconds === 0) {
      emptyDays.push(dayLabel(day.day, { weekday: 'short' }));
      continue;
    }
    days.push({
      ...day,
      label: dayLabel(day.day, { weekday: 'long', month: 'short', day: 'numeric' }),
      punches,
    });
  }
  // Punches that fall outside the week's days (a shift begun the week before) still show.
  for (const [key, punches] of rows)
    if (!known.has(key))
      days.push({
        day: key,
        label: dayLabel(key, { weekday: 'long', month: 'short', day: 'numeric' }),
        punches,
        attendanceSeconds: 0,
        clockedSeconds: 0,
        idleSeconds: 0,
        mealBreakSeconds: 0,
        restBreakSeconds: 0,
      });
  days.sort((a, b) => a.day.localeCompare(b.day));

  const first = localDay(card.from, timeZone);
  const last = localDay(Date.parse(card.to) - 1, timeZone);
  const range = `${dayLabel(first, { month: 'short', day: 'numeric' })} – ${dayLabel(last, { month: 'short', day: 'numeric' })}`;
  return { range, days, emptyDays };
}

const money = new Intl.NumberFormat('en-US', { style: 'currency', currency: 'USD' });

/**
 * The week's figures as the office's reports have them (the very rows of the labour report and the pay
 * summary): flagged and clocked hours, efficiency and, when the shop shows it, the estimated pay.
 */
export function weekFigures(card: Timecard): { label: string; value: string }[] {
  const { labour, pay } = card.summary;
  const figures = [
    { label: 'Flagged', value: formatBookHours(labour.flaggedHours) },
    { label: 'Clocked on jobs', value: formatBookHours(labour.clockedHours) },
    {
      label: 'Efficiency',
      value: labour.efficiency === null ? '–' : `${Math.round(labour.efficiency * 100)}%`,
    },
  ];
  const paidOn = flaggedWhenClosed(card.summary);
  if (paidOn !== null)
    figures.push({ label: 'Flagged when the week closed', value: formatBookHours(paidOn) });
  if (pay) figures.push({ label: 'Estimated pay', value: money.format(pay.payableCents / 100) });
  return figures;
}

type PayableFigures = Pick<
  PayReportTechnician,
  'payableCaution' | 'payableCents' | 'adjustmentCents' | 'hoursWorked'
>;

/**
 * The office's payable caution in a technician's words, or null. Whether there is one is the server's call (the
 * pay row's `payableCaution`): the kiosk only words it, with the figures of the same row.
 */
export function payableNote(pay: PayableFigures | null): string | null {
  if (!pay?.payableCaution) return null;
  const estimate = `this week’s estimated pay (${money.format(pay.payableCents / 100)})`;
  const below =
    pay.hoursWorked > 0
      ? `${estimate} is below the minimum wage for the ${formatBookHours(pay.hoursWorked)} you worked.`
      : `${estimate} is negative, with no hours worked this week.`;
  const said =
    pay.adjustmentCents < 0
      ? `After an adjustment of ${money.format(pay.adjustmentCents / 100)} for an earlier week, ${below}`
      : below.charAt(0).toUpperCase() + below.slice(1);
  return `${said} Ask the office to confirm it with payroll before payday.`;
}
