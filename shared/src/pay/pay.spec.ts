import { describe, expect, it } from 'vitest';
import type { PayRules } from '../shop/shop.schema.js';
import { centsFor, divideRoundHalfUp, hoursOf, secondsOf } from './money.js';
import {
  additionalOvertimeCents,
  applicableMinimumWageCents,
  californiaMealMissed,
  californiaOvertime,
  californiaRestPeriods,
  estimateWeeklyPay,
  payableBelowMinimumWageCaution,
  type PayDay,
  type PayWeekInput,
} from './pay.js';
import type { PayRate } from './pay-types.js';

const H = 3600;
const federal: PayRules = {
  overtimeRules: 'federal',
  minimumWageCents: 725,
  localMinimumWageCents: null,
  payNonProductiveSeparately: true,
};
const california: PayRules = { ...federal, overtimeRules: 'california', minimumWageCents: 10_00 };
const flat = (flatRateCents: number, hourlyRateCents = 0): PayRate => ({
  payType: 'flat-rate',
  flatRateCents,
  hourlyRateCents,
  guaranteeCents: 0,
  overtimeExempt: false,
});
const hourly = (hourlyRateCents: number): PayRate => ({ ...flat(0, hourlyRateCents), payType: 'hourly' });
/** A day of `hours` with 30-minute meals after 4 and (past 10 h) 9 hours of work. */
const day = (hours: number, restSeconds = 0): PayDay => ({
  workedSeconds: hours * H,
  restSeconds,
  meals: [4, 9]
    .filter((after) => hours > after + 1)
    .map((after) => ({ afterWorkedSeconds: after * H, seconds: 30 * 60 })),
});
const week = (input: Partial<PayWeekInput> & Pick<PayWeekInput, 'rate'>): PayWeekInput => ({
  rules: federal,
  flaggedSeconds: 0,
  workedSeconds: 0,
  productiveSeconds: 0,
  restSeconds: 0,
  days: [],
  ...input,
});

