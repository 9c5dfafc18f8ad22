import {
  shortName,
  type KpiName,
  type LabourReport,
  type LabourReportLine,
  type LabourTrendWeek,
  type PayReportTechnician,
} from '@baytime/shared';

export const KPI_NAMES: readonly KpiName[] = ['productivity', 'efficiency', 'proficiency'];

export const KPI_LABELS: Record<KpiName, string> = {
  productivity: 'Productivity',
  efficiency: 'Efficiency',
  proficiency: 'Proficiency',
};

/** A ratio (0.9) as a percentage ("90%"); a dash when there is nothing to divide by. */
export function formatPercent(ratio: number | null, digits = 0): string {
  return ratio === null ? '–' : `${(ratio * 100).toFixed(digits)}%`;
}

/** Decimal hours, as shops count them: "11.4". */
export function formatHours(hours: number, digits = 1): string {
  const rounded = Number(hours.toFixed(digits));
  // Never "-0.0".
  return (rounded === 0 ? 0 : rounded).toFixed(digits);
}

export type GuidelineMark = 'below' | 'within' | 'above';

const plainPercent = (ratio: number) => String(Number((ratio * 100).toFixed(1)));

export function guidelineText(guide: { low: number; high: number }): string {
  return guide.low === guide.high
    ? `${plainPercent(guide.low)}%`
    : `${plainPercent(guide.low)}–${plainPercent(guide.high)}%`;
}

export function versusGuideline(
  ratio: number | null,
  guide: { low: number; high: number },
): GuidelineMark | null {
  if (ratio === null) return null;
  // Compare at the precision the page shows, so "125%" is never called below a 125% guideline.
  const shown = Math.round(ratio * 1000) / 1000;
  if (shown < guide.low) return 'below';
  if (shown > guide.high) return 'above';
  return 'within';
}

export interface RatioBar {
  name: string;
  /** Percent, or null when there was nothing to divide by. */
  value: number | null;
  shop: boolean;
}

/** A bar as drawn: cut at the axis top when it is an outlier; the label keeps the true value. */
export interface DrawnBar extends RatioBar {
  plotted: number | null;
  cut: boolean;
}

/** One chart's bars: each technician's ratio in percent, the shop's last. */
export function ratioBars(report: Pick<LabourReport, 'technicians' | 'shop'>, kpi: KpiName): RatioBar[] {
  const percent = (ratio: number | null) => (ratio === null ? null : Math.round(ratio * 1000) / 10);
  return [
    ...report.technicians.map((tech) => ({
      name: shortName(tech.name),
      value: percent(tech[kpi]),
      shop: false,
    })),
    { name: 'Shop', value: percent(report.shop[kpi]), shop: true },
  ];
}

export interface TrendPoint {
  week: string;
  /** "Nov 29" under the axis: the day the shop week starts. */
  short: string;
  productivity: number | null;
  efficiency: number | null;
  proficiency: number | null;
  attendanceHours: number;
}

export function trendPoints(trend: readonly LabourTrendWeek[]): TrendPoint[] {
  const percent = (ratio: number | null) => (ratio === null ? null : Math.round(ratio * 1000) / 10);
  return trend.map((week) => ({
    week: week.week,
    short: week.weekName.replace(/^Week of [A-Za-z]{3}, /, ''),
    productivity: percent(week.productivity),
    efficiency: percent(week.efficiency),
    proficiency: percent(week.proficiency),
    attendanceHours: week.attendanceHours,
  }));
}

/** A percent axis never runs past this, so one outlier (a line flagged with little time) cannot flatten the rest. */
export const PERCENT_AXIS_CAP = 200;

/**
 * Upper end of a percent axis: room for the highest bar and guideline, in steps of 25, but no higher than
 * PERCENT_AXIS_CAP (or the guideline, if that is higher).
 */
export function percentAxisMax(values: readonly (number | null)[], guidelines: readonly number[]): number {
  const guide = Math.max(100, ...guidelines.map((g) => g * 100));
  const top = Math.max(guide, ...values.filter((v): v is number => v !== null));
  const cap = Math.max(PERCENT_AXIS_CAP, Math.ceil((guide + 5) / 25) * 25);
  return Math.min(cap, Math.ceil((top + 5) / 25) * 25);
}

