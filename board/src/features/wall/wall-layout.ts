/**
 * Grid and paging for the wall. Every size is in board units: 1 unit = min(1vh, 0.5625vw), i.e. 1 % of
 * the height of the largest 16:9 area, so a 1080p and a 2160p screen show exactly the same board.
 */

/** Body text: 7.4 units is a cap height of about 56 px at 1080p (Barlow's caps are 0.7 em). */
export const BODY_UNITS = 7.4;
/** Bay names and countdowns: about 95 px caps at 1080p. */
export const HEADLINE_UNITS = 12.6;

/**
 * Tiles shrink their text with the tile down to this share of the sizes above, and no further: body
 * caps of 7.4 × 0.8 units are 45 px at 1080p, over the 44 px that DISPLAY.md never goes below (16′
 * of visual angle at 6 m). Past that the board pages instead.
 */
export const MIN_TILE_SCALE = 0.8;

/** Fixed bands of the wall, in units: the first guess, before the board measures its own grid. */
export const WALL_METRICS = {
  padding: 0.8,
  gap: 0.8,
  topBar: 9,
  strip: 8.6,
  /** Narrower than this at full text size, a tile cannot hold its widest state word, icon and note. */
  minTileWidth: 42,
} as const;

/** Tile innards at full text size, in units; everything but the tile's own padding scales with the text. */
export const TILE_METRICS = {
  padding: 0.6,
  /** Line height 0.92 plus room below for descenders, less the empty ascent above the caps. */
  name: HEADLINE_UNITS * (0.92 + 0.14 - 0.13),
  /** Band text, its padding and the space above it. */
  band: BODY_UNITS + 2 * 0.3 + 0.4,
  linesPadding: 0.4,
  line: BODY_UNITS,
  bigLine: 10,
  /** The bar and the space above it. */
  bar: 2 + 0.4,
} as const;

export interface Viewport {
  width: number;
  height: number;
}

/** The area the grid of tiles gets, in units. */
export interface GridArea {
  width: number;
  height: number;
}

export interface WallLayout {
  columns: number;
  rows: number;
  perPage: number;
  pages: number;
  /** Tile size in units. */
  tileWidth: number;
  tileHeight: number;
  /** Share of the full text sizes the tiles use, MIN_TILE_SCALE to 1. */
  scale: number;
}

/** Size of the board unit in CSS pixels. */
export function unitPx({ width, height }: Viewport): number {
  return Math.max(1, Math.min(height / 100, (width * 0.5625) / 100));
}

/** The grid's area when the top bar and the strip have their usual heights. */
export function defaultGridArea(viewport: Viewport): GridArea {
  const u = unitPx(viewport);
  const { padding, gap, topBar, strip } = WALL_METRICS;
  return {
    width: viewport.width / u - 2 * padding,
    height: viewport.height / u - 2 * padding - topBar - strip - 2 * gap,
  };
}

interface Grid {
  columns: number;
  rows: number;
  tileWidth: number;
  tileHeight: number;
  scale: number;
}

/** The text scale a tile of this size allows: its name, its state band and one line of facts must fit. */
export function tileScale(tileWidth: number, tileHeight: number): number {
  const { padding, name, band, linesPadding, line } = TILE_METRICS;
  const byHeight = (tileHeight - 2 * padding) / (name + band + linesPadding + line);
  return Math.min(1, byHeight, tileWidth / WALL_METRICS.minTileWidth);
}

function grid(columns: number, rows: number, area: GridArea): Grid {
  const { gap } = WALL_METRICS;
  const tileWidth = (area.width - (columns - 1) * gap) / columns;
  const tileHeight = (area.height - (rows - 1) * gap) / rows;
  return { columns, rows, tileWidth, tileHeight, scale: tileScale(tileWidth, tileHeight) };
}

/** A bay tells at most five facts (bay-facts): lines past that are empty space. */
const MOST_FACTS = 5;

/** More fact lines first, then fewer empty cells, then wider tiles (longer lines). */
function roomier(a: Grid, b: Grid, count: number): boolean {
  const linesA = Math.min(MOST_FACTS, tileRoom(a.tileHeight, false, a.scale).slots);
  const linesB = Math.min(MOST_FACTS, tileRoom(b.tileHeight, false, b.scale).slots);
  if (linesA !== linesB) return linesA > linesB;
  const emptyA = a.columns * a.rows - count;
  const emptyB = b.columns * b.rows - count;
  if (emptyA !== emptyB) return emptyA < emptyB;
  return a.tileWidth > b.tileWidth;
}

