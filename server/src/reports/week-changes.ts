import { sql } from 'drizzle-orm';
import type { Db } from '../db/database.js';
import { lastPunchRow, punchesAddedAfter } from '../punches/added-punches.js';

/** Far enough back to cover every week: what changed cannot be told, so everything did. */
export const EVERYTHING_CHANGED = -Infinity;

/**
 * What changed the figures of past weeks since the last look: the punches added since, and the changes
 * to finished lines that the `job_lines` triggers leave in `finished_line_changes`.
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
      this.seen = {
        punch: lastPunchRow(this.db),
        line: this.db.get<{ line: number }>(
          sql`select coalesce(max(seq), 0) as line from finished_line_changes`,
        ).line,
      };
      return EVERYTHING_CHANGED;
    }
    // A late punch counts from its own time, a correction from the earlier of its and the corrected one's.
    const punch = { last: seen.punch, earliest: Infinity };
    for (const { row, at, correctedAt } of punchesAddedAfter(this.db, seen.punch)) {
      punch.last = Math.max(punch.last, row);
      punch.earliest = Math.min(punch.earliest, at, correctedAt ?? at);
    }
    const line = this.db.get<{ last: number | null; earliest: number | null; oldest: number | null }>(sql`
      select max(seq) as last, min(at) as earliest,
        (select min(seq) from finished_line_changes) as oldest
      from finished_line_changes where seq > ${seen.line}`);
    this.seen = { punch: punch.last, line: line.last ?? seen.line };
    if (line.oldest !== null && line.oldest > seen.line + 1) return EVERYTHING_CHANGED;
    const earliest = Math.min(punch.earliest, line.earliest ?? Infinity);
    return earliest === Infinity ? null : earliest;
  }
}
