import { describe, expect, it } from 'vitest';
import { californiaOvertimeHours, estimateWeeklyPay, type PaySettings, type PayWeekInput } from './pay.js';

const federal: PaySettings = {
  minimumWageCents: 725,
  overtimeRules: 'federal',
  payNonProductiveSeparately: true,
};
const california: PaySettings = { ...federal, overtimeRules: 'california' };
const week = (input: Partial<PayWeekInput>): PayWeekInput => ({
  flaggedHours: 0,
  flatRateCents: 0,
  hoursWorked: 0,
  nonProductiveHours: 0,
  restHours: 0,
  hourlyRateCents: 0,
  overtimeExempt: false,
  ...input,
});

describe(estimateWeeklyPay.name, () => {
  // 29 CFR 778.111(a), the regulation's piece-rate example: 50 h worked, $491 piece pay for 46 productive h, 4 h waiting
  // at $8 → $523 straight time, regular rate $10.46, premium 10 × $5.23 = $52.30, total $575.30
  // (= 40 × $10.46 + 10 × $15.69). Piece pay modelled as 49.1 flagged h × $10.
  it('pays 778.111(a) vector A', () => {
    const pay = estimateWeeklyPay(
      week({
        flaggedHours: 49.1,
        flatRateCents: 10_00,
        hoursWorked: 50,
        nonProductiveHours: 4,
        hourlyRateCents: 8_00,
      }),
      federal,
    );
    expect(pay).toEqual({
      flaggedPayCents: 491_00,
      nonProductivePayCents: 32_00,
      straightTimeCents: 523_00,
      hoursWorked: 50,
      regularRateCents: 10_46,
      overtimeHours: 10,
      doubleTimeHours: 0,
      overtimePremiumCents: 52_30,
      minimumWageTopUpCents: 0,
      totalCents: 575_30,
      restRateCents: null,
    });
    expect(pay.totalCents).toBe(40 * 10_46 + 10 * 15_69);
  });

  // 29 CFR 778.111(b), minimum hourly guarantee: a guarantee of $11/h for productive time makes 46 × $11 = $506
  // replace $491; 6 overtime hours, no waiting → premium 6 × $5.50, total $539 (= 40 × $11 + 6 × $16.50).
  // The guarantee is modelled as the shop's minimum hourly setting.
  it('pays 778.111(b) vector B with the hourly guarantee as the floor', () => {
    const pay = estimateWeeklyPay(week({ flaggedHours: 49.1, flatRateCents: 10_00, hoursWorked: 46 }), {
      ...federal,
      minimumWageCents: 11_00,
    });
    expect(pay).toMatchObject({
      straightTimeCents: 491_00,
      minimumWageTopUpCents: 15_00,
      regularRateCents: 11_00,
      overtimeHours: 6,
      overtimePremiumCents: 6 * 5_50,
      totalCents: 539_00,
    });
    expect(pay.totalCents).toBe(40 * 11_00 + 6 * 16_50);
  });

  // 29 USC 206(a)(1)(C): $7.25/h for all hours worked, piece rate included.
  it('tops weekly pay up to the federal minimum wage for all hours worked', () => {
    const pay = estimateWeeklyPay(week({ flaggedHours: 10, flatRateCents: 20_00, hoursWorked: 30 }), federal);
    expect(pay.minimumWageTopUpCents).toBe(30 * 7_25 - 200_00);
    expect(pay.regularRateCents).toBe(7_25);
    expect(pay.totalCents).toBe(217_50);
  });

  it('never floors below the federal $7.25 whatever the setting says', () => {
    const pay = estimateWeeklyPay(week({ hoursWorked: 10 }), { ...federal, minimumWageCents: 5_00 });
    expect(pay.minimumWageTopUpCents).toBe(72_50);
  });

  // 29 USC 213(b)(10)(A) exempts such mechanics from overtime only; 29 CFR 779.372: minimum wage still
  // applies.
  it('pays an exempt mechanic no overtime premium but still the minimum wage', () => {
    const exempt = week({ flaggedHours: 20, flatRateCents: 15_00, hoursWorked: 50, overtimeExempt: true });
    const pay = estimateWeeklyPay(exempt, federal);
    expect(pay).toMatchObject({
      overtimeHours: 0,
      overtimePremiumCents: 0,
      minimumWageTopUpCents: 50 * 7_25 - 300_00,
    });
    expect(pay.totalCents).toBe(50 * 7_25);
  });

  // 29 CFR 778.104: each workweek stands alone; 30 h then 50 h still owes overtime.
  it('judges each workweek alone', () => {
    const hourly = (hoursWorked: number) =>
      estimateWeeklyPay(
        week({ hoursWorked, nonProductiveHours: hoursWorked, hourlyRateCents: 20_00 }),
        federal,
      );
    expect(hourly(30).overtimeHours).toBe(0);
    expect(hourly(50)).toMatchObject({ overtimeHours: 10, overtimePremiumCents: 10 * 10_00 });
  });

  it('leaves non-productive time unpaid when the shop does not pay it separately, the floor still holding', () => {
    const input = week({
      flaggedHours: 30,
      flatRateCents: 25_00,
      hoursWorked: 40,
      nonProductiveHours: 8,
      hourlyRateCents: 15_00,
    });
    const pay = estimateWeeklyPay(input, { ...federal, payNonProductiveSeparately: false });
    expect(pay).toMatchObject({ nonProductivePayCents: 0, straightTimeCents: 750_00, totalCents: 750_00 });
  });

  describe('California rules', () => {
    // Labor Code 510(a) (worked example of a general overtime guide, arithmetic checked):
    // $25/h; Mon 10, Tue 8, Wed 13, Thu 8, Fri 8 = 47 h → $1,000 + 6 h × 1.5 ($225) + 1 h × 2 ($50) = $1,275.
    it('pays daily overtime and double time: $1,275', () => {
      const hourly = week({
        hoursWorked: 47,
        nonProductiveHours: 47,
        hourlyRateCents: 25_00,
        dailyHours: [10, 8, 13, 8, 8, 0, 0],
      });
      const pay = estimateWeeklyPay(hourly, california);
      expect(pay).toMatchObject({
        overtimeHours: 7,
        doubleTimeHours: 1,
        overtimePremiumCents: 100_00,
        totalCents: 1275_00,
      });
    });

    // California DIR AB 1513 FAQ (Labor Code 226.2): 40 h, 16 h hourly at $10 (0.67 h of rest in them),
    // $300 piece pay, 1.67 h rest → ($300 + $160 − $6.70) ÷ 38.33 h = $11.83/h for rest periods.
    it('pays rest periods at the average hourly rate: $11.83', () => {
      const pay = estimateWeeklyPay(
        week({
          flaggedHours: 20,
          flatRateCents: 15_00,
          hoursWorked: 40,
          nonProductiveHours: 16 - 0.67 + 1.67,
          restHours: 1.67,
          hourlyRateCents: 10_00,
          dailyHours: [8, 8, 8, 8, 8, 0, 0],
        }),
        { ...california, minimumWageCents: 10_00 },
      );
      expect(pay.restRateCents).toBe(11_83);
      expect(pay.overtimeHours).toBe(0);
      // FAQ: the hourly days' rest was already paid $10/h, so $1.83/h more is owed there: same total.
      expect(pay.totalCents).toBe(Math.round(300_00 + 160_00 + 1 * 1182.63 + 0.67 * 182.63));
    });

    // DIR AB 1513 FAQ, first example (from a law firm's copy of the FAQ): piece pay only,
    // $500, 40 h, 1.67 h rest → $500 ÷ 38.33 = $13.04/h, rest pay $21.78, week $521.78.
    it('pays rest periods of a piece-rate-only week: $521.78', () => {
      const pay = estimateWeeklyPay(
        week({
          flaggedHours: 25,
          flatRateCents: 20_00,
          hoursWorked: 40,
          nonProductiveHours: 1.67,
          restHours: 1.67,
          dailyHours: [8, 8, 8, 8, 8],
        }),
        california,
      );
      expect(pay).toMatchObject({ restRateCents: 13_04, nonProductivePayCents: 21_78, totalCents: 521_78 });
    });

    // Labor Code 226.2(a)(4) (text checked in a public copy): other non-productive time at no less than
    // the applicable minimum wage, so piece pay may not be averaged over it.
    it('pays non-productive time at least the minimum wage and floors piece pay on productive hours', () => {
      const pay = estimateWeeklyPay(
        week({
          flaggedHours: 10,
          flatRateCents: 20_00,
          hoursWorked: 40,
          nonProductiveHours: 10,
          hourlyRateCents: 0,
          dailyHours: [8, 8, 8, 8, 8],
        }),
        { ...california, minimumWageCents: 16_50 },
      );
      expect(pay.nonProductivePayCents).toBe(10 * 16_50);
      expect(pay.minimumWageTopUpCents).toBe(30 * 16_50 - 200_00);
    });

    it('keeps the California overtime of a federally exempt mechanic', () => {
      const input = week({
        hoursWorked: 9,
        nonProductiveHours: 9,
        hourlyRateCents: 20_00,
        overtimeExempt: true,
        dailyHours: [9],
      });
      expect(estimateWeeklyPay(input, california).overtimePremiumCents).toBe(10_00);
    });

    it('needs the hours of each workday', () => {
      expect(() => estimateWeeklyPay(week({ hoursWorked: 8 }), california)).toThrow(
        'California overtime needs the hours of each workday',
      );
    });
  });
});

