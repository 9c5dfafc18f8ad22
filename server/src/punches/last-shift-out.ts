import { and, desc, eq, sql } from 'drizzle-orm';
import type { LedgerPunch } from '@baytime/shared';
import type { Db } from '../db/database.js';
import { punches } from '../db/schema/index.js';

/**
 * Where to read a technician's punches from so that they hold the shift open at `instant`, and reach at
 * least `atLeastMs` before it: their last counting shift-out before it (no correction replaced or voided
 * it), or `instant - atLeastMs` when that is earlier. A shift left open for days began after that
 * shift-out, however long ago it was; with none, the read starts at the technician's first punch.
 */
export function prepareReadFrom(
  db: Db,
): (technicianId: number, instant: number, atLeastMs?: number) => number {
  const lastShiftOut = db
    .select({ at: punches.at })
    .from(punches)
    .where(
      and(
        eq(punches.technicianId, sql.placeholder('technicianId')),
        eq(punches.kind, 'shift-out'),
        sql`${punches.at} < ${sql.placeholder('before')}`,
        eq(punches.voids, false),
        sql`not exists (select 1 from ${punches} correction where correction.supersedes = ${punches.id})`,
      ),
    )
    .orderBy(desc(punches.at))
    .limit(1)
    .prepare();
  return (technicianId, instant, atLeastMs = 0) =>
    Math.min(instant - atLeastMs, lastShiftOut.get({ technicianId, before: instant })?.at.getTime() ?? 0);
}

/** The same among punches in memory, in time order: the last counting shift-out before `instant`. */
export function lastShiftOutIn(list: readonly LedgerPunch[], instant: number): number | null {
  const replaced = new Set(list.flatMap((punch) => (punch.supersedes === null ? [] : [punch.supersedes])));
  for (let i = list.length - 1; i >= 0; i--) {
    const punch = list[i]!;
    const at = Date.parse(punch.at);
    if (punch.kind === 'shift-out' && !punch.voids && at < instant && !replaced.has(punch.id)) return at;
  }
  return null;
}
