import { describe, expect, it } from 'vitest';
import {
  BODY_UNITS,
  MIN_TILE_SCALE,
  heldBandParts,
  lineChars,
  pageAt,
  pageItems,
  tileRoom,
  unitPx,
  wallLayout,
} from './wall-layout';

const hd = { width: 1920, height: 1080 };
const uhd = { width: 3840, height: 2160 };
const portrait = { width: 1080, height: 1920 };

describe(wallLayout.name, () => {
  it('puts 8 bays on one page, 4 by 2, at full text size', () => {
    expect(wallLayout(8, hd)).toMatchObject({ columns: 4, rows: 2, pages: 1, perPage: 8, scale: 1 });
  });

  it('puts 4 bays side by side in tall tiles', () => {
    expect(wallLayout(4, hd)).toMatchObject({ columns: 4, rows: 1, pages: 1 });
  });

  it('puts 12 bays on one page, 4 by 3 on a wide screen and 3 by 4 on a tall one', () => {
    expect(wallLayout(12, hd)).toMatchObject({ columns: 4, rows: 3, pages: 1, perPage: 12 });
    expect(wallLayout(12, portrait)).toMatchObject({ columns: 3, rows: 4, pages: 1, perPage: 12 });
    expect(wallLayout(9, hd)).toMatchObject({ columns: 3, rows: 3, pages: 1 });
  });

  it('pages only when one page would take the text below legible size, in balanced groups', () => {
    expect(wallLayout(15, hd)).toMatchObject({ pages: 1, columns: 5, rows: 3 });
    expect(wallLayout(16, hd)).toMatchObject({ pages: 2, perPage: 8, columns: 4, rows: 2 });
    expect(wallLayout(24, hd)).toMatchObject({ pages: 2, perPage: 12, columns: 4, rows: 3 });
    expect(wallLayout(30, hd)).toMatchObject({ pages: 2, perPage: 15, columns: 5, rows: 3 });
  });

  it('never sets tile text below 44 px caps at 1080p (DISPLAY.md: 16′ at 6 m on a 55-inch TV)', () => {
    for (let count = 1; count <= 60; count++)
      for (const viewport of [hd, portrait, { width: 1280, height: 720 }, { width: 2560, height: 1080 }]) {
        const layout = wallLayout(count, viewport);
        // Barlow's caps are 0.7 em; one unit is 1 % of the 16:9 area's height.
        const capsAt1080 = BODY_UNITS * layout.scale * 0.7 * 10.8;
        expect(capsAt1080).toBeGreaterThanOrEqual(44);
        expect(layout.scale).toBeGreaterThanOrEqual(MIN_TILE_SCALE);
        expect(layout.columns * layout.rows).toBeGreaterThanOrEqual(layout.perPage);
        expect(layout.perPage * layout.pages).toBeGreaterThanOrEqual(count);
      }
  });

  it('makes room for a shop name that wraps onto a second line', () => {
    const shorter = { width: 177.8 - 1.6, height: 79.2 - 6 };
    const layout = wallLayout(12, hd, shorter);
    expect(layout).toMatchObject({ columns: 4, rows: 3, pages: 1 });
    expect(layout.scale).toBeLessThan(wallLayout(12, hd).scale);
  });

  it('lays out 4K exactly like 1080p', () => {
    for (const count of [4, 8, 12, 30]) expect(wallLayout(count, uhd)).toEqual(wallLayout(count, hd));
    expect(unitPx(uhd)).toBe(2 * unitPx(hd));
  });

  it('keeps every tile big enough for the state word and two lines of facts at 8 a page', () => {
    const layout = wallLayout(8, hd);
    expect(layout.tileWidth).toBeGreaterThanOrEqual(40);
    expect(tileRoom(layout.tileHeight, true).slots).toBeGreaterThanOrEqual(2);
    expect(tileRoom(layout.tileHeight, false).slotsWithBig).toBeGreaterThanOrEqual(2);
    expect(lineChars(layout.tileWidth)).toBe(11);
  });

  it('gives a held bay its icon and time in the band on four columns, the time alone on five', () => {
    const four = wallLayout(12, hd);
    const five = wallLayout(13, hd);
    expect([four.columns, five.columns]).toEqual([4, 5]);
    expect(heldBandParts(four.tileWidth, four.scale)).toEqual({ icon: true, note: true });
    // Measured in chromium: "HELD" and "10h" overflowed a five-column band with the icon by 2 px.
    expect(heldBandParts(five.tileWidth, five.scale)).toEqual({ icon: false, note: true });
  });

  it('always leaves a held bay room for its time, whatever the shop and the screen', () => {
    for (let count = 1; count <= 60; count++)
      for (const viewport of [hd, portrait, { width: 1280, height: 720 }, { width: 2560, height: 1080 }]) {
        const layout = wallLayout(count, viewport);
        expect(heldBandParts(layout.tileWidth, layout.scale).note).toBe(true);
      }
    expect(heldBandParts(20, 1)).toEqual({ icon: true, note: false });
  });

  it('keeps one line of facts on a tile of a 12-bay page', () => {
    const layout = wallLayout(12, hd);
    expect(tileRoom(layout.tileHeight, false, layout.scale).slots).toBe(1);
    expect(lineChars(layout.tileWidth, layout.scale)).toBeGreaterThanOrEqual(11);
  });
});

describe(pageAt.name, () => {
  it('turns every 15 s and wraps', () => {
    expect(pageAt(1, 123_456)).toBe(0);
    expect(pageAt(3, 0)).toBe(0);
    expect(pageAt(3, 15_000)).toBe(1);
    expect(pageAt(3, 45_000)).toBe(0);
  });

  it('slices the page', () => {
    const layout = wallLayout(16, hd);
    expect(pageItems([...Array(16).keys()], layout, 1)).toEqual([8, 9, 10, 11, 12, 13, 14, 15]);
  });
});
