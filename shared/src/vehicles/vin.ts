import { z } from 'zod';
import { plainText } from '../input/fields.js';

// 49 CFR 565.15: transliterated values of VIN letters (digits count as themselves) and the
// position weights for the check digit in position 9. I, O and Q are never used.
// prettier-ignore
const LETTER_VALUES: Record<string, number> = {
  A: 1, B: 2, C: 3, D: 4, E: 5, F: 6, G: 7, H: 8,
  J: 1, K: 2, L: 3, M: 4, N: 5, P: 7, R: 9,
  S: 2, T: 3, U: 4, V: 5, W: 6, X: 7, Y: 8, Z: 9,
};
const WEIGHTS = [8, 7, 6, 5, 4, 3, 2, 10, 0, 9, 8, 7, 6, 5, 4, 3, 2];
const VIN_CHARACTERS = /^[A-HJ-NPR-Z0-9]*$/;
// 49 CFR 565.15 year-code table for position 10: A = 1980 (and 2010), …, Y = 2000, 1 = 2001, …, 9 = 2009;
// the cycle repeats every 30 years. U, Z and 0 are not year codes.
const YEAR_CODES = 'ABCDEFGHJKLMNPRSTVWXY123456789';
const FIRST_VIN_YEAR = 1980;
/** Miles or kilometres: beyond any working vehicle's odometer. */
export const MAX_ODOMETER = 2_000_000;

function characterValue(char: string): number | undefined {
  return /[0-9]/.test(char) ? Number(char) : LETTER_VALUES[char];
}

/**
 * The check digit (0–9 or X) a VIN should carry in position 9, or null when the text is not 17 VIN
 * characters. Position 9 itself is ignored (its weight is 0), so any placeholder works there.
 */
export function vinCheckDigit(vin: string): string | null {
  const chars = [...vin.toUpperCase()];
  if (chars.length !== 17) return null;
  let sum = 0;
  for (const [i, char] of chars.entries()) {
    const value = i === 8 ? 0 : characterValue(char);
    if (value === undefined) return null;
    sum += value * WEIGHTS[i]!;
  }
  const remainder = sum % 11;
  return remainder === 10 ? 'X' : String(remainder);
}

export function isValidVin(vin: string): boolean {
  const upper = vin.toUpperCase();
  return VIN_CHARACTERS.test(upper) && vinCheckDigit(upper) === upper[8];
}

/** Builds a valid VIN from its other 16 characters (positions 1–8 and 10–17): for demo data and tests. */
export function makeVin(prefix16WithoutCheck: string): string {
  const upper = prefix16WithoutCheck.toUpperCase();
  const check = vinCheckDigit(`${upper.slice(0, 8)}0${upper.slice(8)}`);
  if (upper.length !== 16 || !VIN_CHARACTERS.test(upper) || check === null) {
    throw new RangeError(`Need 16 VIN characters without I, O or Q, got "${prefix16WithoutCheck}"`);
  }
  return `${upper.slice(0, 8)}${check}${upper.slice(8)}`;
}

/**
 * Model year from VIN position 10. The code repeats every 30 years (K is 1989 and 2019); we take the
 * most recent year not later than next calendar year, since a shop mostly sees current vehicles. The
 * position-7 rule (a digit there for 1980–2009, a letter for 2010–2039) is not used: it binds only
 * light vehicles up to 10,000 lb GVWR (2008 amendment of Part 565, 73 FR 23367; scope from memory),
 * and the vehicle class cannot be told from the VIN here. `addVinRuleIssues` therefore accepts any
 * year the code stands for.
 */
export function modelYearFromVin(vin: string, now: Date = new Date()): number | null {
  const index = vin.length === 17 ? YEAR_CODES.indexOf(vin.toUpperCase()[9]!) : -1;
  if (index < 0) return null;
  const latest = now.getFullYear() + 1;
  return latest - ((((latest - FIRST_VIN_YEAR - index) % 30) + 30) % 30);
}

/** A VIN as pasted from a document or typed in groups: spaces and dashes dropped, upper-cased. */
export function normalizeVin(text: string): string {
  return text.replace(/[\s-]+/g, '').toUpperCase();
}

