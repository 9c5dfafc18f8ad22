import { describe, expect, it } from 'vitest';
import type { PartsHoldDto } from '@baytime/shared';
import { arrivalInputs, partsSummary } from './parts-format';

const ZONE = 'America/Chicago';
// Tue 3 Mar 2026, 09:00 CST (UTC−6).
const NOW = Date.parse('2026-03-03T15:00:00Z');
const parts = (patch: Partial<PartsHoldDto>): PartsHoldDto => ({
  part: 'Outer tie rod end',
  state: null,
  supplier: null,
  expectedAt: null,
  receivedAt: null,
  ...patch,
});

describe(partsSummary.name, () => {
  it('says what is missing before the office has ordered', () => {
    expect(partsSummary(parts({ part: null }), NOW, ZONE)).toBe('Part not named yet · Not ordered yet');
  });

  it('gives state, supplier and arrival in shop time, and late once it has passed', () => {
    const ordered = parts({
      state: 'back-ordered',
      supplier: 'Kestrel Parts',
      expectedAt: '2026-03-03T20:30:00Z',
    });
    expect(partsSummary(ordered, NOW, ZONE)).toBe(
      'Outer tie rod end · Back-ordered · Kestrel Parts · due Tue 2:30 pm',
    );
    expect(partsSummary(ordered, Date.parse('2026-03-03T20:30:00Z'), ZONE)).toBe(
      'Outer tie rod end · Back-ordered · Kestrel Parts · late since Tue 2:30 pm',
    );
    expect(partsSummary(parts({ state: 'ordered', expectedAt: '2026-03-20T14:00:00Z' }), NOW, ZONE)).toBe(
      'Outer tie rod end · Ordered · due Mar 20, 9:00 am',
    );
  });
});

describe(arrivalInputs.name, () => {
  it('splits an instant into the shop-local day and 24-hour time', () => {
    expect(arrivalInputs('2026-03-03T20:30:00Z', ZONE)).toEqual({ day: '2026-03-03', time: '14:30' });
    // Past midnight UTC, still the evening before in Chicago.
    expect(arrivalInputs('2026-03-04T02:05:00Z', ZONE)).toEqual({ day: '2026-03-03', time: '20:05' });
    expect(arrivalInputs(null, ZONE)).toEqual({ day: '', time: '' });
  });
});
