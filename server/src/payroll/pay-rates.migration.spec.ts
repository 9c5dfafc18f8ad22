import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import Database from 'better-sqlite3';
import { drizzle } from 'drizzle-orm/better-sqlite3';
import { migrate } from 'drizzle-orm/better-sqlite3/migrator';
import { afterAll, describe, expect, it } from 'vitest';
import { migrations, migrationsUpTo } from '../test-support/migrations.js';

describe('dated pay rates migration', () => {
  const dir = mkdtempSync(join(tmpdir(), 'baytime-migrations-'));
  afterAll(() => rmSync(dir, { recursive: true, force: true }));

  it('moves the shop’s pay rules and each technician’s rates into dated rows covering every week', () => {
    const connection = new Database(join(dir, 'shop.db'));
    try {
      const db = drizzle(connection);
      migrate(db, {
        migrationsFolder: migrationsUpTo('0012_integration', join(dir, 'before')),
      });
      connection.exec(`
        INSERT INTO shop_settings (id, name, time_zone, workweek_start_day, workweek_start_hour, units, max_concurrent_jobs,
          concurrent_split, minimum_wage_cents, overtime_rules, opening_hours, kiosk_idle_seconds,
          pay_non_productive_separately, updated_at)
          VALUES (1, 'Marlow Creek Auto Care', 'America/Chicago', 0, 0, 'us', 2, 'even', 1650, 'california', '[]', 60, 0, 0);
        INSERT INTO users (id, name, role, badge, flat_rate_cents, hourly_rate_cents, overtime_exempt, created_at)
          VALUES (4, 'Dana Okafor', 'technician', '2001', 3200, 1800, 1, 0),
                 (5, 'Ruben Gillow', 'advisor', NULL, 0, 0, 0, 0);
      `);
      // As the server migrates: table rebuilds need foreign keys off (see database.ts).
      connection.pragma('foreign_keys = OFF');
      migrate(db, { migrationsFolder: migrations });
      expect(
        connection
          .prepare(
            'SELECT effective_from, overtime_rules, minimum_wage_cents, local_minimum_wage_cents, pay_non_productive_separately FROM pay_rules',
          )
          .all(),
      ).toEqual([
        {
          effective_from: '2000-01-01',
          overtime_rules: 'california',
          minimum_wage_cents: 1650,
          local_minimum_wage_cents: null,
          pay_non_productive_separately: 0,
        },
      ]);
      expect(
        connection
          .prepare(
            'SELECT user_id, effective_from, pay_type, flat_rate_cents, hourly_rate_cents, guarantee_cents, overtime_exempt FROM pay_rates',
          )
          .all(),
      ).toEqual([
        {
          user_id: 4,
          effective_from: '2000-01-01',
          pay_type: 'flat-rate',
          flat_rate_cents: 3200,
          hourly_rate_cents: 1800,
          guarantee_cents: 0,
          overtime_exempt: 1,
        },
      ]);
      const columns = (table: string) =>
        (connection.pragma(`table_info(${table})`) as { name: string }[]).map((column) => column.name);
      expect(columns('users')).not.toContain('flat_rate_cents');
      expect(columns('shop_settings')).not.toContain('minimum_wage_cents');
    } finally {
      connection.close();
    }
  });
});