describe(estimateWeeklyPay.name, () => {
  // 29 CFR 778.111(a), pieceworker: 50 h worked; $491.00 piece pay for 46 productive h; 4 h waiting at $8.00
  // → straight time $523.00, regular rate $523.00 ÷ 50 = $10.46, premium 10 × $5.23 = $52.30, total $575.30
  // (= 40 × $10.46 + 10 × $15.69). Piece pay modelled as 49.1 flagged h × $10.
  it('pays 29 CFR 778.111(a): $575.30', () => {
    const pay = estimateWeeklyPay(
      week({
        rate: flat(10_00, 8_00),
        flaggedSeconds: secondsOf(49.1),
        workedSeconds: 50 * H,
        productiveSeconds: 46 * H,
      }),
    );
    expect(pay).toMatchObject({
      flaggedPayCents: 491_00,
      guaranteeTopUpCents: 0,
      otherNonProductiveSeconds: 4 * H,
      nonProductivePayCents: 32_00,
      straightTimeCents: 523_00,
      regularRateCents: 10_46,
      overtimeSeconds: 10 * H,
      doubleTimeSeconds: 0,
      overtimePremiumCents: 52_30,
      minimumWageTopUpCents: 0,
      mealPremiumCents: 0,
      totalCents: 575_30,
    });
    expect(pay.totalCents).toBe(40 * 10_46 + 10 * 15_69);
  });

  // 29 CFR 778.111(b), a minimum hourly guarantee of $11/h for productive time: 46 × $11 = $506 replaces
  // $491; 6 overtime hours, no waiting time → premium 6 × $5.50, total $539 (= 40 × $11 + 6 × $16.50).
  it('pays 29 CFR 778.111(b) with the flat-rate-guarantee pay type: $539', () => {
    const rate: PayRate = { ...flat(10_00), payType: 'flat-rate-guarantee', guaranteeCents: 11_00 };
    const pay = estimateWeeklyPay(
      week({ rate, flaggedSeconds: secondsOf(49.1), workedSeconds: 46 * H, productiveSeconds: 46 * H }),
    );
    expect(pay).toMatchObject({
      flaggedPayCents: 491_00,
      guaranteeTopUpCents: 15_00,
      straightTimeCents: 506_00,
      regularRateCents: 11_00,
      overtimeSeconds: 6 * H,
      overtimePremiumCents: 6 * 5_50,
      totalCents: 539_00,
    });
    expect(pay.totalCents).toBe(40 * 11_00 + 6 * 16_50);
  });

  // 29 CFR 778.111(b): waiting time is paid at its own rate on top of the guaranteed piece pay. By hand:
  // 40 h productive × $11 = $440 > 30 flagged h × $12 = $360; 2 h waiting × $9 = $18; 42 h, regular rate
  // $458 ÷ 42 = $10.9048, premium 2 × $5.4524 = $10.90; total $468.90.
  it('adds waiting time at its own rate under the guarantee', () => {
    const rate: PayRate = { ...flat(12_00, 9_00), payType: 'flat-rate-guarantee', guaranteeCents: 11_00 };
    const pay = estimateWeeklyPay(
      week({
        rate,
        rules: { ...federal, payNonProductiveSeparately: false },
        flaggedSeconds: 30 * H,
        workedSeconds: 42 * H,
        productiveSeconds: 40 * H,
      }),
    );
    expect(pay).toMatchObject({
      guaranteeTopUpCents: 80_00,
      nonProductivePayCents: 18_00,
      totalCents: 468_90,
    });
  });

  // 29 USC 207(a)(1): time and a half over 40 hours. By hand: 45 h × $20 = $900 + 5 × $10 = $950.
  it('pays the hourly pay type for every hour worked', () => {
    const pay = estimateWeeklyPay(
      week({ rate: hourly(20_00), workedSeconds: 45 * H, productiveSeconds: 30 * H }),
    );
    expect(pay).toMatchObject({
      flaggedPayCents: 0,
      hourlyPayCents: 900_00,
      nonProductivePayCents: 0,
      regularRateCents: 20_00,
      overtimePremiumCents: 50_00,
      totalCents: 950_00,
    });
  });

  // 29 USC 206(a)(1)(C): $7.25/h for all hours worked, piece rate included: 30 × $7.25 = $217.50.
  it('tops weekly pay up to the federal minimum wage for all hours worked', () => {
    const pay = estimateWeeklyPay(
      week({ rate: flat(20_00), flaggedSeconds: 10 * H, workedSeconds: 30 * H, productiveSeconds: 30 * H }),
    );
    expect(pay.minimumWageTopUpCents).toBe(30 * 7_25 - 200_00);
    expect(pay.regularRateCents).toBe(7_25);
    expect(pay.totalCents).toBe(217_50);
  });

  // 29 USC 218(a) (from memory): the FLSA does not excuse a higher state or local minimum wage, so the
  // highest figure applies. By hand: 10 h × $12 = $120, floor 10 × $16.50 = $165 → top-up $45.
  it('applies the highest of the federal, state and local minimum wages', () => {
    const rules = { ...federal, minimumWageCents: 10_00, localMinimumWageCents: 16_50 };
    expect(applicableMinimumWageCents(rules)).toBe(16_50);
    expect(applicableMinimumWageCents({ minimumWageCents: 5_00, localMinimumWageCents: null })).toBe(7_25);
    const pay = estimateWeeklyPay(week({ rate: hourly(12_00), rules, workedSeconds: 10 * H }));
    expect(pay).toMatchObject({ minimumWageCents: 16_50, minimumWageTopUpCents: 45_00, totalCents: 165_00 });
  });

  // 29 USC 213(b)(10)(A) exempts such mechanics from overtime only; 29 CFR 779.372: the minimum wage
  // still applies. By hand: 20 × $15 = $300 < 50 × $7.25 = $362.50.
  it('pays an exempt mechanic no overtime premium but still the minimum wage', () => {
    const pay = estimateWeeklyPay(
      week({
        rate: { ...flat(15_00), overtimeExempt: true },
        flaggedSeconds: 20 * H,
        workedSeconds: 50 * H,
        productiveSeconds: 50 * H,
      }),
    );
    expect(pay).toMatchObject({ overtimeSeconds: 0, overtimePremiumCents: 0, minimumWageTopUpCents: 62_50 });
    expect(pay.totalCents).toBe(50 * 7_25);
  });

  // 29 CFR 778.104: each workweek stands alone; 30 h then 50 h still owes overtime in the second.
  it('judges each workweek alone', () => {
    const pay = (hours: number) => estimateWeeklyPay(week({ rate: hourly(20_00), workedSeconds: hours * H }));
    expect(pay(30).overtimeSeconds).toBe(0);
    expect(pay(50)).toMatchObject({ overtimeSeconds: 10 * H, overtimePremiumCents: 10 * 10_00 });
  });

  // Common practice (a shop's choice): idle time unpaid apart, the minimum-wage floor still holding.
  it('leaves non-productive time unpaid when the shop does not pay it separately', () => {
    const pay = estimateWeeklyPay(
      week({
        rate: flat(25_00, 15_00),
        rules: { ...federal, payNonProductiveSeparately: false },
        flaggedSeconds: 30 * H,
        workedSeconds: 40 * H,
        productiveSeconds: 32 * H,
      }),
    );
    expect(pay).toMatchObject({ nonProductivePayCents: 0, straightTimeCents: 750_00, totalCents: 750_00 });
  });

  // 29 CFR 778.119 (from memory), by analogy: of 40 flagged h × $20 = $800 paid this week, 10 h ($200) is
  // allocated to an earlier week; this week's regular rate is $600 ÷ 45 h = $13.33, premium 5 h × $6.667 =
  // $33.33 (by hand), while the full $800 is paid.
  it('leaves flat-rate pay allocated to earlier weeks out of the regular rate', () => {
    const pay = estimateWeeklyPay(
      week({
        rate: flat(20_00),
        flaggedSeconds: 40 * H,
        earlierWeeksFlaggedSeconds: 10 * H,
        workedSeconds: 45 * H,
        productiveSeconds: 45 * H,
      }),
    );
    expect(pay).toMatchObject({
      straightTimeCents: 800_00,
      regularRateCents: 13_33,
      overtimePremiumCents: 33_33,
    });
  });

  it('refuses fractions of a second', () => {
    expect(() => estimateWeeklyPay(week({ rate: hourly(10_00), workedSeconds: 10.5 }))).toThrow(
      'Pay is worked out from whole, non-negative seconds',
    );
  });

  describe('California rules', () => {
    // Labor Code 510(a), worked example of a general overtime guide (arithmetic checked): $25/h; Mon 10,
    // Tue 8, Wed 13, Thu 8, Fri 8 = 47 h → $1,000 + 6 h × 1.5 ($225) + 1 h × 2 ($50) = $1,275.
    it('pays daily overtime and double time: $1,275', () => {
      const hours = [10, 8, 13, 8, 8, 0, 0];
      const pay = estimateWeeklyPay(
        week({
          rate: hourly(25_00),
          rules: california,
          workedSeconds: 47 * H,
          days: hours.map((h) => day(h)),
        }),
      );
      expect(pay).toMatchObject({
        overtimeSeconds: 7 * H,
        doubleTimeSeconds: H,
        overtimePremiumCents: 100_00,
        mealPremiumDays: 0,
        totalCents: 1275_00,
      });
    });

    // DIR AB 1513 FAQ (Labor Code 226.2): 40 h; 16 h paid hourly at $10 with 0.67 h of rest in them; $300
    // piece pay; 1.67 h rest in all → ($300 + $160 − $6.70) ÷ 38.33 h = $11.83/h for rest periods. Here the
    // rest is two punched rests a day on the two hourly days and credited (IWC wage orders §12) on the three
    // piece-rate days: 10 × 10 min = 1.6667 h. By hand: other time 15.3333 h × $10 = $153.33; rest rate
    // ($300 + $153.33) ÷ 38.3333 h = $11.826 → $11.83; rest pay 1.6667 h × $11.826 = $19.71; total $473.04.
    it('pays rest periods at the average hourly rate: $11.83', () => {
      const days = [day(8, 1200), day(8, 1200), day(8), day(8), day(8), day(0), day(0)];
      const pay = estimateWeeklyPay(
        week({
          rate: flat(15_00, 10_00),
          rules: california,
          flaggedSeconds: 20 * H,
          workedSeconds: 40 * H,
          productiveSeconds: 24 * H,
          restSeconds: 2400,
          days,
        }),
      );
      expect(pay).toMatchObject({
        flaggedPayCents: 300_00,
        restSeconds: 6000,
        restRateCents: 11_83,
        restPayCents: 19_71,
        otherNonProductiveSeconds: 16 * H - 2400,
        otherNonProductivePayCents: 153_33,
        minimumWageTopUpCents: 0,
        overtimeSeconds: 0,
        totalCents: 473_04,
      });
    });

    // DIR AB 1513 FAQ, first example (from a law firm's copy of the FAQ): piece pay only, $500, 40 h,
    // 1.67 h rest → $500 ÷ 38.33 = $13.04/h. The FAQ's rest pay $21.78 multiplies the rounded 1.67 h by the
    // rounded rate; from whole seconds it is 100 min × $500 ÷ 2,300 min = $21.74, week $521.74 (by hand).
    it('credits unpunched rest on a piece-rate-only week: $13.04', () => {
      const pay = estimateWeeklyPay(
        week({
          rate: flat(20_00),
          rules: california,
          flaggedSeconds: 25 * H,
          workedSeconds: 40 * H,
          productiveSeconds: 40 * H,
          days: [day(8), day(8), day(8), day(8), day(8)],
        }),
      );
      expect(pay).toMatchObject({
        restSeconds: 6000,
        restRateCents: 13_04,
        restPayCents: 21_74,
        totalCents: 521_74,
      });
    });

    // Labor Code 226.2(a)(4) (text checked in a public copy): other non-productive time at no less than the
    // minimum wage, so piece pay may not be averaged over it. By hand: 10 h × $16.50 = $165; productive
    // 30 h less 10 × 10 min credited rest = 28.3333 h × $16.50 = $467.50 > $200 → top-up $267.50.
    it('pays non-productive time at least the minimum wage and floors piece pay on productive hours', () => {
      const pay = estimateWeeklyPay(
        week({
          rate: flat(20_00),
          rules: { ...california, minimumWageCents: 16_50 },
          flaggedSeconds: 10 * H,
          workedSeconds: 40 * H,
          productiveSeconds: 30 * H,
          days: [day(8), day(8), day(8), day(8), day(8)],
        }),
      );
      expect(pay.otherNonProductivePayCents).toBe(10 * 16_50);
      expect(pay.minimumWageTopUpCents).toBe(467_50 - 200_00);
    });

    // Labor Code 512(a) and 226.7(c) (from memory): more than 5 h of work need a 30-minute meal begun by the
    // end of the fifth hour (waivable by consent up to 6 h); one hour of pay at the regular rate per day
    // without it. By hand: 8 h × $20 = $160 + one premium hour $20 = $180.
    it('estimates a meal premium for a day with no meal', () => {
      const noMeal: PayDay = { workedSeconds: 8 * H, restSeconds: 0, meals: [] };
      const pay = estimateWeeklyPay(
        week({ rate: hourly(20_00), rules: california, workedSeconds: 8 * H, days: [noMeal] }),
      );
      expect(pay).toMatchObject({ mealPremiumDays: 1, mealPremiumCents: 20_00, totalCents: 180_00 });
      expect(
        estimateWeeklyPay(week({ rate: hourly(20_00), workedSeconds: 8 * H, days: [noMeal] })),
      ).toMatchObject({ mealPremiumDays: 0, totalCents: 160_00 });
    });

    // 29 USC 213(b)(10)(A) is federal: California's daily overtime still applies. 9 h × $20 + 1 × $10.
    it('keeps the California overtime of a federally exempt mechanic', () => {
      const pay = estimateWeeklyPay(
        week({
          rate: { ...hourly(20_00), overtimeExempt: true },
          rules: california,
          workedSeconds: 9 * H,
          days: [day(9)],
        }),
      );
      expect(pay.overtimePremiumCents).toBe(10_00);
    });
  });
});

