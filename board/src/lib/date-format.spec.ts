import { describe, expect, it } from 'vitest';
import { shopDateTime } from './date-format';

describe(shopDateTime.name, () => {
  const instant = '2026-12-02T15:40:05.000Z';

  it('tells the time in the shop’s zone, whatever the browser’s', () => {
    expect(shopDateTime('America/Chicago')(instant)).toBe('Dec 2, 2026, 9:40 AM');
    expect(shopDateTime('Europe/Berlin')(instant)).toBe('Dec 2, 2026, 4:40 PM');
    expect(shopDateTime('America/Chicago', true)(instant)).toBe('Dec 2, 2026, 9:40:05 AM');
  });

  it('says a dash for no time', () => {
    expect(shopDateTime('America/Chicago')(null)).toBe('—');
  });
});
