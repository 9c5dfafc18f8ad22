import { and, desc, eq, sql } from 'drizzle-orm';
import type { LedgerPunch } from '@baytime/shared';
import type { Db } from '../db/database.js';
import { punches } from '../db/schema/index.js';

/**
 * Where a technician's punches must be read from to hold the shift open at an instant: their last
 * shift-out before it that counts (no correction replaced or voided it). A shift left open for days
 * began after it, however long ago that was; with none, from the technician's first punch.
 */
export function prepareLastShiftOut(db: Db): (technicianId: number, before: number) => number | null {
  const statement = db
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
  return (technicianId, before) => statement.get({ technicianId, before })?.at.getTime() ?? null;
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
