import { z } from 'zod';

/** C0 and C1 control characters and DEL; tab and line breaks pass only where a field takes lines. */
// eslint-disable-next-line no-control-regex -- finding control characters is the point
const CONTROL = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F-\u009F]/u;
const LINE_BREAK_OR_TAB = /[\t\n\r]/u;
/**
 * The explicit directional embeddings, overrides and isolates of Unicode UAX #9 (LRE, RLE, PDF, LRO,
 * RLO, LRI, RLI, FSI, PDI): they make text show in another order than it is stored.
 */
const BIDI_CONTROLS = /[\u202A-\u202E\u2066-\u2069]/u;
/** Half of a surrogate pair on its own: not text at all. */
const LONE_SURROGATE = /\p{Cs}/u;
/** Spaces, zero-width and other default-ignorable characters, and the blank braille cell. */
const LOOKS_EMPTY = /^[\p{White_Space}\p{Default_Ignorable_Code_Point}\u2800]*$/u;

export interface TextOptions {
  /** Fewest characters after trimming; 0 lets the field be left empty. */
  min?: number;
  /** Notes and reasons may hold tabs and line breaks; names and titles may not. */
  multiline?: boolean;
  /** What to say when the text is missing, too short or only invisible characters. */
  message?: string;
}

/**
 * Free text a person types: trimmed, at most `max` characters, with no control characters, no hidden
 * text-direction characters and, once something is typed, something visible.
 */
export function plainText(max: number, { min = 0, multiline = false, message }: TextOptions = {}) {
  const missing = message ?? 'Type something visible';
  let text = z.string(message ? { error: message } : undefined).trim();
  if (min > 0) text = text.min(min, message);
  return text
    .max(max, `At most ${max} characters`)
    .refine(
      (value) => !CONTROL.test(value) && (multiline || !LINE_BREAK_OR_TAB.test(value)),
      multiline ? 'Remove the control characters' : 'Keep it on one line, without control characters',
    )
    .refine((value) => !BIDI_CONTROLS.test(value), 'Remove the hidden text-direction characters')
    .refine((value) => !LONE_SURROGATE.test(value), 'That text has a broken character')
    .refine((value) => value === '' || !LOOKS_EMPTY.test(value), missing);
}

/** Plain decimal notation: digits with an optional sign and point; never "0x10", "1e3" or "Infinity". */
const DECIMAL = /^[+-]?(\d+(\.\d*)?|\.\d+)$/;

/** Text typed or sent as a number, read only when it is plain decimal; null otherwise. */
export function parseDecimal(text: string): number | null {
  const trimmed = text.trim();
  return DECIMAL.test(trimmed) ? Number(trimmed) : null;
}

/**
 * A number that may arrive as text (query strings, multipart fields). Only plain decimal text is read
 * as a number: `Number("0x10")` would be 16.
 */
export function decimal<T extends z.ZodType>(
  schema: T,
  message = 'Write the number in plain digits, like 12 or 1.5',
) {
  return z.preprocess((value, ctx) => {
    if (typeof value !== 'string') return value;
    const parsed = parseDecimal(value);
    if (parsed !== null) return parsed;
    ctx.addIssue({ code: 'custom', message, input: value });
    return z.NEVER;
  }, schema);
}

/** A row id: a positive whole number within the range a JavaScript number holds exactly. */
export const idSchema = z
  .number()
  .int('An id is a positive whole number')
  .positive('An id is a positive whole number');

/** A row id in a path or query string: decimal digits only. */
export const idTextSchema = decimal(idSchema, 'An id is a positive whole number');

/** Dates a shop records: none before 2000, none more than two years ahead. */
export const EARLIEST_DATE = new Date('2000-01-01T00:00:00Z');
export const LATEST_YEARS_AHEAD = 2;

export function latestDate(now = new Date()): Date {
  const latest = new Date(now);
  latest.setUTCFullYear(latest.getUTCFullYear() + LATEST_YEARS_AHEAD);
  return latest;
}

/** An ISO 8601 instant with its offset, between 2000 and two years from now (checked when parsed). */
export const instantSchema = z.iso.datetime({ offset: true }).superRefine((value, ctx) => {
  const at = new Date(value);
  if (at < EARLIEST_DATE)
    ctx.addIssue({ code: 'custom', message: 'Use a date in 2000 or later', input: value });
  else if (at > latestDate())
    ctx.addIssue({ code: 'custom', message: 'Use a date less than two years ahead', input: value });
});
