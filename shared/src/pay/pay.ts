import type { PayRules } from '../shop/shop.schema.js';
import { centsFor, divideRoundHalfUp, HOUR_SECONDS } from './money.js';
import type { PayRate, PayType } from './pay-types.js';

/** 29 USC 206(a)(1)(C). */
export const FEDERAL_MINIMUM_WAGE_CENTS = 725;

export const PAY_ESTIMATE_CAUTION =
  'These figures are an estimate. Confirm them against federal, state and local wage law, your payroll ' +
  'provider and licensed advice before paying anyone.';

/** 29 USC 207(a)(1): overtime after 40 hours in the workweek. */
const WEEKLY_LIMIT_S = 40 * HOUR_SECONDS;
const DAILY_LIMIT_S = 8 * HOUR_SECONDS;
const DOUBLE_TIME_DAILY_S = 12 * HOUR_SECONDS;
/** IWC wage orders §12: 10 minutes net rest per 4 hours worked or major fraction thereof. */
const REST_PER_PERIOD_S = 10 * 60;
/** Labor Code 512(a): a meal period of not less than 30 minutes. */
const CALIFORNIA_MEAL_S = 30 * 60;

/** The highest of the federal, state and local minimum wages in force. */
export function applicableMinimumWageCents(
  rules: Pick<PayRules, 'minimumWageCents' | 'localMinimumWageCents'>,
): number {
  return Math.max(FEDERAL_MINIMUM_WAGE_CENTS, rules.minimumWageCents, rules.localMinimumWageCents ?? 0);
}

/** What a week's payable amount is checked against the minimum wage with. */
export interface PayableFigures {
  /** Paid this week: the week's own pay, overtime owed for earlier weeks and adjustments for closed weeks. */
  payableCents: number;
  /** Adjustments for closed weeks paid this week (negative: a closed week was overpaid). */
  adjustmentCents: number;
  /** All hours worked in the week, in whole seconds. */
  workedSeconds: number;
}

const money = new Intl.NumberFormat('en-US', { style: 'currency', currency: 'USD' });
const hoursWords = (seconds: number) => String(Number((seconds / HOUR_SECONDS).toFixed(2)));

/**
 * A caution when the amount payable this week is below the minimum wage for the hours worked in it, or null.
 * The week's own pay never is (29 USC 206 tops it up); a negative adjustment for a closed week that was
 * overpaid can bring it there. The pay math is left as it is: whether and how much of an overpayment may be
 * taken back in one week is for payroll. 29 CFR 531.35 (from memory; confirm the text before relying on it):
 * wages are paid "finally and unconditionally or free and clear", so a deduction may not cut pay below the
 * minimum wage.
 */
export function payableBelowMinimumWageCaution(
  figures: PayableFigures,
  minimumWageCents: number,
): string | null {
  const floorCents = centsFor(figures.workedSeconds, minimumWageCents);
  if (figures.payableCents >= floorCents) return null;
  const hours = hoursWords(figures.workedSeconds);
  const after =
    figures.adjustmentCents < 0
      ? ` after an adjustment of ${money.format(figures.adjustmentCents / 100)} from earlier weeks`
      : '';
  // The floor is of the exact time worked while the hours shown are rounded: no product is written out.
  const below =
    figures.workedSeconds > 0
      ? `is below the minimum wage for ${hours} h worked ` +
        `(${money.format(floorCents / 100)} at ${money.format(minimumWageCents / 100)} an hour)${after}`
      : `is negative${after}, with no hours worked this week`;
  return (
    `Payable ${money.format(figures.payableCents / 100)} ${below}: ` +
    'confirm with payroll before paying; deductions may not cut pay below the minimum wage (29 CFR 531.35). ' +
    'Pay figures are estimates: confirm them with local wage law and your payroll provider.'
  );
}

/** A bona fide meal break in a workday: when it began, counted in seconds worked that day, and its length. */
export interface MealBreak {
  afterWorkedSeconds: number;
  seconds: number;
}

/** One workday of the workweek (California Labor Code 500(a)). */
export interface PayDay {
  workedSeconds: number;
  /** Rest breaks punched that day. */
  restSeconds: number;
  meals: readonly MealBreak[];
}

/** One technician's workweek, in whole seconds. */
export interface PayWeekInput {
  rate: PayRate;
  rules: PayRules;
  flaggedSeconds: number;
  /** All hours worked: attendance, paid rest breaks included. */
  workedSeconds: number;
  /** Wall time clocked on job lines. */
  productiveSeconds: number;
  /** Rest breaks punched: worked, not productive. */
  restSeconds: number;
  /** The seven workdays, in order; the California rules need them. */
  days: readonly PayDay[];
  /**
   * Of `flaggedSeconds`, the part 29 CFR 778.119 would allocate to earlier weeks (lines clocked before this
   * week): it is paid this week but left out of this week's regular rate.
   */
  earlierWeeksFlaggedSeconds?: number;
}

