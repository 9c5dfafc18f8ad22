import { describe, expect, it } from 'vitest';
import { BAY_STATES, HOLD_REASONS } from './bays.schema.js';
import { TIMER_KINDS } from '../timers/timers.schema.js';
import {
  BAY_PALETTE,
  BAY_STATE_ICONS,
  WALL_BACKGROUND,
  WALL_SURFACE,
  contrastRatio,
  relativeLuminance,
} from './bay-palette.js';
import { HOLD_REASON_LABELS, TIMER_KIND_LABELS } from '../words/floor-words.js';

describe(contrastRatio.name, () => {
  // WCAG 2.2, "contrast ratio": ratios range from 1 (same colour) to 21 (black on white).
  it('gives 21:1 for black on white and 1:1 for a colour on itself', () => {
    expect(contrastRatio('#000000', '#FFFFFF')).toBeCloseTo(21, 10);
    expect(contrastRatio('#FFFFFF', '#000000')).toBeCloseTo(21, 10);
    expect(contrastRatio('#56B4E9', '#56B4E9')).toBe(1);
  });

  // WebAIM contrast checker (public tool implementing the WCAG formula): #767676 on white is 4.54:1,
  // the lightest grey that passes 1.4.3 AA for body text; #777777 gives 4.48:1 and fails it.
  it('matches published grey-on-white figures', () => {
    expect(contrastRatio('#767676', '#FFFFFF')).toBeCloseTo(4.54, 2);
    expect(contrastRatio('#777777', '#FFFFFF')).toBeCloseTo(4.48, 2);
  });

  it('rejects a colour that is not #RRGGBB', () => {
    expect(() => relativeLuminance('teal')).toThrow(/RRGGBB/);
  });
});

describe('BAY_PALETTE', () => {
  it('has a look for every bay state, each with its own word, colour and icon', () => {
    expect(Object.keys(BAY_PALETTE).sort()).toEqual([...BAY_STATES].sort());
    const looks = BAY_STATES.map((state) => BAY_PALETTE[state]);
    expect(new Set(looks.map((look) => look.label)).size).toBe(BAY_STATES.length);
    expect(new Set(looks.map((look) => look.colour.toUpperCase())).size).toBe(BAY_STATES.length);
    expect(new Set(looks.map((look) => look.icon)).size).toBe(BAY_STATES.length);
    for (const look of looks) expect(BAY_STATE_ICONS).toContain(look.icon);
  });

  // WCAG 2.2 SC 1.4.6 (Contrast, enhanced): 7:1 for text; the board aims for it because of glare and distance.
  it.each(BAY_STATES)('draws the %s word at 7:1 or more on its fill', (state) => {
    const look = BAY_PALETTE[state];
    expect(contrastRatio(look.colour, look.textColour)).toBeGreaterThanOrEqual(7);
  });

  // WCAG 2.2 SC 1.4.11 (Non-text contrast): a state indicator needs 3:1 against what surrounds it.
  it.each(BAY_STATES)('sets the %s fill apart from the wall background at 3:1 or more', (state) => {
    const { colour } = BAY_PALETTE[state];
    expect(contrastRatio(colour, WALL_BACKGROUND)).toBeGreaterThanOrEqual(3);
    expect(contrastRatio(colour, WALL_SURFACE)).toBeGreaterThanOrEqual(3);
  });

  it('labels every hold reason and timer kind', () => {
    for (const reason of HOLD_REASONS) expect(HOLD_REASON_LABELS[reason]).toMatch(/^[A-Z]/);
    for (const kind of TIMER_KINDS) expect(TIMER_KIND_LABELS[kind]).toMatch(/^[A-Z]/);
  });
});
