import { describe, expect, it } from 'vitest';
import { decimal, idTextSchema, instantSchema, parseDecimal, plainText } from './fields.js';
import { z } from 'zod';

const messages = (result: { error?: { issues: { message: string }[] } }) =>
  result.error?.issues.map((issue) => issue.message) ?? [];

describe(plainText.name, () => {
  const name = plainText(40, { min: 1, message: 'Enter a name' });
  const note = plainText(200, { multiline: true });

  it('keeps ordinary text, accents and right-to-left scripts, trimmed', () => {
    expect(name.parse('  Dana Okafor ')).toBe('Dana Okafor');
    expect(name.parse('Zoë Ğündüz')).toBe('Zoë Ğündüz');
    expect(name.parse('سارا')).toBe('سارا');
    expect(note.parse('Pan magnet:\n\tfine shavings')).toBe('Pan magnet:\n\tfine shavings');
  });

  it('refuses control characters, and line breaks in a one-line field', () => {
    expect(messages(name.safeParse('Dana\u0000'))).toEqual([
      'Keep it on one line, without control characters',
    ]);
    expect(messages(name.safeParse('Dana\u001b[31m'))).toEqual([
      'Keep it on one line, without control characters',
    ]);
    expect(messages(name.safeParse('Dana\nOkafor'))).toEqual([
      'Keep it on one line, without control characters',
    ]);
    expect(messages(note.safeParse('bell\u0007'))).toEqual(['Remove the control characters']);
    expect(messages(note.safeParse('C1\u0085'))).toEqual(['Remove the control characters']);
  });

  it('refuses the bidirectional overrides and isolates of Unicode UAX #9', () => {
    // U+202E RIGHT-TO-LEFT OVERRIDE makes "exe.txt" show as "txt.exe"; U+2066 LEFT-TO-RIGHT ISOLATE.
    for (const hidden of [
      '\u202A',
      '\u202B',
      '\u202C',
      '\u202D',
      '\u202E',
      '\u2066',
      '\u2067',
      '\u2068',
      '\u2069',
    ])
      expect(messages(name.safeParse(`invoice${hidden}exe.txt`))).toEqual([
        'Remove the hidden text-direction characters',
      ]);
  });

  it('refuses names that only look filled in: zero-width, blank and filler characters', () => {
    for (const blank of [
      '\u200B',
      '\u200B\u200C\u200D',
      '\u2060\uFEFF',
      '\u3164',
      '\u2800',
      '\u00A0\u2003',
      '\u00AD',
    ])
      expect(messages(name.safeParse(blank)), JSON.stringify(blank)).toEqual(['Enter a name']);
    expect(messages(name.safeParse('   '))).toEqual(['Enter a name']);
    // An optional field may be left empty, but not filled with invisible characters.
    const plate = plainText(16);
    expect(plate.parse('')).toBe('');
    expect(messages(plate.safeParse('\u200B'))).toEqual(['Type something visible']);
  });

  it('refuses text longer than the field and broken surrogate halves', () => {
    expect(messages(name.safeParse('x'.repeat(41)))).toEqual(['At most 40 characters']);
    expect(messages(name.safeParse('Dana\uD800'))).toEqual(['That text has a broken character']);
  });
});

describe(parseDecimal.name, () => {
  it('reads plain decimal text only', () => {
    expect(parseDecimal('12')).toBe(12);
    expect(parseDecimal(' 1.5 ')).toBe(1.5);
    expect(parseDecimal('.5')).toBe(0.5);
    expect(parseDecimal('-3')).toBe(-3);
    // Number() would read each of these as a number: 16, 8, 2, 1000, Infinity, 0.
    for (const text of ['0x10', '0o10', '0b10', '1e3', 'Infinity', '', ' ', '1_000', '1,5', '١٢'])
      expect(parseDecimal(text), text).toBeNull();
  });
});

describe(decimal.name, () => {
  const hours = decimal(z.number().min(0.1).max(99.9));

  it('takes numbers and decimal text, refuses other spellings with a plain message', () => {
    expect(hours.parse(1.5)).toBe(1.5);
    expect(hours.parse('1.5')).toBe(1.5);
    expect(messages(hours.safeParse('0x10'))).toEqual(['Write the number in plain digits, like 12 or 1.5']);
    expect(messages(hours.safeParse('1e1'))).toEqual(['Write the number in plain digits, like 12 or 1.5']);
  });

  it('reads ids as positive safe integers', () => {
    expect(idTextSchema.parse('42')).toBe(42);
    for (const text of ['0x2A', '0', '-1', '1.5', '9007199254740993', 'abc'])
      expect(messages(idTextSchema.safeParse(text)), text).toContain('An id is a positive whole number');
  });
});

describe('instantSchema', () => {
  it('takes instants from 2000 up to two years ahead', () => {
    expect(instantSchema.parse('2000-01-01T00:00:00Z')).toBe('2000-01-01T00:00:00Z');
    const soon = new Date(Date.now() + 700 * 86_400_000).toISOString();
    expect(instantSchema.parse(soon)).toBe(soon);
  });

  it('refuses earlier and later ones', () => {
    expect(messages(instantSchema.safeParse('1999-12-31T23:59:59Z'))).toEqual([
      'Use a date in 2000 or later',
    ]);
    expect(messages(instantSchema.safeParse('0001-01-01T00:00:00Z'))).toEqual([
      'Use a date in 2000 or later',
    ]);
    const later = new Date(Date.now() + 740 * 86_400_000).toISOString();
    expect(messages(instantSchema.safeParse(later))).toEqual(['Use a date less than two years ahead']);
  });
});
