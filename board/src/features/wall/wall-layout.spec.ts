import { describe, expect, it } from 'vitest';
import { lineChars, pageAt, pageItems, tileRoom, unitPx, wallLayout } from './wall-layout';

const hd = { width: 1920, height: 1080 };
const uhd = { width: 3840, height: 2160 };

describe(wallLayout.name, () => {
  it('puts 8 bays on one page, 4 by 2', () => {
    expect(wallLayout(8, hd)).toMatchObject({ columns: 4, rows: 2, pages: 1, perPage: 8 });
  });

  it('puts 4 bays side by side in tall tiles', () => {
    expect(wallLayout(4, hd)).toMatchObject({ columns: 4, rows: 1, pages: 1 });
  });

  it('pages larger shops in balanced groups', () => {
    expect(wallLayout(9, hd)).toMatchObject({ pages: 2, perPage: 5, columns: 3, rows: 2 });
    expect(wallLayout(16, hd)).toMatchObject({ pages: 2, perPage: 8 });
    expect(wallLayout(30, hd)).toMatchObject({ pages: 4, perPage: 8, columns: 4, rows: 2 });
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
});

describe(pageAt.name, () => {
  it('turns every 15 s and wraps', () => {
    expect(pageAt(1, 123_456)).toBe(0);
    expect(pageAt(3, 0)).toBe(0);
    expect(pageAt(3, 15_000)).toBe(1);
    expect(pageAt(3, 45_000)).toBe(0);
  });

  it('slices the page', () => {
    const layout = wallLayout(9, hd);
    expect(pageItems([1, 2, 3, 4, 5, 6, 7, 8, 9], layout, 1)).toEqual([6, 7, 8, 9]);
  });
});
