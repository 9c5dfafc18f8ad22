import { describe, expect, it } from 'vitest';
import {
  KPI_FORMULAS,
  KPI_GUIDELINES,
  labourHoursOf,
  labourKpis,
  shareFlaggedHours,
  shopLabourKpis,
  shopLabourSeconds,
  type LabourHours,
  type LabourSeconds,
} from './kpis.js';

const hours = (attendanceHours: number, clockedHours: number, flaggedHours: number): LabourHours => ({
  attendanceHours,
  clockedHours,
  flaggedHours,
  matchedClockedHours: clockedHours,
  workInProgressHours: 0,
});

describe(labourKpis.name, () => {
  // NADA definitions via a dealer association bulletin "Measuring technician performance":
  // available 40 h, worked on jobs 36 h, flagged 45 h → 90 %, 125 %, 112.5 %. All lines finished: matched = clocked.
  it('gives 90 %, 125 %, 112.5 % for 40 h available, 36 h clocked, 45 h flagged', () => {
    const kpis = labourKpis(hours(40, 36, 45));
    expect(kpis.productivity).toBeCloseTo(0.9, 12);
    expect(kpis.efficiency).toBeCloseTo(1.25, 12);
    expect(kpis.proficiency).toBeCloseTo(1.125, 12);
    expect(kpis.proficiency).toBeCloseTo(kpis.productivity! * kpis.efficiency!, 12);
  });

  // Common practice (the matched basis; no published source): a 10 h line clocked 6 h last week and
  // 4 h this week, finished this week, is 10 ÷ 10 = 100 % this week, not 10 ÷ 4 = 250 %; 3 h clocked this
  // week on an unfinished line is work in progress, not in the ratio.
  it('divides flagged hours by all the time clocked on the same finished lines', () => {
    const kpis = labourKpis({
      attendanceHours: 8,
      clockedHours: 7,
      flaggedHours: 10,
      matchedClockedHours: 10,
      workInProgressHours: 3,
    });
    expect(kpis).toMatchObject({
      efficiency: 1,
      workInProgressHours: 3,
      productivity: 7 / 8,
      proficiency: 10 / 8,
    });
  });

  it('gives null instead of dividing by zero', () => {
    expect(labourKpis(hours(0, 0, 2))).toMatchObject({
      productivity: null,
      efficiency: null,
      proficiency: null,
    });
  });

  // A tenth of an hour is the unit hours are flagged in: common practice, no source.
  it('takes no ratio over less than a tenth of an hour (30 s on shift is not 12,000 % proficient)', () => {
    const seconds = (n: number) => n / 3600;
    const brief = hours(seconds(30), seconds(20), 1);
    expect(labourKpis(brief)).toMatchObject({ productivity: null, efficiency: null, proficiency: null });
    const tenth = hours(0.1, 0.1, 1);
    expect(labourKpis(tenth)).toMatchObject({ productivity: 1, efficiency: 10, proficiency: 10 });
  });
});

describe(shopLabourKpis.name, () => {
  // 8-tech totals from the shop-management article "Time is money — tracking time":
  // available 1,483.5 h, actual 1,283.7 h, sold 1,361.8 h → 86.53 %, 106.08 %, 91.80 %.
  // The split over eight technicians is invented; only the totals are published.
  it('sums the hours first, then takes the ratios', () => {
    const techs = [
      hours(190, 170, 200),
      hours(185.5, 160.2, 150.3),
      hours(180, 150, 170),
      hours(186, 166.5, 190.5),
      hours(184, 150, 140),
      hours(188, 165, 180),
      hours(185, 162, 171),
      hours(185, 160, 160),
    ];
    const shop = shopLabourKpis(techs);
    expect(shop.attendanceHours).toBeCloseTo(1483.5, 9);
    expect(shop.clockedHours).toBeCloseTo(1283.7, 9);
    expect(shop.flaggedHours).toBeCloseTo(1361.8, 9);
    expect(shop.productivity! * 100).toBeCloseTo(86.53, 2);
    expect(shop.efficiency! * 100).toBeCloseTo(106.08, 2);
    expect(shop.proficiency! * 100).toBeCloseTo(91.8, 2);
  });

  it('weights technicians by their hours, not by head', () => {
    const shop = shopLabourKpis([hours(40, 40, 60), hours(10, 10, 5)]);
    expect(shop.efficiency).toBeCloseTo(65 / 50, 12); // the mean of ratios would be 1.0
  });
});

describe(shopLabourSeconds.name, () => {
  const week = (attendanceSeconds: number, flaggedSeconds: number): LabourSeconds => ({
    attendanceSeconds,
    clockedSeconds: attendanceSeconds,
    flaggedSeconds,
    matchedClockedSeconds: attendanceSeconds,
    workInProgressSeconds: 0,
  });

  it('adds whole seconds, so three weeks of 2 h 5 min make 6.25 h, not 3 × 2.0833 = 6.2499', () => {
    // 7,500 s = 2 h 5 min; 3 × 7,500 = 22,500 s = 6.25 h exactly. Flagged 2.5 h = 9,000 s each: 7.5 h.
    const shop = shopLabourSeconds([week(7_500, 9_000), week(7_500, 9_000), week(7_500, 9_000)]);
    expect(shop).toEqual(week(22_500, 27_000));
    expect(labourHoursOf(shop)).toMatchObject({ attendanceHours: 6.25, flaggedHours: 7.5 });
    // 7.5 ÷ 6.25 = 1.2.
    expect(labourKpis(labourHoursOf(shop))).toMatchObject({ productivity: 1, proficiency: 1.2 });
  });
});

describe('KPI guidelines and formulas', () => {
  // NADA guidelines via the dealer association bulletin "Measuring technician performance": productivity
  // 85–87.5 %, efficiency 125 %, proficiency 100 %.
  it('holds the published guidelines', () => {
    expect(KPI_GUIDELINES).toEqual({
      productivity: { low: 0.85, high: 0.875 },
      efficiency: { low: 1.25, high: 1.25 },
      proficiency: { low: 1, high: 1 },
    });
  });

  it('spells out each formula for the report page', () => {
    expect(KPI_FORMULAS.productivity).toMatch(/clocked job hours ÷ attendance hours/);
    expect(KPI_FORMULAS.efficiency).toMatch(
      /lines finished this week ÷ all the hours clocked on those same lines/,
    );
    expect(KPI_FORMULAS.proficiency).toMatch(/flagged hours ÷ attendance hours/);
  });
});

describe(shareFlaggedHours.name, () => {
  // Sharing by clocked time is common practice, no published source.
  it('splits book hours by clocked seconds', () => {
    const shares = shareFlaggedHours(
      3,
      new Map([
        [1, 3600],
        [2, 1800],
        [3, 0],
      ]),
      1,
    );
    expect(shares).toEqual(
      new Map([
        [1, 2],
        [2, 1],
      ]),
    );
  });

  it('flags an unclocked line to its assigned technician, or to nobody', () => {
    expect(shareFlaggedHours(1.5, new Map(), 4)).toEqual(new Map([[4, 1.5]]));
    expect(shareFlaggedHours(1.5, new Map([[2, 0]]), null)).toEqual(new Map());
  });
});
