/**
 * Baytime's one money rule: figures are computed from whole seconds and whole cents in integer arithmetic,
 * and each figure shown is rounded once, half up (half a cent goes up), from the exact fraction. Sums of
 * figures add the rounded figures, so a total always equals its parts.
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
  'Worked out in whole seconds and whole cents; each figure is rounded once, half a cent up, and totals add ' +
  'the rounded figures. Hours are shown to 4 decimals.';
