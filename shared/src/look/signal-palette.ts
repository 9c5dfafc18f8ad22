import { BAY_PALETTE, INK } from '../bays/bay-palette.js';
import { BAY_STATES } from '../bays/bay-states.js';
import { BRAND_RAMP } from './brand.js';

export interface SignalLook {
  /** On the dark screens (wall, kiosk): a fill behind `INK`, or text and outlines on the dark surfaces. */
  onDark: string;
  /** On the light office: text on white, or a fill behind white text. */
  onLight: string;
  /** What tells it apart where colour alone would carry it: drawn with the colour every time. */
  cue: string;
}

/**
 * Colours for everything that is not a bay state. None is a bay-state colour, so a state colour
 * always means that state: a button, an over-booked line or an idle technician never borrows one.
 */
export const SIGNAL_PALETTE = {
  /** Something to press: start, clock on, save, pair. The brand colour. */
  action: {
    onDark: BRAND_RAMP[130],
    onLight: BRAND_RAMP[80],
    cue: 'a button shape with its word',
  },
  /** Needs someone to look: over book time, forecast late, a caution, an error, the link lost. */
  attention: {
    onDark: '#FF8282',
    onLight: '#B3263E',
    cue: 'the caution glyph; hatching on a bar past book time',
  },
  /** A technician on shift with no job: told by a dashed outline and the idle glyph, not by hue. */
  idle: {
    onDark: '#C9D1DB',
    onLight: '#4A5563',
    cue: 'a dashed outline and the idle glyph',
  },
} as const satisfies Record<string, SignalLook>;

export type Signal = keyof typeof SIGNAL_PALETTE;

/**
 * Every colour of the look as CSS custom properties, so the apps' style sheets name a meaning and
 * never copy a value: `--bt-state-<state>` (and `-text`), `--bt-signal-<signal>` for the dark screens
 * (and `-on-light` for the office), `--bt-ink`, `--bt-brand-<step>`.
 */
export function lookCustomProperties(): Record<string, string> {
  const properties: Record<string, string> = { '--bt-ink': INK };
  for (const state of BAY_STATES) {
    properties[`--bt-state-${state}`] = BAY_PALETTE[state].colour;
    properties[`--bt-state-${state}-text`] = BAY_PALETTE[state].textColour;
  }
  for (const [signal, look] of Object.entries(SIGNAL_PALETTE)) {
    properties[`--bt-signal-${signal}`] = look.onDark;
    properties[`--bt-signal-${signal}-on-light`] = look.onLight;
  }
  for (const [step, colour] of Object.entries(BRAND_RAMP)) properties[`--bt-brand-${step}`] = colour;
  return properties;
}

/** Sets the look's custom properties on an element (the document root at start-up). */
export function applyLook(element: { style: { setProperty(name: string, value: string): void } }): void {
  for (const [name, value] of Object.entries(lookCustomProperties())) element.style.setProperty(name, value);
}
