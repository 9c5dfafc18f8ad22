import { randomUUID } from 'node:crypto';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import Database from 'better-sqlite3';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestApp, type TestApp } from '../test-support/test-app.js';
import { concernFromNote } from '../findings/finding-words.js';
import { openDatabase, SQLITE, type Sqlite } from './database.js';

describe('upgrades a migration asks for', () => {
  let sut: TestApp;
  let dir: string;
  let served: Database.Database;
  /** A copy of the served database, whole (its WAL included). */
  const copy = (name: string) => {
    const file = join(dir, name);
    served.prepare('VACUUM INTO ?').run(file);
    return file;
  };
  beforeAll(async () => {
    sut = await startTestApp();
    served = sut.app.get<Sqlite>(SQLITE).connection;
    dir = mkdtempSync(join(tmpdir(), 'baytime-upgrade-'));
  });
  afterAll(async () => {
    await sut.close();
    rmSync(dir, { recursive: true, force: true });
  });

  /** A copy of the demo shop with one technician's bare switch from line `first` to `second`, as punched before. */
  function withBareSwitch(first: number, second: number, technicianId: number): string {
    const file = copy('switch.sqlite');
    const old = new Database(file);
    const day = Date.UTC(2026, 2, 10);
    const insert = old.prepare(
      `INSERT INTO punches (id, technician_id, kind, job_line_id, at, recorded_at, recorded_by)
       VALUES (?, ?, ?, ?, ?, ?, ?)`,
    );
    const punches = [
      ['shift-in', null, 8],
      ['job-on', first, 9],
      ['job-on', second, 10],
      ['job-off', second, 11],
      ['shift-out', null, 12],
    ] as const;
    for (const [kind, line, hour] of punches)
      insert.run(randomUUID(), technicianId, kind, line, day + hour * 3600_000, day, technicianId);
    old.prepare("INSERT INTO pending_upgrades (name) VALUES ('record-implied-job-offs')").run();
    old.close();
    return file;
  }

  it('records the job-off each bare switch implied, once, as the switch itself', () => {
    const [first, second] = (
      served.prepare('SELECT id FROM job_lines ORDER BY id LIMIT 2').all() as { id: number }[]
    ).map((row) => row.id);
    const technician = (
      served.prepare("SELECT id FROM users WHERE role = 'technician' ORDER BY id LIMIT 1").get() as {
        id: number;
      }
    ).id;
    const file = withBareSwitch(first!, second!, technician);

    const upgraded = openDatabase(file).connection;
    const offs = upgraded
      .prepare(
        `SELECT job_line_id AS line, at, recorded_by AS recordedBy FROM punches
         WHERE technician_id = ? AND kind = 'job-off' AND at < ? ORDER BY at`,
      )
      .all(technician, Date.UTC(2026, 2, 11));
    const day = Date.UTC(2026, 2, 10);
    expect(offs).toEqual([
      { line: first, at: day + 10 * 3600_000, recordedBy: technician },
      { line: second, at: day + 11 * 3600_000, recordedBy: technician },
    ]);
    expect(upgraded.prepare('SELECT count(*) AS n FROM pending_upgrades').get()).toEqual({ n: 0 });
    upgraded.close();

    // Opened again, nothing more is added.
    const again = openDatabase(file).connection;
    expect(
      again
        .prepare("SELECT count(*) AS n FROM punches WHERE kind = 'job-off' AND at < ?")
        .get(day + 86_400_000),
    ).toEqual({ n: 2 });
    again.close();
  });

  it("gives a line an approved finding added the finding's note as its concern, when it has none", () => {
    const file = copy('concerns.sqlite');
    const old = new Database(file);
    const [added, kept, found] = (
      old.prepare('SELECT id FROM job_lines ORDER BY id LIMIT 3').all() as { id: number }[]
    ).map((row) => row.id);
    const technician = old.prepare("SELECT id FROM users WHERE role = 'technician' LIMIT 1").pluck().get();
    const note = `Brake hose cracked near the caliper. ${'Seeps under pressure. '.repeat(60)}`;
    const finding = old.prepare(
      `INSERT INTO findings (job_line_id, technician_id, note, severity, answer, created_line_id, created_at)
       VALUES (?, ?, ?, 'soon', 'approved', ?, ?)`,
    );
    finding.run(found, technician, note, added, Date.now());
    finding.run(found, technician, 'Wiper blades torn', kept, Date.now());
    old.prepare("UPDATE job_lines SET concern = '' WHERE id = ?").run(added);
    old.prepare("UPDATE job_lines SET concern = 'Squeal when braking' WHERE id = ?").run(kept);
    old.prepare("INSERT INTO pending_upgrades (name) VALUES ('concerns-from-findings')").run();
    old.close();

    const upgraded = openDatabase(file).connection;
    const concernOf = upgraded.prepare('SELECT concern FROM job_lines WHERE id = ?').pluck();
    expect(concernOf.get(added)).toBe(concernFromNote(note));
    expect(concernOf.get(added)).toMatch(/^Brake hose cracked near the caliper\. Seeps.*…$/);
    expect(concernOf.get(kept)).toBe('Squeal when braking');
    upgraded.close();
  });

  it('stops the start on an upgrade this build does not know', () => {
    const file = copy('unknown.sqlite');
    const old = new Database(file);
    old.prepare("INSERT INTO pending_upgrades (name) VALUES ('from-a-later-build')").run();
    old.close();
    expect(() => openDatabase(file)).toThrow(/does not know: from-a-later-build/);
  });
});