/** The grid for `count` tiles whose text is largest; among equals, the roomiest. */
function bestGrid(count: number, area: GridArea): Grid {
  let best: Grid | null = null;
  for (let columns = 1; columns <= count; columns++) {
    const candidate = grid(columns, Math.ceil(count / columns), area);
    const scale = Math.round(candidate.scale * 1000);
    const bestScale = best ? Math.round(best.scale * 1000) : -Infinity;
    if (!best || scale > bestScale || (scale === bestScale && roomier(candidate, best, count)))
      best = candidate;
  }
  return best ?? grid(1, 1, area);
}

/** The most tiles one page holds with every tile's text at legible size (at least one). */
function pageCapacity(area: GridArea): number {
  const { gap, minTileWidth } = WALL_METRICS;
  const narrowest = minTileWidth * MIN_TILE_SCALE;
  const maxColumns = Math.max(1, Math.floor((area.width + gap) / (narrowest + gap)));
  let capacity = 1;
  for (let columns = 1; columns <= maxColumns; columns++)
    for (let rows = 1; grid(columns, rows, area).scale >= MIN_TILE_SCALE; rows++)
      capacity = Math.max(capacity, columns * rows);
  return capacity;
}

/**
 * Columns and rows from the bay count and the shape of the grid's area, so the tiles' text is as
 * large as it can be; the board pages only when one page would take the text below legible size.
 */
export function wallLayout(
  bayCount: number,
  viewport: Viewport,
  area = defaultGridArea(viewport),
): WallLayout {
  const count = Math.max(1, bayCount);
  const pages = Math.ceil(count / pageCapacity(area));
  // Balanced pages: 16 bays make two pages of 8, not 15 and 1.
  const perPage = Math.ceil(count / pages);
  const { columns, rows, tileWidth, tileHeight, scale } = bestGrid(perPage, area);
  return { columns, rows, perPage, pages, tileWidth, tileHeight, scale: Math.max(MIN_TILE_SCALE, scale) };
}

/** Which page shows at `nowMs`; every screen on the same server clock turns at the same moment. */
export function pageAt(pages: number, nowMs: number, periodMs = 15_000): number {
  if (pages <= 1) return 0;
  return Math.floor(nowMs / periodMs) % pages;
}

/** The items on one page of a layout that shows `perPage` a page (bays, or people). */
export function pageItems<T>(
  items: readonly T[],
  layout: Pick<WallLayout, 'pages' | 'perPage'>,
  page: number,
): T[] {
  const start = Math.min(page, layout.pages - 1) * layout.perPage;
  return items.slice(start, start + layout.perPage);
}

/** Characters of body text a tile line holds (Barlow Semi Condensed averages about 0.41 em; 0.47 is safe). */
export function lineChars(tileWidth: number, scale = 1): number {
  return Math.max(4, Math.floor((tileWidth - 2 * 1.6) / (BODY_UNITS * scale * 0.47)));
}

/** A state band's parts in ems of the wall's bold font (Barlow Semi Condensed), measured in chromium. */
const BAND_EMS = { icon: 1, heldWord: 2.19, widestHeldNote: 1.67 } as const;
/** The band's side padding and the gap between its parts, in units: they do not scale with the text. */
const BAND_SPACING = { padding: 1.6, gap: 1.4 } as const;

/**
 * What a held bay's band has room for besides its word: the icon and the longest time held ("59m"),
 * or the time alone (five columns, say: the word and the time say more than the icon does), or the
 * icon alone, on a tile narrower than the board ever makes one.
 */
export function heldBandParts(tileWidth: number, scale = 1): { icon: boolean; note: boolean } {
  const { icon, heldWord, widestHeldNote } = BAND_EMS;
  const { padding, gap } = BAND_SPACING;
  const needs = (ems: number, gaps: number) => 2 * padding + gaps * gap + ems * BODY_UNITS * scale;
  const note = tileWidth >= needs(heldWord + widestHeldNote, 1);
  return { icon: !note || tileWidth >= needs(icon + heldWord + widestHeldNote, 2), note };
}

export interface TileRoom {
  /** Body lines left for facts under the name and the state band. */
  slots: number;
  /** Lines left when one of them is a big countdown. */
  slotsWithBig: number;
}

export function tileRoom(tileHeight: number, withBar: boolean, scale = 1): TileRoom {
  const { padding, name, band, linesPadding, line, bigLine, bar } = TILE_METRICS;
  // A hair of slack for rounding, so a line that fits on paper is not dropped.
  const free = (tileHeight - 2 * padding) / scale - name - band - linesPadding - (withBar ? bar : 0) + 0.05;
  const slots = Math.max(0, Math.floor(free / line));
  const slotsWithBig = free >= bigLine ? 1 + Math.max(0, Math.floor((free - bigLine) / line)) : 0;
  return { slots, slotsWithBig };
}