describe(californiaMealMissed.name, () => {
  // Labor Code 512(a) (from memory): a meal of not less than 30 minutes, begun by the end of the fifth hour.
  it.each([
    ['no meal in 8 h', { workedSeconds: 8 * H, restSeconds: 0, meals: [] }, true],
    ['no meal in 6 h (waivable)', { workedSeconds: 6 * H, restSeconds: 0, meals: [] }, false],
    [
      'a 20-minute meal',
      { workedSeconds: 8 * H, restSeconds: 0, meals: [{ afterWorkedSeconds: 4 * H, seconds: 1200 }] },
      true,
    ],
    [
      'a meal after 5½ h',
      { workedSeconds: 8 * H, restSeconds: 0, meals: [{ afterWorkedSeconds: 5.5 * H, seconds: 1800 }] },
      true,
    ],
    [
      'a proper meal',
      { workedSeconds: 8 * H, restSeconds: 0, meals: [{ afterWorkedSeconds: 5 * H, seconds: 1800 }] },
      false,
    ],
    [
      'one meal in 13 h',
      { workedSeconds: 13 * H, restSeconds: 0, meals: [{ afterWorkedSeconds: 4 * H, seconds: 1800 }] },
      true,
    ],
  ] as [string, PayDay, boolean][])('%s → %s', (_, payDay, missed) => {
    expect(californiaMealMissed(payDay)).toBe(missed);
  });
});

