import type { KioskQueueNote } from '@baytime/shared';
import { formatTimeOfDay } from './board-time';

/**
 * The top bar's note on punches a kiosk holds and has not sent yet: "3 punches waiting since 7:02 am ·
 * Front kiosk", or summed over kiosks; null when nothing waits. Count and time first: a long kiosk
 * name is what gets cut.
 */
export function kioskQueueText(
  notes: readonly KioskQueueNote[],
  timeZone: string | undefined,
): string | null {
  const waiting = notes.filter((note) => note.waiting > 0);
  if (waiting.length === 0) return null;
  const total = waiting.reduce((sum, note) => sum + note.waiting, 0);
  const where = waiting.length === 1 ? waiting[0]!.name : `${waiting.length} kiosks`;
  const oldest = Math.min(...waiting.map((note) => (note.since ? Date.parse(note.since) : Infinity)));
  const since = Number.isFinite(oldest) ? ` since ${formatTimeOfDay(oldest, timeZone)}` : '';
  return `${total} ${total === 1 ? 'punch' : 'punches'} waiting${since} · ${where}`;
}
