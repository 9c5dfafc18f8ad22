import { and, desc, eq, sql, type SQL } from 'drizzle-orm';
import type { LedgerPunch } from '@baytime/shared';
import type { Db } from '../db/database.js';
import { punches } from '../db/schema/index.js';

/** SQL: no correction replaced the punch row `alias` (a table alias, or `punches`). */
export function notReplaced(alias: string): SQL {
  return sql.raw(`not exists (select 1 from punches correction where correction.supersedes = ${alias}.id)`);
}

/** SQL: the punch row `alias` counts: it is not a void, and no correction replaced it. */
export function counts(alias: string): SQL {
  return sql`not ${sql.raw(alias)}.voids and ${notReplaced(alias)}`;
}

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
        counts('punches'),
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