describe(californiaRestPeriods.name, () => {
  // IWC wage orders §12(A): 10 minutes per 4 hours or major fraction; none under 3½ h. 3½–6 h: 1,
  // over 6–10 h: 2, over 10–14 h: 3 (Brinker, 2012; from memory).
  it.each([
    [3.5 * H - 1, 0],
    [3.5 * H, 1],
    [6 * H, 1],
    [6 * H + 1, 2],
    [10 * H, 2],
    [10 * H + 1, 3],
  ])('%i s of work authorize %i rest periods', (seconds, periods) => {
    expect(californiaRestPeriods(seconds)).toBe(periods);
  });
});

describe(californiaOvertime.name, () => {
  // Labor Code 510(a), a general study guide example: six 9-hour days (54 h) → 14 overtime hours.
  it('counts six 9-hour days as 14 overtime hours, daily overtime not counted twice', () => {
    expect(californiaOvertime([9, 9, 9, 9, 9, 9, 0].map((h) => h * H))).toEqual({
      timeAndHalfSeconds: 14 * H,
      doubleTimeSeconds: 0,
    });
  });

  // Labor Code 510(a): the seventh consecutive workday pays 1.5× for its first 8 h and 2× beyond.
  it('applies the seventh-day rule only when all seven days are worked', () => {
    const seconds = (hours: number[]) => californiaOvertime(hours.map((h) => h * H));
    expect(seconds([8, 8, 8, 8, 8, 8, 10])).toEqual({ timeAndHalfSeconds: 16 * H, doubleTimeSeconds: 2 * H });
    expect(seconds([4, 4, 4, 4, 4, 4, 4])).toEqual({ timeAndHalfSeconds: 4 * H, doubleTimeSeconds: 0 });
    expect(seconds([0, 8, 8, 8, 8, 8, 6])).toEqual({ timeAndHalfSeconds: 6 * H, doubleTimeSeconds: 0 });
  });
});

