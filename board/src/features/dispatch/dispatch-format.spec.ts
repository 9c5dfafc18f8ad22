import { describe, expect, it } from 'vitest';
import { formatBookHours, formatEfficiency, formatHm, formatShopTime, formatWait } from './dispatch-format';

const NOW = Date.parse('2026-03-04T15:00:00.000Z'); // Wednesday 9:00 AM in Chicago (CST, UTC−6)
const ZONE = 'America/Chicago';

describe(formatHm.name, () => {
  it('writes hours and minutes', () => {
    expect(formatHm(0)).toBe('0:00');
    expect(formatHm(3006)).toBe('0:50');
    expect(formatHm(5400)).toBe('1:30');
    expect(formatHm(-20)).toBe('0:00');
  });
});

describe(formatBookHours.name, () => {
  it('keeps one decimal and drops a trailing zero', () => {
    expect(formatBookHours(1.5)).toBe('1.5 h');
    expect(formatBookHours(2)).toBe('2 h');
    expect(formatBookHours(0.30000000000000004)).toBe('0.3 h');
  });
});

describe(formatWait.name, () => {
  it('grows from minutes to hours to days', () => {
    expect(formatWait('2026-03-04T14:59:40.000Z', NOW)).toBe('just now');
    expect(formatWait('2026-03-04T14:48:00.000Z', NOW)).toBe('12 min');
    expect(formatWait('2026-03-04T12:55:00.000Z', NOW)).toBe('2 h 05 min');
    expect(formatWait('2026-02-28T11:00:00.000Z', NOW)).toBe('4 d 4 h');
  });
});

describe(formatEfficiency.name, () => {
  it('shows a percentage, or "new" without history', () => {
    expect(formatEfficiency(1.2867)).toBe('129 %');
    expect(formatEfficiency(null)).toBe('new');
  });
});

describe(formatShopTime.name, () => {
  it('shows only the time for today in the shop zone', () => {
    expect(formatShopTime('2026-03-04T22:30:00.000Z', NOW, ZONE)).toBe('4:30 PM');
  });
  it('adds the weekday within the week and the date further out', () => {
    expect(formatShopTime('2026-03-05T14:00:00.000Z', NOW, ZONE)).toBe('Thu 8:00 AM');
    expect(formatShopTime('2026-03-16T13:00:00.000Z', NOW, ZONE)).toBe('Mar 16 8:00 AM');
  });
  it('uses the shop day, not the UTC day', () => {
    // 03:00 UTC on the 5th is still the 4th in Chicago.
    expect(formatShopTime('2026-03-05T03:00:00.000Z', NOW, ZONE)).toBe('9:00 PM');
  });
});
