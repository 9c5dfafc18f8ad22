/**
 * Baytime's one money rule: figures are computed from whole seconds and whole cents in integer arithmetic,
 * and each figure shown is rounded once, half up (half a cent goes up), from the exact fraction. Sums of
 * money add the rounded cents, so a total always equals its parts; sums of hours add the whole seconds and
 * are rounded to 4 decimals once (adding rounded hours would show 3 × 2.0833 = 6.2499 for 6.25 h).
 */
export const HOUR_SECONDS = 3600;

/** numerator ÷ denominator rounded half up (towards +∞), exactly, for safe integers. */
export function divideRoundHalfUp(numerator: number, denominator: number): number {
  if (!Number.isSafeInteger(numerator) || !Number.isSafeInteger(denominator) || denominator <= 0)
    throw new RangeError(`Not a whole-number fraction: ${numerator} / ${denominator}`);
  // floor((2n + d) / 2d), corrected for floating-point division near a whole number.
  const top = 2 * numerator + denominator;
  const bottom = 2 * denominator;
  let quotient = Math.floor(top / bottom);
  while (quotient * bottom > top) quotient--;
  while ((quotient + 1) * bottom <= top) quotient++;
  return quotient;
}

/** A decimal quantity (book hours × a share, say) as a whole number of units, rounded half up once. */
export function roundHalfUp(value: number): number {
  return Math.floor(value + 0.5);
}

/** Seconds at a rate in cents per hour → cents. */
export function centsFor(seconds: number, centsPerHour: number): number {
  return divideRoundHalfUp(seconds * centsPerHour, HOUR_SECONDS);
}

/**
 * A ledger's seconds (whole milliseconds, added up in floating point) as whole seconds, rounded half up once.
 * Snapped to the millisecond first, so the sum's float noise (7,499.499 999 9 for 7,499.5) cannot tip a half.
 */
export function wholeSeconds(seconds: number): number {
  return divideRoundHalfUp(Math.round(seconds * 1000), 1000);
}

/**
 * Whole seconds of consecutive parts (the days of a week) that add up to `wholeSeconds` of their sum: each
 * part is its running total rounded, less the running total before it. No part is off by a second or more.
 */
export function wholeSecondsOfParts(parts: readonly number[]): number[] {
  let milliseconds = 0;
  let before = 0;
  return parts.map((part) => {
    milliseconds += Math.round(part * 1000);
    const upTo = divideRoundHalfUp(milliseconds, 1000);
    const whole = upTo - before;
    before = upTo;
    return whole;
  });
}

/** Hours for display and CSV, to 4 decimals, from whole seconds. */
export function hoursOf(seconds: number): number {
  return divideRoundHalfUp(seconds * 10_000, HOUR_SECONDS) / 10_000;
}

/** Whole seconds of decimal hours (book hours), rounded half up once. */
export function secondsOf(hours: number): number {
  return roundHalfUp(hours * HOUR_SECONDS);
}

/** The rounding rule in words, for the pay page, the CSV and the README. */
export const MONEY_ROUNDING_RULE =
  'Worked out in whole seconds and whole cents; each figure is rounded once, half a cent up, and money ' +
  'totals add the rounded figures. Hours are added up in whole seconds and shown to 4 decimals.';
