import type Database from 'better-sqlite3';
import { randomUUID } from 'node:crypto';
import { impliedJobOffs, type LedgerPunch, type PunchKind } from '@baytime/shared';
import { concernFromNote } from '../findings/finding-words.js';

type Upgrade = (connection: Database.Database) => void;

/** Each upgrade a migration may ask for by name (a row in `pending_upgrades`). */
const UPGRADES: Record<string, Upgrade> = {
  'record-implied-job-offs': recordImpliedJobOffs,
  'concerns-from-findings': concernsFromFindings,
};

/** Carries out the upgrades migrations asked for, each in one transaction with its row's removal. */
export function runPendingUpgrades(connection: Database.Database): void {
  const pending = connection.prepare('SELECT name FROM pending_upgrades ORDER BY name').all() as {
    name: string;
  }[];
  for (const { name } of pending) {
    const upgrade = UPGRADES[name];
    if (!upgrade) throw new Error(`A migration asked for an upgrade this build does not know: ${name}`);
    connection.transaction(() => {
      upgrade(connection);
      connection.prepare('DELETE FROM pending_upgrades WHERE name = ?').run(name);
    })();
  }
}

interface PunchRow {
  id: string;
  technician_id: number;
  kind: PunchKind;
  job_line_id: number | null;
  break_kind: LedgerPunch['breakKind'];
  at: number;
  recorded_at: number;
  recorded_by: number;
  supersedes: string | null;
  voids: number;
}

/**
 * A clock-on beyond the shop's jobs-at-once limit used to close the oldest open line when punches were
 * read, with no job-off on record, so raising the limit later re-opened finished work in the past. Under
 * the limit in force now, each such job-off is recorded as the clock-on's own (same instant, same
 * recorder): nothing counted changes, and no later limit can change it.
 */
function recordImpliedJobOffs(connection: Database.Database): void {
  const shop = connection.prepare('SELECT max_concurrent_jobs AS max FROM shop_settings').get() as
    { max: number } | undefined;
  if (!shop) return;
  const technicians = connection.prepare('SELECT DISTINCT technician_id AS id FROM punches').all() as {
    id: number;
  }[];
  const punchesOf = connection.prepare('SELECT * FROM punches WHERE technician_id = ?');
  const insert = connection.prepare(
    `INSERT INTO punches (id, technician_id, kind, job_line_id, at, recorded_at, recorded_by)
     VALUES (?, ?, 'job-off', ?, ?, ?, ?)`,
  );
  for (const { id } of technicians) {
    const rows = punchesOf.all(id) as PunchRow[];
    const byId = new Map(rows.map((row) => [row.id, row]));
    const punches: LedgerPunch[] = rows.map((row) => ({
      id: row.id,
      technicianId: row.technician_id,
      kind: row.kind,
      jobLineId: row.job_line_id,
      breakKind: row.break_kind,
      at: new Date(row.at).toISOString(),
      supersedes: row.supersedes,
      voids: row.voids === 1,
    }));
    for (const off of impliedJobOffs(punches, shop.max)) {
      const cause = byId.get(off.causedBy)!;
      insert.run(randomUUID(), id, off.jobLineId, Date.parse(off.at), cause.recorded_at, cause.recorded_by);
    }
  }
}

/** Lines added from approved findings before they carried the finding's note as their concern get it now. */
function concernsFromFindings(connection: Database.Database): void {
  const lines = connection
    .prepare(
      `SELECT job_lines.id AS id, findings.note AS note FROM findings
       JOIN job_lines ON job_lines.id = findings.created_line_id
       WHERE job_lines.concern = ''`,
    )
    .all() as { id: number; note: string }[];
  const update = connection.prepare('UPDATE job_lines SET concern = ? WHERE id = ?');
  for (const line of lines) update.run(concernFromNote(line.note), line.id);
}
