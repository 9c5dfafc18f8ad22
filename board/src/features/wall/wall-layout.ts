/**
 * Grid and paging for the wall. Every size is in board units: 1 unit = min(1vh, 0.5625vw), i.e. 1 % of
 * the height of the largest 16:9 area, so a 1080p and a 2160p screen show exactly the same board.
 */

/** Body text: 7.4 units is a cap height of about 56 px at 1080p (Barlow's caps are 0.7 em). */
export const BODY_UNITS = 7.4;
/** Bay names and countdowns: about 95 px caps at 1080p. */
export const HEADLINE_UNITS = 12.6;

/** Fixed bands of the wall, in units. */
export const WALL_METRICS = {
  padding: 0.8,
  gap: 0.8,
  topBar: 9,
  strip: 8.6,
  /** A tile narrower than this cannot hold a state word and its icon at body size. */
  minTileWidth: 40,
  /** A tile shorter than this cannot hold the name, the state and one line. */
  minTileHeight: 30,
  /** Tiles per page when both rows and columns are at their limit. */
  maxPerPage: 8,
} as const;

/** Tile innards, in units. */
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

export interface WallLayout {
  columns: number;
  rows: number;
  perPage: number;
  pages: number;
  /** Tile size in units. */
  tileWidth: number;
  tileHeight: number;
}

/** Size of the board unit in CSS pixels. */
export function unitPx({ width, height }: Viewport): number {
  return Math.max(1, Math.min(height / 100, (width * 0.5625) / 100));
}

export function wallLayout(bayCount: number, viewport: Viewport): WallLayout {
  const u = unitPx(viewport);
  const { padding, gap, topBar, strip, minTileWidth, minTileHeight, maxPerPage } = WALL_METRICS;
  const gridWidth = viewport.width / u - 2 * padding;
  const gridHeight = viewport.height / u - 2 * padding - topBar - strip - 2 * gap;
  const maxColumns = Math.max(1, Math.floor((gridWidth + gap) / (minTileWidth + gap)));
  const maxRows = Math.max(1, Math.floor((gridHeight + gap) / (minTileHeight + gap)));
  const capacity = Math.max(1, Math.min(maxPerPage, maxColumns * Math.min(maxRows, 2)));

  const count = Math.max(1, bayCount);
  const pages = Math.ceil(count / capacity);
  // Balanced pages: 9 bays make two pages of 5 and 4, not 8 and 1.
  const perPage = Math.ceil(count / pages);
  // One row while the bays fit side by side (tall tiles show every fact), two rows after that.
  const rows = perPage <= maxColumns ? 1 : Math.min(2, maxRows);
  const columns = Math.min(maxColumns, Math.ceil(perPage / rows));
  const finalRows = Math.ceil(perPage / columns);
  return {
    columns,
    rows: finalRows,
    perPage,
    pages,
    tileWidth: (gridWidth - (columns - 1) * gap) / columns,
    tileHeight: (gridHeight - (finalRows - 1) * gap) / finalRows,
  };
}

/** Which page shows at `nowMs`; every screen on the same server clock turns at the same moment. */
export function pageAt(pages: number, nowMs: number, periodMs = 15_000): number {
  if (pages <= 1) return 0;
  return Math.floor(nowMs / periodMs) % pages;
}

export function pageItems<T>(items: readonly T[], layout: WallLayout, page: number): T[] {
  const start = Math.min(page, layout.pages - 1) * layout.perPage;
  return items.slice(start, start + layout.perPage);
}

/** Characters of body text a tile line holds (Barlow Semi Condensed averages about 0.47 em). */
export function lineChars(tileWidth: number): number {
  return Math.max(4, Math.floor((tileWidth - 2 * 1.6) / (BODY_UNITS * 0.47)));
}

export interface TileRoom {
  /** Body lines left for facts under the name and the state band. */
  slots: number;
  /** Lines left when one of them is a big countdown. */
  slotsWithBig: number;
}

export function tileRoom(tileHeight: number, withBar: boolean): TileRoom {
  const { padding, name, band, linesPadding, line, bigLine, bar } = TILE_METRICS;
  // A hair of slack for rounding, so a line that fits on paper is not dropped.
  const free = tileHeight - 2 * padding - name - band - linesPadding - (withBar ? bar : 0) + 0.05;
  const slots = Math.max(0, Math.floor(free / line));
  const slotsWithBig = free >= bigLine ? 1 + Math.max(0, Math.floor((free - bigLine) / line)) : 0;
  return { slots, slotsWithBig };
}