/** Bars over the axis top are drawn to it, marked as cut; their label keeps the true value. */
export function drawnBars(bars: readonly RatioBar[], max: number): DrawnBar[] {
  return bars.map((bar) => ({
    ...bar,
    plotted: bar.value === null ? null : Math.min(bar.value, max),
    cut: bar.value !== null && bar.value > max,
  }));
}

/** Axis marks every 25 % up to the top. */
export function percentTicks(max: number): number[] {
  return Array.from({ length: Math.floor(max / 25) + 1 }, (_, i) => i * 25);
}

/** Over/under in words: positive when the work beat the book time. */
export function overUnderText(hours: number | null): string {
  if (hours === null) return 'not finished this week';
  if (Math.abs(hours) < 0.05) return 'on book time';
  return hours > 0 ? `${formatHours(hours)} h under book` : `${formatHours(-hours)} h over book`;
}

/** Finished lines first (biggest loss first, where the time went), then the unfinished ones. */
export function sortLines(lines: readonly LabourReportLine[]): LabourReportLine[] {
  return [...lines].sort((a, b) => {
    if ((a.overUnderHours === null) !== (b.overUnderHours === null))
      return a.overUnderHours === null ? 1 : -1;
    return (a.overUnderHours ?? 0) - (b.overUnderHours ?? 0) || b.clockedHours - a.clockedHours;
  });
}

/** 'YYYY-MM-DD' → "Mon 30". */
export function shortDay(day: string): string {
  const [year, month, date] = day.split('-').map(Number);
  const weekday = new Intl.DateTimeFormat('en-US', { weekday: 'short', timeZone: 'UTC' }).format(
    new Date(Date.UTC(year!, month! - 1, date!)),
  );
  return `${weekday} ${date}`;
}

export type PayNoteTone = 'danger' | 'warning' | 'informative';

export interface PayNote {
  text: string;
  tone: PayNoteTone;
}

/** What to look at on a technician's pay line, most serious first. */
export function payNotes(tech: PayReportTechnician): PayNote[] {
  const notes: PayNote[] = [];
  if (tech.unresolvedExceptions > 0)
    notes.push({
      text: `${tech.unresolvedExceptions} exception${tech.unresolvedExceptions === 1 ? '' : 's'} to resolve`,
      tone: 'danger',
    });
  if (tech.underMinimumWage) notes.push({ text: 'Under minimum wage', tone: 'danger' });
  if (tech.payableCaution) notes.push({ text: 'Payable below minimum wage', tone: 'danger' });
  if (tech.overtimeHours > 0)
    notes.push({ text: `Overtime ${formatHours(tech.overtimeHours, 2)} h`, tone: 'warning' });
  else if (tech.nearOvertime) notes.push({ text: 'Near overtime this week', tone: 'warning' });
  if (tech.overtimeExempt) notes.push({ text: 'Exempt from overtime', tone: 'informative' });
  if (tech.additionalOvertimeCents > 0)
    notes.push({ text: 'Overtime owed for earlier weeks', tone: 'informative' });
  if (tech.adjustments.length > 0) notes.push({ text: 'Adjusted for closed weeks', tone: 'informative' });
  return notes;
}

/** The name in a `Content-Disposition` header, or the fallback. */
export function filenameFrom(disposition: string | null, fallback: string): string {
  if (!disposition) return fallback;
  const star = /filename\*\s*=\s*(?:UTF-8'')?([^;]+)/i.exec(disposition);
  if (star?.[1]) {
    try {
      return decodeURIComponent(star[1].trim().replace(/^"|"$/g, ''));
    } catch {
      // fall through to the plain name
    }
  }
  const plain = /filename\s*=\s*("([^"]*)"|[^;]+)/i.exec(disposition);
  const name = (plain?.[2] ?? plain?.[1])?.trim();
  // Never a path: a server name is a file name only.
  return name ? (name.split(/[\\/]/).pop() ?? fallback) : fallback;
}
