import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  addVinRuleIssues,
  isValidVin,
  makeVin,
  modelYearFromVin,
  vehicleDetailsSchema,
  vinCheckDigit,
  vinSchema,
  vinTextSchema,
} from './vin.js';

// The widely used worked example of the 49 CFR 565.15 check digit: 1M8GDM9AXKP042788, check digit X.
const WORKED_EXAMPLE = '1M8GDM9AXKP042788';
const VIN_ALPHABET = 'ABCDEFGHJKLMNPRSTUVWXYZ0123456789';

function issues(result: {
  success: boolean;
  error?: { issues: { message: string; path: PropertyKey[] }[] };
}) {
  return result.error?.issues.map((issue) => ({ message: issue.message, path: issue.path.join('.') })) ?? [];
}

describe(vinCheckDigit.name, () => {
  it('gives X for the 49 CFR 565.15 worked example', () => {
    // 49 CFR 565.15: a remainder of 10 is written X; the worked example's check digit is X.
    expect(vinCheckDigit(WORKED_EXAMPLE)).toBe('X');
  });

  it('gives 1 for seventeen ones', () => {
    // Arithmetic from the 49 CFR 565.15 weights: 1 × (8+7+6+5+4+3+2+10+0+9+8+7+6+5+4+3+2) = 89; 89 mod 11 = 1.
    expect(vinCheckDigit('11111111111111111')).toBe('1');
  });

  it('returns null for text that cannot be a VIN', () => {
    expect(vinCheckDigit('1M8GDM9AXKP04278')).toBeNull();
    expect(vinCheckDigit('1M8GDM9AXKP04278O')).toBeNull();
  });
});

describe(isValidVin.name, () => {
  it('accepts the worked example in any case', () => {
    // The widely used worked example of the 49 CFR 565.15 check digit: 1M8GDM9AXKP042788.
    expect(isValidVin(WORKED_EXAMPLE)).toBe(true);
    expect(isValidVin(WORKED_EXAMPLE.toLowerCase())).toBe(true);
  });

  it('rejects a wrong check digit or a mistyped character', () => {
    expect(isValidVin('1M8GDM9A4KP042788')).toBe(false);
    expect(isValidVin('1M8GDM9AXKP042789')).toBe(false);
  });

  it('rejects I, O and Q even where the sum would work out', () => {
    // 49 CFR 565.15: I, O and Q never appear. Q would not even have a transliterated value.
    expect(isValidVin('1M8GDM9AXKP0427O8')).toBe(false);
    expect(isValidVin('IM8GDM9AXKP042788')).toBe(false);
  });

  it('catches any single mistyped digit', () => {
    // Each weight except position 9's is a unit mod 11, so changing one digit by 1–9 changes the sum mod 11.
    fc.assert(
      fc.property(
        fc.string({ unit: fc.constantFrom(...VIN_ALPHABET), minLength: 16, maxLength: 16 }),
        fc.integer({ min: 0, max: 16 }).filter((i) => i !== 8),
        fc.integer({ min: 1, max: 9 }),
        (rest, position, shift) => {
          const vin = makeVin(rest);
          const digit = Number(vin[position]);
          fc.pre(/[0-9]/.test(vin[position]!));
          const typo = `${vin.slice(0, position)}${(digit + shift) % 10}${vin.slice(position + 1)}`;
          expect(isValidVin(typo)).toBe(false);
        },
      ),
    );
  });
});

describe(makeVin.name, () => {
  it('inserts the check digit at position 9', () => {
    // Removing the X from the 49 CFR 565.15 worked example and rebuilding it gives the example back.
    expect(makeVin('1M8GDM9AKP042788')).toBe(WORKED_EXAMPLE);
  });

  // Worked by hand with the 49 CFR 565.15 transliteration table (A=1 B=2 D=4 H=8 L=3 M=4 T=3) and the
  // position weights 8 7 6 5 4 3 2 10 · 9 8 7 6 5 4 3 2:
  // 7AB6LD9H·LM900777 → 56+7+12+30+12+12+18+80 + 27+32+63+0+0+28+21+14 = 412; 412 mod 11 = 5.
  // 5BT00AAA·TB000123 → 40+14+18+0+0+3+2+10 + 27+16+0+0+0+4+6+6 = 146; 146 mod 11 = 3.
  it.each([
    ['7AB6LD9HLM900777', '7AB6LD9H5LM900777'],
    ['5BT00AAATB000123', '5BT00AAA3TB000123'],
    ['1111111111111111', '11111111111111111'],
  ])('makes %s into %s, by the hand-worked sum', (rest, vin) => {
    expect(makeVin(rest)).toBe(vin);
  });

  it('keeps the 16 given characters in their places around the check digit', () => {
    fc.assert(
      fc.property(
        fc.string({ unit: fc.constantFrom(...VIN_ALPHABET), minLength: 16, maxLength: 16 }),
        (rest) => {
          const vin = makeVin(rest);
          expect(`${vin.slice(0, 8)}${vin.slice(9)}`).toBe(rest);
          expect(vin[8]).toMatch(/^[0-9X]$/);
        },
      ),
    );
  });

  it('refuses the wrong length or forbidden letters', () => {
    expect(() => makeVin('1M8GDM9AKP04278')).toThrow(RangeError);
    expect(() => makeVin('1M8GDM9AKP04278Q')).toThrow(/without I, O or Q/);
  });
});