/**
 * Any vehicle identification number the shop may meet: up to 17 letters and digits once spaces and
 * dashes are gone. Vehicles built before 1981 and many outside North America carry such numbers
 * without the check digit of 49 CFR 565; `vinSchema` is the full check.
 */
export const vinTextSchema = z
  .string()
  .max(40, 'A VIN has 17 characters')
  .transform(normalizeVin)
  .pipe(
    z
      .string()
      .min(5, 'A VIN has 17 characters')
      .max(17, 'A VIN has 17 characters')
      .regex(/^[A-Z0-9]*$/, 'A VIN has only letters and digits'),
  );

function vinIssue(vin: string): string | null {
  if (vin.length !== 17) return 'A VIN has 17 characters';
  if (/[IOQ]/.test(vin)) return 'VINs never use I, O or Q';
  if (!VIN_CHARACTERS.test(vin)) return 'A VIN has only letters and digits';
  const expected = vinCheckDigit(vin);
  return expected !== vin[8] ? `Check digit should be ${expected}, not ${vin[8]}` : null;
}

/** A 17-character VIN of 49 CFR 565 as typed: spaces and dashes dropped, upper-cased, check digit right. */
export const vinSchema = z
  .string()
  .max(40, 'A VIN has 17 characters')
  .transform(normalizeVin)
  .superRefine((vin, ctx) => {
    const message = vinIssue(vin);
    if (message) ctx.addIssue({ code: 'custom', message });
  });

// 17-character VINs began with model year 1981.
const FIRST_17_CHARACTER_YEAR = 1981;
const FIRST_MODEL_YEAR = 1900;

/**
 * A vehicle as the advisor describes it, before the VIN rules: an older or imported vehicle passes
 * here and needs `addVinRuleIssues` waived by a reason.
 */
export const vehicleDetailsSchema = z.object({
  vin: vinTextSchema,
  year: z
    .number()
    .int()
    .min(FIRST_MODEL_YEAR, `Model years start at ${FIRST_MODEL_YEAR}`)
    // Checked at parse time, not schema creation, so a long-running server rolls over with the year.
    .refine((year) => year <= new Date().getFullYear() + 1, 'That model year is too far ahead'),
  make: plainText(40, { min: 1, message: 'Enter the make' }),
  model: plainText(60, { min: 1, message: 'Enter the model' }),
  plate: plainText(16).optional(),
  odometer: z
    .number()
    .int('Enter whole miles or kilometres')
    .min(0, 'The odometer cannot be negative')
    .max(MAX_ODOMETER, 'More than 2,000,000 on the odometer: check the reading'),
});

/**
 * The rules of a 1981-or-later North American VIN (49 CFR 565): 17 characters, the check digit, and a
 * model year the 10th character stands for. Issues go to `path` + `vin` or `year`.
 */
export function addVinRuleIssues(
  vehicle: { vin: unknown; year: unknown },
  ctx: z.RefinementCtx,
  path: PropertyKey[] = [],
): void {
  const { vin, year } = vehicle;
  // Text that is no VIN at all was refused by `vinTextSchema` already.
  if (typeof vin !== 'string' || !/^[A-Z0-9]{5,17}$/.test(vin)) return;
  const message = vinIssue(vin);
  if (message) ctx.addIssue({ code: 'custom', path: [...path, 'vin'], message });
  if (typeof year !== 'number') return;
  if (year < FIRST_17_CHARACTER_YEAR) {
    ctx.addIssue({
      code: 'custom',
      path: [...path, 'year'],
      message: `Model years start at ${FIRST_17_CHARACTER_YEAR} for 17-character VINs`,
    });
    return;
  }
  const latest = message ? null : modelYearFromVin(vin);
  if (latest === null || (latest - year) % 30 === 0) return;
  const years = [latest, latest - 30].filter((y) => y >= FIRST_VIN_YEAR);
  ctx.addIssue({
    code: 'custom',
    path: [...path, 'year'],
    message: `The VIN's 10th character (${vin[9]}) means model year ${years.join(' or ')}, not ${year}`,
  });
}
