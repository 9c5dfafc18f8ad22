import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import Database from 'better-sqlite3';
import { drizzle } from 'drizzle-orm/better-sqlite3';
import { migrate } from 'drizzle-orm/better-sqlite3/migrator';
import { afterAll, describe, expect, it } from 'vitest';
import { migrations, migrationsUpTo } from '../test-support/migrations.js';

describe('set time migration', () => {
  const dir = mkdtempSync(join(tmpdir(), 'baytime-migrations-'));
  afterAll(() => rmSync(dir, { recursive: true, force: true }));

  it('turns a stored fixed-wait timer into a set time and gives the shop a 12-hour clock', () => {
    const connection = new Database(join(dir, 'shop.db'));
    try {
      const db = drizzle(connection);
      migrate(db, {
        migrationsFolder: migrationsUpTo('0017_repair_orders_search_triggers', join(dir, 'before')),
      });
      // As the server migrates: table rebuilds need foreign keys off (see database.ts).
      connection.pragma('foreign_keys = OFF');
      connection.exec(`
        INSERT INTO shop_settings (id, name, time_zone, workweek_start_day, workweek_start_hour, units, max_concurrent_jobs,
          concurrent_split, opening_hours, kiosk_idle_seconds, updated_at)
          VALUES (1, 'Marlow Creek Auto Care', 'America/Chicago', 0, 0, 'us', 2, 'even', '[]', 60, 0);
        INSERT INTO timers (id, job_line_id, kind, duration_seconds, label, started_at, started_by)
          VALUES (7, 3, 'hold', 1800, 'Sealant cure', 0, 4);
        INSERT INTO timers (id, job_line_id, kind, target_c, started_at, started_by)
          VALUES (8, 3, 'warm-up', 80, 0, 4);
        INSERT INTO timer_readings (timer_id, temp_c, at, recorded_by) VALUES (8, 20, 0, 4);
      `);
      migrate(db, { migrationsFolder: migrations });
      expect(
        connection.prepare('SELECT id, kind, duration_seconds, label FROM timers ORDER BY id').all(),
      ).toEqual([
        { id: 7, kind: 'set-time', duration_seconds: 1800, label: 'Sealant cure' },
        { id: 8, kind: 'warm-up', duration_seconds: null, label: null },
      ]);
      expect(connection.prepare('SELECT timer_id FROM timer_readings').all()).toEqual([{ timer_id: 8 }]);
      expect(connection.prepare('SELECT clock_format FROM shop_settings').all()).toEqual([
        { clock_format: '12h' },
      ]);
      expect(
        connection
          .prepare("SELECT name FROM sqlite_master WHERE type = 'index' AND tbl_name = 'timers'")
          .all(),
      ).toContainEqual({ name: 'timers_bay_id_ended_at_idx' });
      expect(() =>
        connection
          .prepare("INSERT INTO timers (job_line_id, kind, started_at, started_by) VALUES (3, 'hold', 0, 4)")
          .run(),
      ).toThrow(/CHECK constraint failed/);
    } finally {
      connection.close();
    }
  });
});
