import { cpSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import Database from 'better-sqlite3';
import { drizzle } from 'drizzle-orm/better-sqlite3';
import { migrate } from 'drizzle-orm/better-sqlite3/migrator';
import { afterAll, describe, expect, it } from 'vitest';

const migrations = fileURLToPath(new URL('../../drizzle', import.meta.url));

/** The migrations folder as it was up to `tag`. */
function migrationsUpTo(tag: string, dir: string): string {
  const journal = JSON.parse(readFileSync(join(migrations, 'meta/_journal.json'), 'utf8')) as {
    entries: { tag: string }[];
  };
  const entries = journal.entries.slice(0, journal.entries.findIndex((entry) => entry.tag === tag) + 1);
  mkdirSync(join(dir, 'meta'), { recursive: true });
  writeFileSync(join(dir, 'meta/_journal.json'), JSON.stringify({ ...journal, entries }));
  for (const { tag: file } of entries) cpSync(join(migrations, `${file}.sql`), join(dir, `${file}.sql`));
  return dir;
}

describe('job-line concern and RO status migrations', () => {
  const dir = mkdtempSync(join(tmpdir(), 'baytime-migrations-'));
  afterAll(() => rmSync(dir, { recursive: true, force: true }));

  it('give each line its RO’s concern, and each RO the status its lines say (bug 3)', () => {
    const connection = new Database(join(dir, 'shop.db'));
    try {
      const db = drizzle(connection);
      migrate(db, { migrationsFolder: migrationsUpTo('0006_live_sequence', join(dir, 'before')) });
      connection.exec(`
        INSERT INTO customers (id, name, created_at) VALUES (1, 'Wendell Farrow', 0);
        INSERT INTO vehicles (id, customer_id, vin, year, make, model) VALUES (1, 1, '1M8GDM9AXKP042788', 2019, 'Halvard', 'Morrow');
        INSERT INTO repair_orders (id, number, customer_id, vehicle_id, customer_name, vehicle_year, vehicle_make, vehicle_model, concern, odometer, status, created_at, closed_at)
          VALUES (1, '4645', 1, 1, 'Wendell Farrow', 2019, 'Halvard', 'Morrow', 'Pulls left', 1, 'open', 0, NULL),
                 (2, '4646', 1, 1, 'Wendell Farrow', 2019, 'Halvard', 'Morrow', 'Noise', 1, 'done', 0, NULL),
                 (3, '4647', 1, 1, 'Wendell Farrow', 2019, 'Halvard', 'Morrow', 'Service', 1, 'closed', 0, 5);
        INSERT INTO job_lines (repair_order_id, line_no, title, book_hours, status, queued_at, updated_at)
          VALUES (1, 1, 'Alignment', 1, 'done', 0, 0), (2, 1, 'Brakes', 1, 'done', 0, 0),
                 (2, 2, 'Found later', 1, 'queued', 0, 0), (3, 1, 'Oil', 1, 'done', 0, 0);
      `);
      migrate(db, { migrationsFolder: migrations });
      expect(connection.prepare('SELECT number, status FROM repair_orders ORDER BY id').all()).toEqual([
        { number: '4645', status: 'done' },
        { number: '4646', status: 'open' },
        { number: '4647', status: 'closed' },
      ]);
      expect(
        connection.prepare('SELECT DISTINCT concern FROM job_lines WHERE repair_order_id = 2').all(),
      ).toEqual([{ concern: 'Noise' }]);
    } finally {
      connection.close();
    }
  });
});
