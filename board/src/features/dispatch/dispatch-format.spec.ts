import { describe, expect, it } from 'vitest';
import { formatEfficiency, formatShopTime } from './dispatch-format';

const NOW = Date.parse('2026-03-04T15:00:00.000Z'); // Wednesday 9:00 AM in Chicago (CST, UTC−6)
const ZONE = 'America/Chicago';

describe(formatEfficiency.name, () => {
  it('shows a percentage, or "new" without history', () => {
    expect(formatEfficiency(1.2867)).toBe('129 %');
    expect(formatEfficiency(null)).toBe('new');
  });
});

describe(formatShopTime.name, () => {
  it('shows only the time for today in the shop zone', () => {
    expect(formatShopTime('2026-03-04T22:30:00.000Z', NOW, ZONE)).toBe('4:30 pm');
  });
  it('adds the weekday within the week and the date further out', () => {
    expect(formatShopTime('2026-03-05T14:00:00.000Z', NOW, ZONE)).toBe('Thu 8:00 am');
    expect(formatShopTime('2026-03-16T13:00:00.000Z', NOW, ZONE)).toBe('Mar 16 8:00 am');
  });
  it('uses the shop day, not the UTC day', () => {
    // 03:00 UTC on the 5th is still the 4th in Chicago.
    expect(formatShopTime('2026-03-05T03:00:00.000Z', NOW, ZONE)).toBe('9:00 pm');
  });
});
