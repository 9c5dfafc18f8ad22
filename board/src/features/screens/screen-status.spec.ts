import { describe, expect, it } from 'vitest';
import type { WallScreenDto } from './api/get-screens';
import { agoText, screenStatus, sortScreens } from './screen-status';

const now = Date.parse('2026-12-01T22:00:00Z');
const screen = (id: number, name: string, extra: Partial<WallScreenDto> = {}): WallScreenDto => ({
  id,
  name,
  pairedAt: null,
  lastSeenAt: null,
  revokedAt: null,
  pairingExpiresAt: null,
  ...extra,
});

describe('wall screen status', () => {
  it('tells revoked, paired, waiting and expired apart', () => {
    expect(
      screenStatus(
        screen(1, 'A', { pairedAt: '2026-11-01T00:00:00Z', revokedAt: '2026-12-01T00:00:00Z' }),
        now,
      ),
    ).toBe('revoked');
    expect(screenStatus(screen(1, 'A', { pairedAt: '2026-11-01T00:00:00Z' }), now)).toBe('paired');
    expect(screenStatus(screen(1, 'A', { pairingExpiresAt: '2026-12-01T22:10:00Z' }), now)).toBe('waiting');
    expect(screenStatus(screen(1, 'A', { pairingExpiresAt: '2026-12-01T21:50:00Z' }), now)).toBe('expired');
  });

  it('lists screens in use first and revoked ones last', () => {
    const sorted = sortScreens(
      [
        screen(1, 'Old TV', { revokedAt: '2026-11-01T00:00:00Z' }),
        screen(2, 'Spare', { pairingExpiresAt: '2026-12-01T22:10:00Z' }),
        screen(3, 'North wall', { pairedAt: '2026-11-01T00:00:00Z' }),
        screen(4, 'Office', { pairedAt: '2026-11-01T00:00:00Z' }),
      ],
      now,
    );
    expect(sorted.map((s) => s.id)).toEqual([3, 4, 2, 1]);
  });

  it('says how long ago a screen was seen', () => {
    expect(agoText('2026-12-01T21:59:30Z', now)).toBe('just now');
    expect(agoText('2026-12-01T21:48:00Z', now)).toBe('12 min ago');
    expect(agoText('2026-12-01T19:00:00Z', now)).toBe('3 h ago');
    expect(agoText('2026-11-20T19:00:00Z', now)).toBeNull();
    expect(agoText(null, now)).toBeNull();
  });
});
