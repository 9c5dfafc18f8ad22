import { describe, expect, it } from 'vitest';
import type { LabourReportLine, PayReportTechnician } from '@baytime/shared';
import {
  drawnBars,
  filenameFrom,
  formatHours,
  formatPercent,
  guidelineText,
  overUnderText,
  payNotes,
  percentAxisMax,
  percentTicks,
  ratioBars,
  shortDay,
  sortLines,
  trendPoints,
  versusGuideline,
} from './report-format';

const row = (attendanceHours: number, clockedHours: number, flaggedHours: number) => ({
  attendanceHours,
  clockedHours,
  flaggedHours,
  matchedClockedHours: clockedHours,
  workInProgressHours: 0,
  productivity: attendanceHours ? clockedHours / attendanceHours : null,
  efficiency: clockedHours ? flaggedHours / clockedHours : null,
  proficiency: attendanceHours ? flaggedHours / attendanceHours : null,
});

describe('report formats', () => {
  it('writes ratios as percentages', () => {
    // Dealer association bulletin "Measuring technician performance": 40 h available, 36 h on jobs,
    // 45 h flagged → 90 %, 125 %, 112.5 %.
    const tech = row(40, 36, 45);
    expect(formatPercent(tech.productivity)).toBe('90%');
    expect(formatPercent(tech.efficiency)).toBe('125%');
    expect(formatPercent(tech.proficiency, 1)).toBe('112.5%');
    expect(formatPercent(null)).toBe('–');
    expect(formatHours(11.4195)).toBe('11.4');
    expect(formatHours(-0.01)).toBe('0.0');
  });

  it('writes guidelines as a band or a mark', () => {
    expect(guidelineText({ low: 0.85, high: 0.875 })).toBe('85–87.5%');
    expect(guidelineText({ low: 1.25, high: 1.25 })).toBe('125%');
  });

  it('places a ratio against its guideline', () => {
    const band = { low: 0.85, high: 0.875 };
    expect(versusGuideline(0.84, band)).toBe('below');
    expect(versusGuideline(0.86, band)).toBe('within');
    expect(versusGuideline(0.9, band)).toBe('above');
    expect(versusGuideline(1.2499999, { low: 1.25, high: 1.25 })).toBe('within');
    expect(versusGuideline(null, band)).toBeNull();
  });

  it('shapes one bar per technician and the shop last', () => {
    const noLines = { bookHours: 0, flaggedHours: 0, clockedHours: 0 };
    const bars = ratioBars(
      {
        technicians: [
          { technicianId: 1, name: 'Dana Okafor', lines: [], lineTotals: noLines, ...row(40, 36, 45) },
          { technicianId: 2, name: 'Sam Ortega', lines: [], lineTotals: noLines, ...row(0, 0, 0) },
        ],
        shop: row(40, 36, 45),
      },
      'efficiency',
    );
    expect(bars).toEqual([
      { name: 'Dana O.', value: 125, shop: false },
      { name: 'Sam O.', value: null, shop: false },
      { name: 'Shop', value: 125, shop: true },
    ]);
  });

  it('shapes the trend in percent, each week by the day it starts', () => {
    // Published shop-management article "Time is money — tracking time", 8-tech totals:
    // 86.53 %, 106.08 %, 91.80 %.
    const [point] = trendPoints([
      { week: '2026-W37', weekName: 'Week of Sun, Sep 13', ...row(1483.5, 1283.7, 1361.8) },
    ]);
    expect(point).toMatchObject({
      short: 'Sep 13',
      productivity: 86.5,
      efficiency: 106.1,
      proficiency: 91.8,
    });
  });

  it('leaves room above the highest bar and guideline', () => {
    expect(percentAxisMax([90, 130], [1.25])).toBe(150);
    expect(percentAxisMax([null], [0.875])).toBe(125);
    expect(percentTicks(125)).toEqual([0, 25, 50, 75, 100, 125]);
  });

  it('caps the axis so one outlier does not flatten the others, keeping its true value on the label', () => {
    // One technician at 2,819 % (a line flagged with next to no clocked time) and the rest near 100 %.
    const max = percentAxisMax([95, 110, 2819], [1.25]);
    expect(max).toBe(200);
    expect(drawnBars([{ name: 'Sam O.', value: 2819, shop: false }], max)).toEqual([
      { name: 'Sam O.', value: 2819, shop: false, plotted: 200, cut: true },
    ]);
    expect(percentAxisMax([95], [2.5])).toBe(275);
  });

  it('says over or under book in words', () => {
    expect(overUnderText(0.5833)).toBe('0.6 h under book');
    expect(overUnderText(-1.25)).toBe('1.3 h over book');
    expect(overUnderText(0.01)).toBe('on book time');
    expect(overUnderText(null)).toBe('not finished this week');
  });

  it('orders a technician’s lines', () => {
    const line = (jobLineId: number, overUnderHours: number | null, clockedHours = 1): LabourReportLine => ({
      jobLineId,
      repairOrderNumber: '4500',
      title: 'Line',
      bookHours: 2,
      flaggedHours: overUnderHours === null ? 0 : 2,
      clockedHours,
      overUnderHours,
    });
    const lines = [line(1, 0.5), line(2, null, 3), line(3, -1), line(4, null, 5)];
    expect(sortLines(lines).map((l) => l.jobLineId)).toEqual([3, 1, 4, 2]);
  });

  it('names days short', () => {
    expect(shortDay('2026-11-30')).toBe('Mon 30');
  });

  it('flags pay lines to look at, most serious first', () => {
    const tech = {
      underMinimumWage: true,
      overtimeHours: 0,
      nearOvertime: true,
      overtimeExempt: false,
      unresolvedExceptions: 0,
      additionalOvertimeCents: 0,
      adjustments: [],
      payableCaution: null,
    } as unknown as PayReportTechnician;
    expect(payNotes(tech).map((note) => note.tone)).toEqual(['danger', 'warning']);
    expect(payNotes({ ...tech, unresolvedExceptions: 2 })[0]).toEqual({
      text: '2 exceptions to resolve',
      tone: 'danger',
    });
    expect(payNotes({ ...tech, underMinimumWage: false, overtimeHours: 2.5 }).map((n) => n.text)).toEqual([
      'Overtime 2.50 h',
    ]);
  });

  it('flags a payable amount below the minimum wage after an adjustment', () => {
    const tech = {
      underMinimumWage: false,
      overtimeHours: 0,
      nearOvertime: false,
      overtimeExempt: false,
      unresolvedExceptions: 0,
      additionalOvertimeCents: 0,
      adjustments: [
        {
          technicianId: 11,
          forWeek: '2026-W47',
          forWeekName: 'Week of Sun, Nov 22',
          flaggedHours: -3,
          cents: -75_00,
        },
      ],
      payableCaution: 'Payable -$34.99 is below the minimum wage for 5.5 h worked …',
    } as unknown as PayReportTechnician;
    expect(payNotes(tech)).toEqual([
      { text: 'Payable below minimum wage', tone: 'danger' },
      { text: 'Adjusted for closed weeks', tone: 'informative' },
    ]);
    expect(payNotes({ ...tech, payableCaution: null }).map((n) => n.text)).toEqual([
      'Adjusted for closed weeks',
    ]);
  });

  it('keeps the server’s file name and never a path', () => {
    expect(filenameFrom('attachment; filename="baytime-pay-2026-W48.csv"', 'x.csv')).toBe(
      'baytime-pay-2026-W48.csv',
    );
    expect(filenameFrom("attachment; filename*=UTF-8''labour%20week.csv", 'x.csv')).toBe('labour week.csv');
    expect(filenameFrom('attachment; filename="../../etc/passwd"', 'x.csv')).toBe('passwd');
    expect(filenameFrom(null, 'x.csv')).toBe('x.csv');
  });
});
