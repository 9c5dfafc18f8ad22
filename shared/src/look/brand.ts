/**
 * Baytime's one brand ramp, a violet darkest (10) to lightest (160): a hue no bay state uses, so a
 * brand-coloured button or link never reads as a bay state. Both apps build their Fluent theme from it.
 */
export const BRAND_RAMP = {
  10: '#17122B',
  20: '#1F1A43',
  30: '#28235C',
  40: '#312B76',
  50: '#3A3492',
  60: '#433CAE',
  70: '#4D46C8',
  80: '#554EDD',
  90: '#645AEB',
  100: '#7B6BED',
  110: '#8E7DEE',
  120: '#A08FF1',
  130: '#B4A3F8',
  140: '#CABBFF',
  150: '#DFD4FF',
  160: '#F4EEFF',
} as const;

export type BrandStep = keyof typeof BRAND_RAMP;

/**
 * The product mark on a 32-unit square: a bay's open door frame with a clock hand inside it, drawn
 * as strokes on a brand tile. Each app renders these shapes; none draws its own mark.
 */
export const BAYTIME_MARK = {
  viewBox: '0 0 32 32',
  tile: { rx: 7, fill: BRAND_RAMP[60] },
  strokes: [
    { d: 'M7 26V11.5L16 6l9 5.5V26', colour: BRAND_RAMP[160], width: 2.6 },
    { d: 'M16 13.5v5.5l3.5 2.5', colour: BRAND_RAMP[140], width: 2.6 },
    { d: 'M11 26h10', colour: BRAND_RAMP[160], width: 2.6 },
  ],
} as const;

/** The mark as one SVG document, for an `<img>`, a favicon or an app icon: every app shows this one. */
export function baytimeMarkSvg(): string {
  const { viewBox, tile, strokes } = BAYTIME_MARK;
  const paths = strokes.map(
    ({ d, colour, width }) =>
      `<path d="${d}" fill="none" stroke="${colour}" stroke-width="${width}" stroke-linecap="round" stroke-linejoin="round"/>`,
  );
  return `<svg xmlns="http://www.w3.org/2000/svg" viewBox="${viewBox}"><rect width="32" height="32" rx="${tile.rx}" fill="${tile.fill}"/>${paths.join('')}</svg>`;
}

/** The mark as a `data:` URL. */
export function baytimeMarkUrl(): string {
  return `data:image/svg+xml,${encodeURIComponent(baytimeMarkSvg())}`;
}
