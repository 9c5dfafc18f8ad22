import type { WallScreenDto } from './api/get-screens';

export type ScreenStatus = 'revoked' | 'paired' | 'waiting' | 'expired';

export function screenStatus(screen: WallScreenDto, now: number): ScreenStatus {
  if (screen.revokedAt) return 'revoked';
  if (screen.pairedAt) return 'paired';
  if (screen.pairingExpiresAt && Date.parse(screen.pairingExpiresAt) > now) return 'waiting';
  return 'expired';
}

export const STATUS_WORDS: Record<ScreenStatus, string> = {
  paired: 'Paired',
  waiting: 'Waiting for its code',
  expired: 'Code expired, never paired',
  revoked: 'Revoked',
};

/** Screens in use first (by name), then those waiting, then the rest; revoked last. */
export function sortScreens(screens: readonly WallScreenDto[], now: number): WallScreenDto[] {
  const rank: Record<ScreenStatus, number> = { paired: 0, waiting: 1, expired: 2, revoked: 3 };
  return [...screens].sort(
    (a, b) =>
      rank[screenStatus(a, now)] - rank[screenStatus(b, now)] || a.name.localeCompare(b.name) || a.id - b.id,
  );
}

/** "just now", "12 min ago", "3 h ago", else null (show the date). */
export function agoText(iso: string | null, now: number): string | null {
  if (!iso) return null;
  const minutes = Math.round((now - Date.parse(iso)) / 60_000);
  if (minutes < 2) return 'just now';
  if (minutes < 90) return `${minutes} min ago`;
  if (minutes < 24 * 60) return `${Math.round(minutes / 60)} h ago`;
  return null;
}
