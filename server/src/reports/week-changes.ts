import { sql } from 'drizzle-orm';
import type { Db } from '../db/database.js';

/** Far enough back to cover every week: what changed cannot be told, so everything did. */
export const EVERYTHING_CHANGED = -Infinity;

/**
 * What changed the figures of past weeks since the last look. Punches are only ever added, so the rows
 * past the highest rowid seen are the new ones: a late punch counts from its own time, a correction from
 * the earlier of its time and that of the punch it corrects. Changes to finished lines come from the rows
 * the `job_lines` triggers leave in `finished_line_changes`.
 */
export class WeekChanges {
  private seen: { punch: number; line: number } | null = null;

  constructor(private readonly db: Db) {}

  /**
   * The earliest instant (ms) whose figures changed since the last call: every week ending after it may
   * differ. Null when nothing changed; `EVERYTHING_CHANGED` on the first call, or when the triggers'
   * rows the last call had not seen are gone.
   */
  since(): number | null {
    const seen = this.seen;
    if (seen === null) {
      this.seen = this.db.get<{ punch: number; line: number }>(sql`
        select (select coalesce(max(rowid), 0) from punches) as punch,
          (select coalesce(max(seq), 0) from finished_line_changes) as line`);
      return EVERYTHING_CHANGED;
    }
    const punch = this.db.get<{ last: number | null; earliest: number | null }>(sql`
      select max(punch.rowid) as last, min(min(punch.at, coalesce(corrected.at, punch.at))) as earliest
      from punches punch left join punches corrected on corrected.id = punch.supersedes
      where punch.rowid > ${seen.punch}`);
    const line = this.db.get<{ last: number | null; earliest: number | null; oldest: number | null }>(sql`
      select max(seq) as last, min(at) as earliest,
        (select min(seq) from finished_line_changes) as oldest
      from finished_line_changes where seq > ${seen.line}`);
    this.seen = { punch: punch.last ?? seen.punch, line: line.last ?? seen.line };
    if (line.oldest !== null && line.oldest > seen.line + 1) return EVERYTHING_CHANGED;
    const earliest = [punch.earliest, line.earliest].filter((at) => at !== null);
    return earliest.length ? Math.min(...earliest) : null;
  }
}
