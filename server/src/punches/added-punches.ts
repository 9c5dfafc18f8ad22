import { sql } from 'drizzle-orm';
import type { Db } from '../db/database.js';

/** A punch row and the punch it corrects, if any (instants in ms). */
export interface AddedPunch {
  row: number;
  technicianId: number;
  at: number;
  jobLineId: number | null;
  correctedTechnicianId: number | null;
  correctedAt: number | null;
  correctedLineId: number | null;
}

/** The highest punch rowid so far. Punches are only ever added: the rows past it will be the new ones. */
export function lastPunchRow(db: Db): number {
  return db.get<{ row: number }>(sql`select coalesce(max(rowid), 0) as row from punches`).row;
}

/**
 * The punch rows added past rowid `row`, with what each corrects; and, when `timedAfter` is given, the
 * rows timed after it whenever they came (a tablet's clock a little ahead).
 */
export function punchesAddedAfter(db: Db, row: number, timedAfter: number | null = null): AddedPunch[] {
  return db.all<AddedPunch>(sql`
    select punch.rowid as row, punch.technician_id as technicianId, punch.at as at,
      punch.job_line_id as jobLineId, corrected.technician_id as correctedTechnicianId,
      corrected.at as correctedAt, corrected.job_line_id as correctedLineId
    from punches punch left join punches corrected on corrected.id = punch.supersedes
    where punch.rowid > ${row} or punch.at > ${timedAfter ?? Number.MAX_SAFE_INTEGER}`);
}
