import { describe, expect, it } from 'vitest';
import { pageQuerySchema } from './page.schema.js';

describe('pageQuerySchema', () => {
  const limitOf = (limit?: string) => pageQuerySchema.parse({ limit }).limit;

  it('clamps a limit above 100 to 100 and takes 50 when none is given', () => {
    expect(limitOf('1000')).toBe(100);
    expect(limitOf('101')).toBe(100);
    expect(limitOf('99999999999')).toBe(100);
    expect(limitOf('100')).toBe(100);
    expect(limitOf('7')).toBe(7);
    expect(limitOf()).toBe(50);
  });

  it('refuses a limit that is not whole digits of at least 1', () => {
    for (const limit of ['0', '-1', '0x10', '1e3', '2.5', ' 5', ''])
      expect(pageQuerySchema.safeParse({ limit }).error?.issues[0]?.path, limit).toEqual(['limit']);
  });

  it('takes a cursor only as URL-safe base64 text', () => {
    expect(pageQuerySchema.parse({ cursor: 'MTcwMC4xMg' }).cursor).toBe('MTcwMC4xMg');
    expect(pageQuerySchema.safeParse({ cursor: 'a/b' }).error?.issues[0]?.path).toEqual(['cursor']);
  });
});