describe(californiaOvertimeHours.name, () => {
  // California Labor Code 510(a) (a general study guide's example): six 9-hour days (54 h) → 14 overtime h.
  it('counts six 9-hour days as 14 overtime hours, daily overtime not counted twice', () => {
    expect(californiaOvertimeHours([9, 9, 9, 9, 9, 9, 0])).toEqual({
      timeAndHalfHours: 14,
      doubleTimeHours: 0,
    });
  });

  it('counts hours over 12 in a day as double time', () => {
    expect(californiaOvertimeHours([10, 8, 13, 8, 8, 0, 0])).toEqual({
      timeAndHalfHours: 6,
      doubleTimeHours: 1,
    });
  });

  // Labor Code 510(a): the seventh consecutive workday pays 1.5× for its first 8 h and 2× beyond.
  it('applies the seventh-day rule only when all seven days are worked', () => {
    expect(californiaOvertimeHours([8, 8, 8, 8, 8, 8, 10])).toEqual({
      timeAndHalfHours: 16,
      doubleTimeHours: 2,
    });
    expect(californiaOvertimeHours([4, 4, 4, 4, 4, 4, 4])).toEqual({
      timeAndHalfHours: 4,
      doubleTimeHours: 0,
    });
    expect(californiaOvertimeHours([0, 8, 8, 8, 8, 8, 6])).toEqual({
      timeAndHalfHours: 6,
      doubleTimeHours: 0,
    });
  });
});
