import type { OfflinePunchDto, OfflinePunchStatus } from '@baytime/shared';

export const STATUS_WORDS: Record<OfflinePunchStatus, string> = {
  unverified: 'Identity not yet verified',
  refused: 'Refused',
  confirmed: 'Confirmed',
  rejected: 'Rejected',
};

export { punchWords } from '@baytime/shared';

/** Who tapped it: the technician, else the badge typed, else nobody known. */
export function whoWords(punch: Pick<OfflinePunchDto, 'technicianName' | 'badge'>): string {
  if (punch.technicianName) return punch.technicianName;
  return punch.badge ? `Badge ${punch.badge} (no technician)` : 'Unreadable badge';
}