export interface PayEstimate {
  payType: PayType;
  flaggedSeconds: number;
  /** Flagged time × flat rate (0 for hourly pay). */
  flaggedPayCents: number;
  /** 29 CFR 778.111(b): what the hourly guarantee for productive time adds to the flat-rate pay. */
  guaranteeTopUpCents: number;
  /** Hourly pay: every hour worked × the hourly rate (hourly pay type only). */
  hourlyPayCents: number;
  /** Rest periods: punched, or under California rules credited (IWC wage orders §12). */
  restSeconds: number;
  /** California Labor Code 226.2(a)(3): the average hourly rate paid for rest periods; null otherwise. */
  restRateCents: number | null;
  restPayCents: number;
  /** Time at work off any job line, rest periods apart. */
  otherNonProductiveSeconds: number;
  otherNonProductivePayCents: number;
  /** Rest pay plus other non-productive pay. */
  nonProductivePayCents: number;
  straightTimeCents: number;
  workedSeconds: number;
  /** The highest of the federal, state and local minimum wages. */
  minimumWageCents: number;
  minimumWageTopUpCents: number;
  regularRateCents: number;
  /** Hours paid a premium: time-and-a-half and double-time together. */
  overtimeSeconds: number;
  timeAndHalfSeconds: number;
  doubleTimeSeconds: number;
  overtimePremiumCents: number;
  /** California Labor Code 226.7: workdays whose punches show a missed, late or short meal. */
  mealPremiumDays: number;
  mealPremiumCents: number;
  totalCents: number;
}

interface PremiumTime {
  timeAndHalfSeconds: number;
  doubleTimeSeconds: number;
}

/**
 * California Labor Code 510(a): 1.5× over 8 h in a workday and over 40 h in the workweek, 2× over 12 h;
 * on the seventh consecutive workday 1.5× for the first 8 h and 2× beyond. Hours already paid as daily
 * overtime do not count again toward the weekly 40.
 */
export function californiaOvertime(dailySeconds: readonly number[]): PremiumTime {
  const seventhDay = dailySeconds.length === 7 && dailySeconds.every((s) => s > 0);
  let timeAndHalfSeconds = 0;
  let doubleTimeSeconds = 0;
  let regularSeconds = 0;
  dailySeconds.forEach((seconds, i) => {
    if (seventhDay && i === 6) {
      timeAndHalfSeconds += Math.min(seconds, DAILY_LIMIT_S);
      doubleTimeSeconds += Math.max(0, seconds - DAILY_LIMIT_S);
      return;
    }
    regularSeconds += Math.min(seconds, DAILY_LIMIT_S);
    timeAndHalfSeconds += Math.min(Math.max(0, seconds - DAILY_LIMIT_S), DOUBLE_TIME_DAILY_S - DAILY_LIMIT_S);
    doubleTimeSeconds += Math.max(0, seconds - DOUBLE_TIME_DAILY_S);
  });
  return {
    timeAndHalfSeconds: timeAndHalfSeconds + Math.max(0, regularSeconds - WEEKLY_LIMIT_S),
    doubleTimeSeconds,
  };
}

/**
 * Rest periods a California workday authorizes: 10 minutes net per 4 hours or major fraction thereof
 * (IWC wage orders §12(A)); none under 3½ hours. So 3½–6 h: 1, over 6–10 h: 2, over 10–14 h: 3 (the
 * reading of the California Supreme Court in Brinker, 2012; from memory).
 */
export function californiaRestPeriods(workedSeconds: number): number {
  if (workedSeconds < 3.5 * HOUR_SECONDS) return 0;
  return Math.ceil((workedSeconds - 2 * HOUR_SECONDS) / (4 * HOUR_SECONDS));
}

/**
 * Whether a California workday's punches show a missed, late or short meal (Labor Code 512(a)): more than
 * 5 hours of work need a meal of 30 minutes or more begun by the end of the fifth hour, more than 10 hours
 * a second one begun by the end of the tenth. A day of 6 hours or less may waive the first meal and one of
 * 12 hours or less the second, by mutual consent: such days are assumed waived. At most one premium a day
 * (Labor Code 226.7(c)).
 */
