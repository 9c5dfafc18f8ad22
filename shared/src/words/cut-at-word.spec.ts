import { describe, expect, it } from 'vitest';
import { cutAtWord, oneLine } from './cut-at-word.js';

describe(cutAtWord.name, () => {
  it('keeps a text that fits, and cuts a longer one at a word with an ellipsis, within the length', () => {
    expect(cutAtWord('Rear wiper blade split', 22)).toBe('Rear wiper blade split');
    const cut = cutAtWord('Oil leak, rear main seal, pan gasket', 20);
    expect(cut).toBe('Oil leak, rear main…');
    expect(cut.length).toBeLessThanOrEqual(20);
  });

  it('cuts one long word where it must rather than leave almost nothing', () => {
    expect(cutAtWord('x'.repeat(80), 10)).toBe(`${'x'.repeat(9)}…`);
  });
});

describe(oneLine.name, () => {
  it('puts a text on one line before cutting it', () => {
    expect(oneLine('  Rear wiper\n blade   split  ', 60)).toBe('Rear wiper blade split');
    expect(oneLine('Grinding and a pull\nto the left under hard braking', 30)).toBe(
      'Grinding and a pull to the…',
    );
  });
});