// 29 USC 206(a)(1)(C): $7.25 an hour for all hours worked. 29 CFR 531.35 (from memory): wages are paid "free and
// clear", so a deduction may not cut pay below the minimum wage. A week with 5.5 h worked, a week
// total of $40.01 and −$75.00 for an earlier, closed week: payable −$34.99 against 5.5 h × $7.25 = $39.875 →
// $39.88 (half a cent up).
describe(payableBelowMinimumWageCaution.name, () => {
  it('cautions when a deduction for earlier weeks takes the payable amount below the minimum wage', () => {
    expect(
      payableBelowMinimumWageCaution(
        { payableCents: -34_99, adjustmentCents: -75_00, workedSeconds: 5.5 * H },
        7_25,
      ),
    ).toBe(
      'Payable -$34.99 is below the minimum wage for 5.5 h worked ($39.88 at $7.25 an hour) after an adjustment ' +
        'of -$75.00 from earlier weeks: confirm with payroll before paying; deductions may not cut pay below the ' +
        'minimum wage (29 CFR 531.35). Pay figures are estimates: confirm them with local wage law and your ' +
        'payroll provider.',
    );
  });

  it('calls a payable amount negative when the week has no hours to set a minimum against', () => {
    expect(
      payableBelowMinimumWageCaution(
        { payableCents: -63_37, adjustmentCents: -63_37, workedSeconds: 0 },
        7_25,
      ),
    ).toBe(
      'Payable -$63.37 is negative after an adjustment of -$63.37 from earlier weeks, with no hours worked this ' +
        'week: confirm with payroll before paying; deductions may not cut pay below the minimum wage (29 CFR ' +
        '531.35). Pay figures are estimates: confirm them with local wage law and your payroll provider.',
    );
  });

  it('says nothing at or above the minimum wage for the hours worked', () => {
    const worked = { adjustmentCents: -10_00, workedSeconds: 5.5 * H };
    expect(payableBelowMinimumWageCaution({ ...worked, payableCents: 39_88 }, 7_25)).toBeNull();
    expect(payableBelowMinimumWageCaution({ ...worked, payableCents: 39_87 }, 7_25)).toMatch(
      /^Payable \$39\.87 is below/,
    );
    expect(
      payableBelowMinimumWageCaution({ payableCents: 0, adjustmentCents: 0, workedSeconds: 0 }, 7_25),
    ).toBeNull();
  });
});

