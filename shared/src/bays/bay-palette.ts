import type { BayState } from './bay-states.js';
import { BAY_STATE_WORDS } from '../words/floor-words.js';

/** Names of the state icons; each front end draws its own glyph for a name. */
export const BAY_STATE_ICONS = [
  'bay-empty',
  'car',
  'wrench',
  'hourglass',
  'pause',
  'magnifier',
  'flag',
] as const;
export type BayStateIcon = (typeof BAY_STATE_ICONS)[number];

export interface BayStateLook {
  /** The word shown with the colour and the icon: the state is never told by colour alone. */
  label: string;
  /** Fill of the state band, as #RRGGBB. */
  colour: string;
  /** Text drawn on that fill, as #RRGGBB: at least 7:1 against it. */
  textColour: string;
  icon: BayStateIcon;
}

/** Dark ink used on every light state fill, and on the light signal fills. */
export const INK = '#0B0D10';

/**
 * Hues taken from the Okabe–Ito set (safe for the common colour-vision deficiencies), some lightened
 * so that dark text on them reaches 7:1; `free` and `ready` are the two neutral ends of the scale.
 */
export const BAY_PALETTE: Readonly<Record<BayState, BayStateLook>> = {
  free: { label: BAY_STATE_WORDS.free, colour: '#9AA3AF', textColour: INK, icon: 'bay-empty' },
  staged: { label: BAY_STATE_WORDS.staged, colour: '#56B4E9', textColour: INK, icon: 'car' },
  working: { label: BAY_STATE_WORDS.working, colour: '#4DBB9D', textColour: INK, icon: 'wrench' },
  timer: { label: BAY_STATE_WORDS.timer, colour: '#F0E442', textColour: INK, icon: 'hourglass' },
  held: { label: BAY_STATE_WORDS.held, colour: '#E28E4D', textColour: INK, icon: 'pause' },
  check: { label: BAY_STATE_WORDS.check, colour: '#D694B9', textColour: INK, icon: 'magnifier' },
  ready: { label: BAY_STATE_WORDS.ready, colour: '#E8ECF1', textColour: INK, icon: 'flag' },
};

/** The wall board's page and tile backgrounds, which state fills must stand out from (3:1). */
export const WALL_BACKGROUND = '#0E1116';
export const WALL_SURFACE = '#161A21';

export function bayStateLook(state: BayState): BayStateLook {
  return BAY_PALETTE[state];
}

/**
 * Relative luminance of an sRGB colour, as defined in WCAG 2.2 ("relative luminance",
 * https://www.w3.org/TR/WCAG22/#dfn-relative-luminance): each channel linearised with the
 * 0.04045 threshold, then weighted 0.2126 R + 0.7152 G + 0.0722 B.
 */
export function relativeLuminance(hex: string): number {
  const match = /^#([0-9a-f]{2})([0-9a-f]{2})([0-9a-f]{2})$/i.exec(hex);
  if (!match) throw new Error(`Not a #RRGGBB colour: ${hex}`);
  const [r, g, b] = match.slice(1, 4).map((part) => {
    const c = parseInt(part, 16) / 255;
    return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
  }) as [number, number, number];
  return 0.2126 * r + 0.7152 * g + 0.0722 * b;
}

/**
 * Contrast ratio as defined in WCAG 2.2 ("contrast ratio",
 * https://www.w3.org/TR/WCAG22/#dfn-contrast-ratio): (L1 + 0.05) / (L2 + 0.05), L1 the lighter.
 */
export function contrastRatio(a: string, b: string): number {
  const [lighter, darker] = [relativeLuminance(a), relativeLuminance(b)].sort((x, y) => y - x) as [
    number,
    number,
  ];
  return (lighter + 0.05) / (darker + 0.05);
}