describe(modelYearFromVin.name, () => {
  // Position-10 year codes per the 49 CFR 565.15 year-code table (code letters from memory of that table).
  const june2026 = new Date(2026, 5, 15);

  it('takes the most recent year not later than next year', () => {
    expect(modelYearFromVin(WORKED_EXAMPLE, june2026)).toBe(2019); // K: 1989 or 2019
    expect(modelYearFromVin(WORKED_EXAMPLE, new Date(1990, 0, 1))).toBe(1989);
    expect(modelYearFromVin(makeVin('5BT00AAATB000123'), june2026)).toBe(2026); // T
    expect(modelYearFromVin(makeVin('5BT00AAAVB000123'), june2026)).toBe(2027); // V: next year's models
    expect(modelYearFromVin(makeVin('5BT00AAAWB000123'), june2026)).toBe(1998); // W: 2028 is too far
    expect(modelYearFromVin(makeVin('5BT00AAA9B000123'), june2026)).toBe(2009); // 9
    expect(modelYearFromVin(makeVin('5BT00AAAYB000123'), june2026)).toBe(2000); // Y
  });

  it('returns null without a year code in position 10', () => {
    expect(modelYearFromVin(makeVin('5BT00AAA0B000123'), june2026)).toBeNull();
    expect(modelYearFromVin('short')).toBeNull();
  });
});

describe('vinSchema', () => {
  it('trims and upper-cases', () => {
    expect(vinSchema.parse(`  ${WORKED_EXAMPLE.toLowerCase()} `)).toBe(WORKED_EXAMPLE);
  });

  it('drops the spaces and dashes of a VIN pasted in groups', () => {
    expect(vinSchema.parse('1M8 GDM9A-XKP 042788')).toBe(WORKED_EXAMPLE);
    expect(vinSchema.parse('1m8-gdm9ax-kp0-42788\t')).toBe(WORKED_EXAMPLE);
  });

  it('explains each problem in plain words', () => {
    expect(issues(vinSchema.safeParse('1M8GDM9AXKP04278'))).toEqual([
      { message: 'A VIN has 17 characters', path: '' },
    ]);
    expect(issues(vinSchema.safeParse('1M8GDM9AXKP0427O8'))).toEqual([
      { message: 'VINs never use I, O or Q', path: '' },
    ]);
    expect(issues(vinSchema.safeParse('1M8GDM9AXKP0427*8'))).toEqual([
      { message: 'A VIN has only letters and digits', path: '' },
    ]);
    expect(issues(vinSchema.safeParse('1M8GDM9A4KP042788'))).toEqual([
      { message: 'Check digit should be X, not 4', path: '' },
    ]);
  });
});

describe('vinTextSchema', () => {
  it('takes a shorter serial of a vehicle built before 1981, and a 17-character VIN whatever its check digit', () => {
    expect(vinTextSchema.parse('7y37j5g 123456')).toBe('7Y37J5G123456');
    expect(vinTextSchema.parse('1M8GDM9A4KP042788')).toBe('1M8GDM9A4KP042788');
  });

  it('still wants letters and digits, at most 17', () => {
    expect(issues(vinTextSchema.safeParse('AB*12'))).toEqual([
      { message: 'A VIN has only letters and digits', path: '' },
    ]);
    expect(issues(vinTextSchema.safeParse('1M8GDM9AXKP0427881'))).toEqual([
      { message: 'A VIN has 17 characters', path: '' },
    ]);
    expect(issues(vinTextSchema.safeParse('AB1'))).toEqual([
      { message: 'A VIN has 17 characters', path: '' },
    ]);
  });
});

describe(addVinRuleIssues.name, () => {
  const vehicleInputSchema = vehicleDetailsSchema.superRefine((vehicle, ctx) =>
    addVinRuleIssues(vehicle, ctx),
  );
  const valid = { vin: WORKED_EXAMPLE, year: 2019, make: 'Brightwell', model: 'Tern', odometer: 84_210 };

  it('accepts a vehicle whose year matches the VIN', () => {
    expect(vehicleInputSchema.parse({ ...valid, plate: ' 7KX 221 ' })).toEqual({
      ...valid,
      plate: '7KX 221',
    });
    // K also stands for 1989: an old vehicle is not rejected for the 30-year cycle.
    expect(vehicleInputSchema.safeParse({ ...valid, year: 1989 }).success).toBe(true);
  });

  it('rejects a year the VIN does not stand for', () => {
    expect(issues(vehicleInputSchema.safeParse({ ...valid, year: 2005 }))).toEqual([
      { message: "The VIN's 10th character (K) means model year 2019 or 1989, not 2005", path: 'year' },
    ]);
  });

  it('rejects years outside 1981..next year and bad odometers', () => {
    const nextYear = new Date().getFullYear() + 1;
    const paths = (input: object) => issues(vehicleInputSchema.safeParse(input)).map((issue) => issue.path);
    expect(paths({ ...valid, vin: makeVin('5BT00AAAAB000123'), year: 1980 })).toContain('year');
    expect(paths({ ...valid, year: nextYear + 1 })).toContain('year');
    expect(paths({ ...valid, odometer: -1 })).toEqual(['odometer']);
    expect(paths({ ...valid, odometer: 10.5 })).toEqual(['odometer']);
  });
});
