import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import Database from 'better-sqlite3';
import { drizzle } from 'drizzle-orm/better-sqlite3';
import { migrate } from 'drizzle-orm/better-sqlite3/migrator';
import { afterAll, describe, expect, it } from 'vitest';
import { migrations, migrationsUpTo } from '../test-support/migrations.js';

describe('outbox channel migration', () => {
  const dir = mkdtempSync(join(tmpdir(), 'baytime-migrations-'));
  afterAll(() => rmSync(dir, { recursive: true, force: true }));

  it('keeps every queued e-mail, as e-mail, with its body', () => {
    const connection = new Database(join(dir, 'shop.db'));
    try {
      const db = drizzle(connection);
      migrate(db, { migrationsFolder: migrationsUpTo('0006_live_sequence', join(dir, 'before')) });
      connection.exec(`
        INSERT INTO mail_outbox (id, recipient, subject, text, attachments, status, attempts, next_attempt_at, created_at)
          VALUES (7, 'wendell@example.test', 'Your car is ready', 'Hello', '[]', 'queued', 2, 1000, 500);
      `);
      migrate(db, { migrationsFolder: migrations });
      expect(connection.prepare('SELECT * FROM mail_outbox').all()).toEqual([
        {
          id: 7,
          channel: 'email',
          recipient: 'wendell@example.test',
          subject: 'Your car is ready',
          text: 'Hello',
          secret_body: 0,
          attachments: '[]',
          status: 'queued',
          attempts: 2,
          next_attempt_at: 1000,
          last_error: null,
          created_at: 500,
          sent_at: null,
        },
      ]);
    } finally {
      connection.close();
    }
  });
});
