import type { ShopSettings } from '../shop/shop.schema.js';

/** 29 USC 206(a)(1)(C). */
export const FEDERAL_MINIMUM_WAGE_CENTS = 725;

export const PAY_ESTIMATE_CAUTION =
  'These figures are an estimate. Confirm them against federal, state and local wage law, your payroll ' +
  'provider and licensed advice before paying anyone.';

export type PaySettings = Pick<
  ShopSettings,
  'minimumWageCents' | 'overtimeRules' | 'payNonProductiveSeparately'
>;

/** One technician's workweek. */
export interface PayWeekInput {
  flaggedHours: number;
  flatRateCents: number;
  /** All hours worked: attendance, paid rest breaks included. */
  hoursWorked: number;
  /** Hours worked while clocked on no job line (waiting, shop work, rest breaks). */
  nonProductiveHours: number;
  /** Paid rest breaks, a part of `nonProductiveHours`; California pays them at their own rate. */
  restHours: number;
  /** Rate for non-productive time. */
  hourlyRateCents: number;
  /** 29 USC 213(b)(10)(A): no federal overtime premium; minimum wage still applies (29 CFR 779.372). */
  overtimeExempt: boolean;
  /** California only: hours worked in each workday of the workweek, in order. */
  dailyHours?: readonly number[];
}

export interface PayEstimate {
  flaggedPayCents: number;
  nonProductivePayCents: number;
  straightTimeCents: number;
  hoursWorked: number;
  regularRateCents: number;
  /** Hours paid a premium: time-and-a-half and double-time hours together. */
  overtimeHours: number;
  doubleTimeHours: number;
  overtimePremiumCents: number;
  minimumWageTopUpCents: number;
  totalCents: number;
  /** California Labor Code 226.2(a)(3): the rate paid for rest periods; null under federal rules. */
  restRateCents: number | null;
}

/**
 * California Labor Code 510(a): 1.5× over 8 h in a workday and over 40 h in the workweek, 2× over 12 h;
 * on the seventh consecutive workday 1.5× for the first 8 h and 2× beyond. Hours already paid as daily
 * overtime do not count again toward the weekly 40.
 */
export function californiaOvertimeHours(dailyHours: readonly number[]): {
  timeAndHalfHours: number;
  doubleTimeHours: number;
} {
  const seventhDay = dailyHours.length === 7 && dailyHours.every((h) => h > 0);
  let timeAndHalfHours = 0;
  let doubleTimeHours = 0;
  let regularHours = 0;
  dailyHours.forEach((hours, i) => {
    if (seventhDay && i === 6) {
      timeAndHalfHours += Math.min(hours, 8);
      doubleTimeHours += Math.max(0, hours - 8);
      return;
    }
    regularHours += Math.min(hours, 8);
    timeAndHalfHours += Math.min(Math.max(0, hours - 8), 4);
    doubleTimeHours += Math.max(0, hours - 12);
  });
  return { timeAndHalfHours: timeAndHalfHours + Math.max(0, regularHours - 40), doubleTimeHours };
}

/** Weekly flat-rate pay estimate in integer cents. */
export function estimateWeeklyPay(week: PayWeekInput, settings: PaySettings): PayEstimate {
  const minimumWage = Math.max(FEDERAL_MINIMUM_WAGE_CENTS, settings.minimumWageCents);
  const flaggedPayCents = Math.round(week.flaggedHours * week.flatRateCents);
  const { hoursWorked } = week;
  let nonProductivePayCents: number;
  let minimumWageTopUpCents: number;
  let restRateCents: number | null = null;
  let premiumHours: { timeAndHalfHours: number; doubleTimeHours: number };

  if (settings.overtimeRules === 'california') {
    if (!week.dailyHours) throw new Error('California overtime needs the hours of each workday');
    // Labor Code 226.2 (text checked in a public copy): non-productive time and rest periods are paid apart
    // from piece pay, so piece pay must itself reach the minimum wage for productive hours (no averaging).
    const productiveHours = hoursWorked - week.nonProductiveHours;
    minimumWageTopUpCents = Math.max(0, Math.round(productiveHours * minimumWage) - flaggedPayCents);
    const otherCents = Math.round(
      (week.nonProductiveHours - week.restHours) * Math.max(week.hourlyRateCents, minimumWage),
    );
    const nonRestHours = hoursWorked - week.restHours;
    const averageRate =
      nonRestHours > 0 ? (flaggedPayCents + minimumWageTopUpCents + otherCents) / nonRestHours : 0;
    const restRate = Math.max(averageRate, minimumWage);
    restRateCents = Math.round(restRate);
    nonProductivePayCents = otherCents + Math.round(week.restHours * restRate);
    // 29 USC 213(b)(10)(A) is a federal exemption: California's daily and weekly overtime still apply.
    premiumHours = californiaOvertimeHours(week.dailyHours);
  } else {
    nonProductivePayCents = settings.payNonProductiveSeparately
      ? Math.round(week.nonProductiveHours * week.hourlyRateCents)
      : 0;
    // 29 USC 206: the week's pay divided by all hours worked must reach the minimum wage.
    minimumWageTopUpCents = Math.max(
      0,
      Math.round(hoursWorked * minimumWage) - flaggedPayCents - nonProductivePayCents,
    );
    premiumHours = {
      timeAndHalfHours: week.overtimeExempt ? 0 : Math.max(0, hoursWorked - 40),
      doubleTimeHours: 0,
    };
  }

  const straightTimeCents = flaggedPayCents + nonProductivePayCents;
  // 29 CFR 778.111: regular rate = all straight-time pay ÷ all hours worked; overtime hours are already
  // paid at 1× in it, so each adds 0.5× (2× hours add 1×).
  const regularRate = hoursWorked > 0 ? (straightTimeCents + minimumWageTopUpCents) / hoursWorked : 0;
  const overtimePremiumCents = Math.round(
    regularRate * (0.5 * premiumHours.timeAndHalfHours + premiumHours.doubleTimeHours),
  );
  return {
    flaggedPayCents,
    nonProductivePayCents,
    straightTimeCents,
    hoursWorked,
    regularRateCents: Math.round(regularRate),
    overtimeHours: premiumHours.timeAndHalfHours + premiumHours.doubleTimeHours,
    doubleTimeHours: premiumHours.doubleTimeHours,
    overtimePremiumCents,
    minimumWageTopUpCents,
    totalCents: straightTimeCents + minimumWageTopUpCents + overtimePremiumCents,
    restRateCents,
  };
}
