import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import Database from 'better-sqlite3';
import { drizzle } from 'drizzle-orm/better-sqlite3';
import { migrate } from 'drizzle-orm/better-sqlite3/migrator';
import { afterAll, describe, expect, it } from 'vitest';
import { migrations, migrationsUpTo } from '../test-support/migrations.js';

describe('cancelled webhook deliveries migration', () => {
  const dir = mkdtempSync(join(tmpdir(), 'baytime-migrations-'));
  afterAll(() => rmSync(dir, { recursive: true, force: true }));

  it('cancels what was still waiting for an endpoint stopped before, and keeps every attempt', () => {
    const connection = new Database(join(dir, 'shop.db'));
    try {
      const db = drizzle(connection);
      migrate(db, {
        migrationsFolder: migrationsUpTo('0022_finished_line_changes_triggers', join(dir, 'before')),
      });
      connection.exec(`
        INSERT INTO webhooks (id, url, events, secret, created_at, revoked_at)
          VALUES (1, 'https://old.example.test/hooks', '["job-line.finished"]', 'whsec_old', 0, 5000),
                 (2, 'https://dms.example.test/hooks', '["job-line.finished"]', 'whsec_dms', 0, NULL);
        INSERT INTO webhook_deliveries (id, webhook_id, event, body, status, attempts, next_attempt_at, created_at, delivered_at)
          VALUES (10, 1, 'job-line.finished', '{}', 'pending', 3, 9000, 1000, NULL),
                 (11, 1, 'job-line.finished', '{}', 'delivered', 1, NULL, 1000, 1200),
                 (12, 2, 'job-line.finished', '{}', 'pending', 1, 9000, 1000, NULL);
        INSERT INTO webhook_attempts (delivery_id, at, status, error, duration_ms)
          VALUES (10, 1100, 503, 'The receiver answered 503', 40);
      `);
      // As the server migrates: table rebuilds need foreign keys off (see database.ts).
      connection.pragma('foreign_keys = OFF');
      migrate(db, { migrationsFolder: migrations });
      expect(
        connection.prepare('SELECT id, status, next_attempt_at FROM webhook_deliveries ORDER BY id').all(),
      ).toEqual([
        { id: 10, status: 'cancelled', next_attempt_at: null },
        { id: 11, status: 'delivered', next_attempt_at: null },
        { id: 12, status: 'pending', next_attempt_at: 9000 },
      ]);
      expect(connection.prepare('SELECT delivery_id, status FROM webhook_attempts').all()).toEqual([
        { delivery_id: 10, status: 503 },
      ]);
      expect(connection.pragma('foreign_key_check')).toEqual([]);
    } finally {
      connection.close();
    }
  });
});
