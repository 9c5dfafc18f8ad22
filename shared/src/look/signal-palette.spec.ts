import { describe, expect, it } from 'vitest';
import {
  BAY_PALETTE,
  BAY_STATE_ICONS,
  INK,
  WALL_BACKGROUND,
  WALL_SURFACE,
  contrastRatio,
} from '../bays/bay-palette.js';
import { BAY_STATES } from '../bays/bays.schema.js';
import { FINDING_SEVERITIES } from '../findings/findings.schema.js';
import { BRAND_RAMP } from './brand.js';
import { FINDING_SEVERITY_ICONS, MEANING_ICONS } from './meaning-icons.js';
import { SIGNAL_PALETTE, lookCustomProperties, type Signal } from './signal-palette.js';

const SIGNALS = Object.keys(SIGNAL_PALETTE) as Signal[];
/** The kiosk's darkest and lightest dark surfaces (page and raised card), as in its base style sheet. */
const KIOSK_SURFACES = ['#0D1318', '#1C2630'];
const WHITE = '#FFFFFF';

describe('SIGNAL_PALETTE', () => {
  it('never reuses a bay-state colour', () => {
    const stateColours = new Set(BAY_STATES.map((state) => BAY_PALETTE[state].colour.toUpperCase()));
    for (const signal of SIGNALS) {
      expect(stateColours).not.toContain(SIGNAL_PALETTE[signal].onDark.toUpperCase());
      expect(stateColours).not.toContain(SIGNAL_PALETTE[signal].onLight.toUpperCase());
    }
  });

  // WCAG 2.2 SC 1.4.6 (Contrast, enhanced): 7:1 for text. A signal fill carries dark ink words.
  it.each(SIGNALS)('carries ink words on the %s fill at 7:1 or more', (signal) => {
    expect(contrastRatio(SIGNAL_PALETTE[signal].onDark, INK)).toBeGreaterThanOrEqual(7);
  });

  // WCAG 2.2 SC 1.4.3 (Contrast, minimum): 4.5:1 for text; the wall aims for 7:1 (SC 1.4.6).
  it.each(SIGNALS)('draws %s text at 7:1 on the wall and 4.5:1 on the kiosk', (signal) => {
    const { onDark } = SIGNAL_PALETTE[signal];
    expect(contrastRatio(onDark, WALL_BACKGROUND)).toBeGreaterThanOrEqual(7);
    expect(contrastRatio(onDark, WALL_SURFACE)).toBeGreaterThanOrEqual(7);
    for (const surface of KIOSK_SURFACES) expect(contrastRatio(onDark, surface)).toBeGreaterThanOrEqual(4.5);
  });

  // WCAG 2.2 SC 1.4.3: 4.5:1 for the office's text on white, and white text on the fill.
  it.each(SIGNALS)('draws %s text on the light office at 4.5:1 or more', (signal) => {
    expect(contrastRatio(SIGNAL_PALETTE[signal].onLight, WHITE)).toBeGreaterThanOrEqual(4.5);
  });

  it('names every colour once as a custom property', () => {
    const properties = lookCustomProperties();
    expect(properties['--bt-state-held']).toBe(BAY_PALETTE.held.colour);
    expect(properties['--bt-state-held-text']).toBe(INK);
    expect(properties['--bt-signal-attention']).toBe(SIGNAL_PALETTE.attention.onDark);
    expect(properties['--bt-signal-attention-on-light']).toBe(SIGNAL_PALETTE.attention.onLight);
    expect(properties['--bt-brand-80']).toBe(BRAND_RAMP[80]);
    expect(Object.keys(properties)).toHaveLength(1 + BAY_STATES.length * 2 + SIGNALS.length * 2 + 16);
  });
});

describe('BRAND_RAMP', () => {
  it('runs from dark to light', () => {
    const steps = Object.values(BRAND_RAMP).map((colour) => contrastRatio(colour, '#000000'));
    expect(steps).toEqual([...steps].sort((a, b) => a - b));
    expect(new Set(steps).size).toBe(16);
  });

  // WCAG 2.2 SC 1.4.3: Fluent puts white words on brand 80 (primary buttons, light theme) and on brand
  // 70 (dark theme); the dark screens put brand 130 words on their surfaces.
  it('keeps white words on brand 70 and 80, and brand 130 words on the dark screens, at 4.5:1', () => {
    expect(contrastRatio(BRAND_RAMP[80], WHITE)).toBeGreaterThanOrEqual(4.5);
    expect(contrastRatio(BRAND_RAMP[70], WHITE)).toBeGreaterThanOrEqual(4.5);
    for (const surface of [...KIOSK_SURFACES, WALL_BACKGROUND]) {
      expect(contrastRatio(BRAND_RAMP[130], surface)).toBeGreaterThanOrEqual(4.5);
    }
  });
});

describe('MEANING_ICONS', () => {
  it('never draws a state icon for another meaning', () => {
    for (const icon of MEANING_ICONS) expect(BAY_STATE_ICONS as readonly string[]).not.toContain(icon);
  });

  it('gives each finding severity its own icon', () => {
    const icons = FINDING_SEVERITIES.map((severity) => FINDING_SEVERITY_ICONS[severity]);
    expect(new Set(icons).size).toBe(FINDING_SEVERITIES.length);
    for (const icon of icons) expect(MEANING_ICONS).toContain(icon);
  });
});
