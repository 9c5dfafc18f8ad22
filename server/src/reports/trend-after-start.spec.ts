import { describe, expect, it, vi } from 'vitest';
import { addIsoWeeks, workweekOf } from '@baytime/shared';
import { ShopService } from '../shop/shop.service.js';
import { startTestApp } from '../test-support/test-app.js';
import { WeekFiguresService } from './week-figures.service.js';

describe('the labour trend after a start', () => {
  it('is counted a little after the server starts, before anyone asks for a report', async () => {
    const counted = vi.spyOn(WeekFiguresService.prototype, 'shopSeconds');
    const sut = await startTestApp();
    try {
      const current = workweekOf(new Date(), sut.app.get(ShopService).settings());
      // The office's trend is the twelve weeks ending with the running one, which is counted on demand:
      // the eleven before it are the ones kept.
      const trend = Array.from({ length: 11 }, (_, i) => addIsoWeeks(current, i - 11));
      const countedWeeks = () => new Set(counted.mock.calls.flatMap(([labels]) => labels));
      await vi.waitFor(() => expect([...countedWeeks()]).toEqual(expect.arrayContaining(trend)), {
        timeout: 10_000,
        interval: 100,
      });
    } finally {
      counted.mockRestore();
      await sut.close();
    }
  });
});
