import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { hoursOf, roundHalfUp, wholeSeconds, wholeSecondsOfParts } from './money.js';

describe(wholeSeconds.name, () => {
  it('rounds a half second up, once (Baytime rule)', () => {
    // 2 h 4 min 59.5 s = 7,499.5 s → 7,500 s.
    expect(wholeSeconds(7_499.5)).toBe(7_500);
    expect(wholeSeconds(7_499.499)).toBe(7_499);
    expect(wholeSeconds(0)).toBe(0);
  });

  it('is not tipped by the float noise of adding a ledger’s seconds', () => {
    // Three intervals of whole milliseconds: 2,089.247 + 4,235.614 + 1,174.639 = 7,499.5 s exactly, by hand.
    const sum = [2_089.247, 4_235.614, 1_174.639].reduce((total, s) => total + s, 0);
    expect(sum).toBeLessThan(7_499.5); // the float sum falls just short of the half…
    expect(roundHalfUp(sum)).toBe(7_499); // …which rounding the sum as it is would lose
    expect(wholeSeconds(sum)).toBe(7_500);
  });
});

describe(wholeSecondsOfParts.name, () => {
  it('rounds each day at its running total, so the days add up to the week', () => {
    // Running totals 7,499.5 | 15,000 | 22,499.5 | 30,000 | 37,500 → 7,500 | 15,000 | 22,500 | 30,000 | 37,500,
    // less the one before. Each day rounded alone would be 7,500 + 7,501 + 7,500 + 7,501 + 7,500 = 37,502.
    const days = [7_499.5, 7_500.5, 7_499.5, 7_500.5, 7_500];
    expect(wholeSecondsOfParts(days)).toEqual([7_500, 7_500, 7_500, 7_500, 7_500]);
    // Six days of 6 h 40 min 0.5 s = 24,000.5 s: 144,003 s in all, not 6 × 24,001 = 144,006.
    const six = wholeSecondsOfParts(Array.from({ length: 6 }, () => 24_000.5));
    expect(six).toEqual([24_001, 24_000, 24_001, 24_000, 24_001, 24_000]);
    expect(hoursOf(six.reduce((total, s) => total + s, 0))).toBe(40.0008);
  });

  it('adds up to the whole seconds of the sum, each part within a second of its own', () => {
    const milliseconds = fc.array(fc.integer({ min: 0, max: 86_400_000 }), { maxLength: 7 });
    fc.assert(
      fc.property(milliseconds, (ms) => {
        const parts = ms.map((m) => m / 1000);
        const wholes = wholeSecondsOfParts(parts);
        const exact = ms.reduce((total, m) => total + m, 0) / 1000;
        expect(wholes.reduce((total, s) => total + s, 0)).toBe(wholeSeconds(exact));
        wholes.forEach((whole, i) => expect(Math.abs(whole - parts[i]!)).toBeLessThan(1));
      }),
    );
  });
});