describe(additionalOvertimeCents.name, () => {
  // 29 CFR 778.119 (from memory): a commission computed over several weeks is apportioned to them and each
  // week's regular rate rises by its share ÷ its hours. By hand: $100 over a 50-hour week raises the rate
  // by $2; 10 overtime hours × $1 = $10. With 2 double-time hours of 52: $100 × (0.5 × 10 + 2) ÷ 52 = $13.46.
  it('adds half the rate increase per overtime hour, the whole of it per double-time hour', () => {
    expect(
      additionalOvertimeCents(100_00, {
        workedSeconds: 50 * H,
        timeAndHalfSeconds: 10 * H,
        doubleTimeSeconds: 0,
      }),
    ).toBe(10_00);
    expect(
      additionalOvertimeCents(100_00, {
        workedSeconds: 52 * H,
        timeAndHalfSeconds: 10 * H,
        doubleTimeSeconds: 2 * H,
      }),
    ).toBe(13_46);
    expect(
      additionalOvertimeCents(100_00, { workedSeconds: 30 * H, timeAndHalfSeconds: 0, doubleTimeSeconds: 0 }),
    ).toBe(0);
  });
});

describe('money rounding: whole seconds and cents, half up once (Baytime rule)', () => {
  it('rounds a fraction half up, exactly', () => {
    expect([
      divideRoundHalfUp(5, 2),
      divideRoundHalfUp(-5, 2),
      divideRoundHalfUp(1, 3),
      divideRoundHalfUp(2, 3),
    ]).toEqual([3, -2, 0, 1]);
    // 30 min at $10.01/h = 500.5 cents → 501.
    expect(centsFor(1800, 10_01)).toBe(5_01);
    expect(hoursOf(1)).toBe(0.0003);
    expect(secondsOf(49.1)).toBe(176_760);
    expect(() => divideRoundHalfUp(1.5, 2)).toThrow('Not a whole-number fraction: 1.5 / 2');
  });
});