export function californiaMealMissed(day: PayDay): boolean {
  const proper = day.meals.filter((meal) => meal.seconds >= CALIFORNIA_MEAL_S);
  const firstMissed =
    day.workedSeconds > 6 * HOUR_SECONDS &&
    !proper.some((meal) => meal.afterWorkedSeconds <= 5 * HOUR_SECONDS);
  const secondMissed =
    day.workedSeconds > 12 * HOUR_SECONDS &&
    proper.filter((meal) => meal.afterWorkedSeconds <= 10 * HOUR_SECONDS).length < 2;
  return firstMissed || secondMissed;
}

function assertWholeSeconds(week: PayWeekInput): void {
  const figures = [
    week.flaggedSeconds,
    week.workedSeconds,
    week.productiveSeconds,
    week.restSeconds,
    week.earlierWeeksFlaggedSeconds ?? 0,
    ...week.days.flatMap((day) => [day.workedSeconds, day.restSeconds]),
  ];
  if (!figures.every((figure) => Number.isSafeInteger(figure) && figure >= 0))
    throw new RangeError('Pay is worked out from whole, non-negative seconds');
}

/** Weekly pay estimate in whole cents from whole seconds; every figure rounded half up once. */
export function estimateWeeklyPay(week: PayWeekInput): PayEstimate {
  assertWholeSeconds(week);
  const { rate, rules, workedSeconds } = week;
  const california = rules.overtimeRules === 'california';
  const minimumWage = applicableMinimumWageCents(rules);
  const flatRate = rate.payType !== 'hourly';
  const idleSeconds = Math.max(0, workedSeconds - week.productiveSeconds);

  const flaggedPayCents = flatRate ? centsFor(week.flaggedSeconds, rate.flatRateCents) : 0;
  const hourlyPayCents = flatRate ? 0 : centsFor(workedSeconds, rate.hourlyRateCents);
  // 29 CFR 778.111(b): the guarantee for productive time replaces the flat-rate pay when it is larger.
  const guaranteeTopUpCents =
    rate.payType === 'flat-rate-guarantee'
      ? Math.max(0, centsFor(week.productiveSeconds, rate.guaranteeCents) - flaggedPayCents)
      : 0;
  const piecePayCents = flaggedPayCents + guaranteeTopUpCents;
  // Waiting time is paid at its own rate under the guarantee (778.111(b)); under plain flat rate only when the
  // shop pays non-productive time separately.
  const paysOtherTime =
    rate.payType === 'flat-rate-guarantee' ||
    (rate.payType === 'flat-rate' && rules.payNonProductiveSeparately);

  let restSeconds = Math.min(week.restSeconds, idleSeconds);
  const otherNonProductiveSeconds = idleSeconds - restSeconds;
  let restRateCents: number | null = null;
  let restPayCents: number;
  let otherNonProductivePayCents: number;
  let minimumWageTopUpCents: number;
  let premium: PremiumTime;

  if (california && flatRate) {
    // Labor Code 226.2 (text checked in a public copy): rest periods and other non-productive time are paid
    // apart from piece pay. Rest periods authorized but not punched are credited (IWC wage orders §12); they
    // come out of the time the flat-rate pay covers.
    const credited = week.days.reduce(
      (sum, day) =>
        sum + Math.max(day.restSeconds, californiaRestPeriods(day.workedSeconds) * REST_PER_PERIOD_S),
      0,
    );
    restSeconds = Math.min(workedSeconds - otherNonProductiveSeconds, Math.max(restSeconds, credited));
    const pieceSeconds = workedSeconds - restSeconds - otherNonProductiveSeconds;
    // 226.2(a)(4): other non-productive time at no less than the minimum wage; the piece pay must itself reach
    // the minimum wage for the time it covers (no averaging).
    otherNonProductivePayCents = centsFor(
      otherNonProductiveSeconds,
      Math.max(rate.hourlyRateCents, minimumWage),
    );
    minimumWageTopUpCents = Math.max(0, centsFor(pieceSeconds, minimumWage) - piecePayCents);
    // 226.2(a)(3): rest periods at the average hourly rate of the week's other work, never below minimum wage.
    const otherWorkCents = piecePayCents + minimumWageTopUpCents + otherNonProductivePayCents;
    const otherWorkSeconds = workedSeconds - restSeconds;
    const averagePays =
      otherWorkSeconds > 0 && otherWorkCents * HOUR_SECONDS >= minimumWage * otherWorkSeconds;
    restRateCents = averagePays
      ? divideRoundHalfUp(otherWorkCents * HOUR_SECONDS, otherWorkSeconds)
      : minimumWage;
    restPayCents = averagePays
      ? divideRoundHalfUp(restSeconds * otherWorkCents, otherWorkSeconds)
      : centsFor(restSeconds, minimumWage);
    premium = californiaOvertime(week.days.map((day) => day.workedSeconds));
  } else {
    restPayCents = paysOtherTime ? centsFor(restSeconds, rate.hourlyRateCents) : 0;
    otherNonProductivePayCents = paysOtherTime
      ? centsFor(otherNonProductiveSeconds, rate.hourlyRateCents)
      : 0;
    // 29 USC 206: the week's pay divided by all hours worked must reach the minimum wage.
    const paid = piecePayCents + hourlyPayCents + restPayCents + otherNonProductivePayCents;
    minimumWageTopUpCents = Math.max(0, centsFor(workedSeconds, minimumWage) - paid);
    premium = california
      ? californiaOvertime(week.days.map((day) => day.workedSeconds))
      : {
          // 29 USC 213(b)(10)(A) is a federal exemption: California's overtime still applies above.
          timeAndHalfSeconds: rate.overtimeExempt ? 0 : Math.max(0, workedSeconds - WEEKLY_LIMIT_S),
          doubleTimeSeconds: 0,
        };
  }

  const nonProductivePayCents = restPayCents + otherNonProductivePayCents;
  const straightTimeCents = piecePayCents + hourlyPayCents + nonProductivePayCents;
  // 29 CFR 778.111: regular rate = all straight-time pay ÷ all hours worked. Overtime hours are already paid
  // once in it, so each adds 0.5× (2× hours add 1×). Pay 778.119 allocates to earlier weeks is left out here.
  const allocatedCents = flatRate ? centsFor(week.earlierWeeksFlaggedSeconds ?? 0, rate.flatRateCents) : 0;
  const rateBase = Math.max(0, straightTimeCents + minimumWageTopUpCents - allocatedCents);
  const regularRateCents = workedSeconds > 0 ? divideRoundHalfUp(rateBase * HOUR_SECONDS, workedSeconds) : 0;
  const premiumUnits = premium.timeAndHalfSeconds + 2 * premium.doubleTimeSeconds;
  const overtimePremiumCents =
    workedSeconds > 0 ? divideRoundHalfUp(rateBase * premiumUnits, 2 * workedSeconds) : 0;
  // Labor Code 226.7(c): one additional hour at the regular rate of compensation for each such workday.
  const mealPremiumDays = california ? week.days.filter(californiaMealMissed).length : 0;
  const mealPremiumCents =
    workedSeconds > 0 ? divideRoundHalfUp(rateBase * HOUR_SECONDS * mealPremiumDays, workedSeconds) : 0;

  return {
    payType: rate.payType,
    flaggedSeconds: week.flaggedSeconds,
    flaggedPayCents,
    guaranteeTopUpCents,
    hourlyPayCents,
    restSeconds,
    restRateCents,
    restPayCents,
    otherNonProductiveSeconds,
    otherNonProductivePayCents,
    nonProductivePayCents,
    straightTimeCents,
    workedSeconds,
    minimumWageCents: minimumWage,
    minimumWageTopUpCents,
    regularRateCents,
    overtimeSeconds: premium.timeAndHalfSeconds + premium.doubleTimeSeconds,
    timeAndHalfSeconds: premium.timeAndHalfSeconds,
    doubleTimeSeconds: premium.doubleTimeSeconds,
    overtimePremiumCents,
    mealPremiumDays,
    mealPremiumCents,
    totalCents: straightTimeCents + minimumWageTopUpCents + overtimePremiumCents + mealPremiumCents,
  };
}

/** An earlier week's figures that 29 CFR 778.119 needs to add overtime for pay allocated to it. */
export type EarlierWeek = Pick<PayEstimate, 'workedSeconds' | 'timeAndHalfSeconds' | 'doubleTimeSeconds'>;

/**
 * 29 CFR 778.119–778.120 (for commissions; applied to flat-rate pay by analogy): pay earned over several
 * weeks is shared over them, and each earlier week's regular rate rises by its share ÷ its hours worked.
 * The extra premium owed for that week: share × (0.5 × time-and-a-half hours + double-time hours) ÷ hours.
 */
export function additionalOvertimeCents(shareCents: number, earlier: EarlierWeek): number {
  if (earlier.workedSeconds <= 0) return 0;
  const units = earlier.timeAndHalfSeconds + 2 * earlier.doubleTimeSeconds;
  return divideRoundHalfUp(shareCents * units, 2 * earlier.workedSeconds);
}
