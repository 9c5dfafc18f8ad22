import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openDatabase, type Sqlite } from '../db/database.js';
import { EVERYTHING_CHANGED, WeekChanges } from './week-changes.js';

const HOUR = 3600_000;
const T = Date.UTC(2026, 2, 2, 8);

describe(WeekChanges.name, () => {
  const dir = mkdtempSync(join(tmpdir(), 'baytime-week-changes-'));
  let sqlite: Sqlite;
  let changes: WeekChanges;
  let punchSerial = 0;
  const run = (statement: string, ...params: unknown[]) =>
    sqlite.connection.prepare(statement).run(...params);
  const punch = (at: number, supersedes: string | null = null) => {
    const id = `00000000-0000-4000-8000-${String(++punchSerial).padStart(12, '0')}`;
    run(
      `INSERT INTO punches (id, technician_id, kind, at, recorded_at, recorded_by, supersedes)
       VALUES (?, 1, 'shift-in', ?, ?, 1, ?)`,
      id,
      at,
      T + 100 * HOUR,
      supersedes,
    );
    return id;
  };
  const line = (lineNo: number, completedAt: number | null) =>
    Number(
      run(
        `INSERT INTO job_lines (repair_order_id, line_no, title, book_hours, status, queued_at, completed_at, updated_at)
         VALUES (1, ?, 'Replace wiper blades', 0.5, ?, ?, ?, ?)`,
        lineNo,
        completedAt === null ? 'queued' : 'done',
        T - HOUR,
        completedAt,
        T,
      ).lastInsertRowid,
    );

  beforeAll(() => {
    sqlite = openDatabase(join(dir, 'shop.db'));
    run(`INSERT INTO users (id, name, role, created_at) VALUES (1, 'Ivy Quell', 'technician', 0)`);
    run(`INSERT INTO customers (id, name, created_at) VALUES (1, 'Wendell Farrow', 0)`);
    run(`INSERT INTO vehicles (id, customer_id, vin, year, make, model)
         VALUES (1, 1, '7CV4AL2E5PM000001', 2023, 'Corvane', 'Altrix')`);
    run(`INSERT INTO repair_orders (id, number, customer_id, vehicle_id, customer_name, vehicle_year, vehicle_make,
           vehicle_model, concern, odometer, created_at)
         VALUES (1, '4401', 1, 1, 'Wendell Farrow', 2023, 'Corvane', 'Altrix', 'Service', 1000, 0)`);
    changes = new WeekChanges(sqlite.db);
  });
  afterAll(() => {
    sqlite.connection.close();
    rmSync(dir, { recursive: true, force: true });
  });

  it('cannot tell what changed before its first look, and then sees nothing new', () => {
    expect(changes.since()).toBe(EVERYTHING_CHANGED);
    expect(changes.since()).toBeNull();
  });

  it('dates new punches by their time, and a correction by the earlier of its own and the corrected punch', () => {
    const monday = punch(T);
    punch(T + 30 * HOUR);
    expect(changes.since()).toBe(T);
    expect(changes.since()).toBeNull();
    // Moved to a later week: the week it left changed as well.
    punch(T + 200 * HOUR, monday);
    expect(changes.since()).toBe(T);
  });

  it('dates a change to a finished line by the earlier of its completions before and after', () => {
    const id = line(1, T + 5 * HOUR);
    expect(changes.since()).toBe(T + 5 * HOUR);
    run('UPDATE job_lines SET completed_at = ? WHERE id = ?', T + 50 * HOUR, id);
    expect(changes.since()).toBe(T + 5 * HOUR);
    run('UPDATE job_lines SET completed_at = ? WHERE id = ?', T + 2 * HOUR, id);
    expect(changes.since()).toBe(T + 2 * HOUR);
    run(`UPDATE job_lines SET status = 'working', sign_off = NULL WHERE id = ?`, id);
    expect(changes.since()).toBe(T + 2 * HOUR);
    run('DELETE FROM job_lines WHERE id = ?', id);
    expect(changes.since()).toBe(T + 2 * HOUR);
  });

  it('ignores changes to lines never finished', () => {
    const id = line(2, null);
    run(`UPDATE job_lines SET status = 'working', book_hours = 1.5 WHERE id = ?`, id);
    expect(changes.since()).toBeNull();
  });

  it('keeps the latest thousand changes, and starts over when it missed older ones', () => {
    const id = line(3, T);
    for (let i = 1; i <= 1000; i++) run('UPDATE job_lines SET book_hours = ? WHERE id = ?', i, id);
    expect(
      sqlite.connection.prepare('SELECT count(*) AS n FROM finished_line_changes').get() as { n: number },
    ).toEqual({ n: 1000 });
    expect(changes.since()).toBe(EVERYTHING_CHANGED);
    run('UPDATE job_lines SET book_hours = 0.5 WHERE id = ?', id);
    expect(changes.since()).toBe(T);
  });
});
