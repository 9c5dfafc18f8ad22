import Database from 'better-sqlite3';
import { drizzle } from 'drizzle-orm/better-sqlite3';
import { migrate } from 'drizzle-orm/better-sqlite3/migrator';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { migrationsUpTo } from '../test-support/migrations.js';
import { startTestApp, type TestApp } from '../test-support/test-app.js';
import { openDatabase, SQLITE, type Sqlite } from './database.js';

/** Every column that holds one of a fixed set of words, with the CHECK that guards it. */
const ENUM_COLUMNS: [table: string, column: string][] = [
  ['users', 'role'],
  ['screens', 'kind'],
  ['bays', 'kind'],
  ['bays', 'phase'],
  ['repair_orders', 'status'],
  ['job_lines', 'status'],
  ['job_lines', 'hold_reason'],
  ['job_lines', 'priority'],
  ['punches', 'kind'],
  ['punches', 'break_kind'],
  ['offline_punches', 'kind'],
  ['offline_punches', 'break_kind'],
  ['offline_punches', 'status'],
  ['parts_holds', 'state'],
  ['timers', 'kind'],
  ['findings', 'severity'],
  ['findings', 'answer'],
  ['findings', 'answer_channel'],
  ['approval_link_findings', 'severity'],
  ['mail_outbox', 'channel'],
  ['mail_outbox', 'status'],
  ['shop_settings', 'units'],
  ['shop_settings', 'concurrent_split'],
  ['webhook_deliveries', 'event'],
  ['webhook_deliveries', 'status'],
];

describe('database constraints, tried directly in SQL', () => {
  let sut: TestApp;
  let sql: Database.Database;
  const one = <T>(query: string) => sql.prepare(query).get() as T;

  beforeAll(async () => {
    sut = await startTestApp();
    sql = sut.app.get<Sqlite>(SQLITE).connection;
    const owner = one<{ id: number }>("SELECT id FROM users WHERE role = 'owner'").id;
    sql.exec(`
      INSERT INTO mail_outbox (recipient, subject, text, next_attempt_at, created_at) VALUES ('a@example.test', 'S', 'T', 0, 0);
      INSERT INTO webhooks (url, events, secret, created_by, created_at) VALUES ('https://hooks.example.test/', '[]', 's', ${owner}, 0);
      INSERT INTO findings (job_line_id, technician_id, note, severity, created_at)
        VALUES ((SELECT min(id) FROM job_lines), (SELECT min(id) FROM users WHERE role = 'technician'), 'Worn belt', 'soon', 0);
      INSERT INTO webhook_deliveries (webhook_id, event, body, created_at) VALUES (last_insert_rowid(), 'job-line.finished', '{}', 0);
      INSERT INTO approval_links (token_hash, repair_order_id, sent_by, sent_to, created_at, expires_at)
        VALUES ('h', (SELECT min(id) FROM repair_orders), ${owner}, '[]', 0, 1);
      INSERT INTO approval_link_findings (link_id, finding_id, wording, severity, book_hours, labour_rate_cents)
        VALUES (last_insert_rowid(), (SELECT max(id) FROM findings), 'Worn belt', 'soon', 0.5, 12000);
      INSERT INTO parts_holds (job_line_id, part, state, created_at, updated_at)
        VALUES ((SELECT min(id) FROM job_lines), 'Belt', 'ordered', 0, 0);
      INSERT INTO offline_punches (id, kiosk_id, badge, kind, break_kind, at, status, received_at)
        VALUES ('o1', (SELECT min(id) FROM screens), '1041', 'break-start', 'meal', 0, 'unverified', 0);
    `);
  });
  afterAll(() => sut.close());

  it.each(ENUM_COLUMNS)('%s.%s refuses a word outside its set', (table, column) => {
    const rowid = one<{ rowid: number } | undefined>(`SELECT min(rowid) AS rowid FROM ${table}`)?.rowid;
    expect(rowid, `a ${table} row to try`).toBeGreaterThan(0);
    expect(() => sql.prepare(`UPDATE ${table} SET ${column} = 'bogus' WHERE rowid = ?`).run(rowid)).toThrow(
      `CHECK constraint failed: ${table}_${column}_check`,
    );
  });

  it('bays.repair_order_id names a repair order', () => {
    expect(() =>
      sql.exec('UPDATE bays SET repair_order_id = 987654 WHERE rowid = (SELECT min(rowid) FROM bays)'),
    ).toThrow('FOREIGN KEY constraint failed');
  });

  it('a bay name is used once', () => {
    const { name } = one<{ name: string }>('SELECT name FROM bays LIMIT 1');
    expect(() =>
      sql.prepare('INSERT INTO bays (name, phase_since, active) VALUES (?, 0, 0)').run(name),
    ).toThrow('UNIQUE constraint failed: bays.name');
  });

  it('punches.supersedes names a punch, is indexed, and supersedes a punch once', () => {
    const punch = one<{ id: string; technician_id: number }>('SELECT id, technician_id FROM punches LIMIT 1');
    const correction = (id: string, supersedes: string) =>
      sql
        .prepare(
          `INSERT INTO punches (id, technician_id, kind, at, recorded_at, recorded_by, supersedes, reason)
           VALUES (?, ?, 'shift-in', 0, 0, ?, ?, 'test')`,
        )
        .run(id, punch.technician_id, punch.technician_id, supersedes);
    expect(() => correction('c0000000-0000-4000-8000-000000000001', 'no-such-punch')).toThrow(
      'FOREIGN KEY constraint failed',
    );
    correction('c0000000-0000-4000-8000-000000000002', punch.id);
    expect(() => correction('c0000000-0000-4000-8000-000000000003', punch.id)).toThrow(
      'UNIQUE constraint failed: punches.supersedes',
    );
    const plan = sql.prepare('EXPLAIN QUERY PLAN SELECT id FROM punches WHERE supersedes = ?').all('x') as {
      detail: string;
    }[];
    expect(plan.map((step) => step.detail).join(' ')).toContain('punches_supersedes_idx');
  });
});

describe('the constraints migration on a database that has rows', () => {
  const dir = mkdtempSync(join(tmpdir(), 'baytime-constraints-'));
  afterAll(() => rmSync(dir, { recursive: true, force: true }));

  it('keeps every row, the foreign keys and the RO search', () => {
    const file = join(dir, 'shop.db');
    const before = new Database(file);
    migrate(drizzle(before), { migrationsFolder: migrationsUpTo('0012_integration', join(dir, 'before')) });
    before.exec(`
      INSERT INTO users (id, name, role, created_at) VALUES (1, 'Rosa', 'owner', 0), (2, 'Dana', 'technician', 0);
      INSERT INTO customers (id, name, phone, created_at) VALUES (1, 'Wendell Farrow', '555-0142', 0);
      INSERT INTO vehicles (id, customer_id, vin, year, make, model) VALUES (1, 1, '1M8GDM9AXKP042788', 2019, 'Halvard', 'Morrow');
      INSERT INTO repair_orders (id, number, customer_id, vehicle_id, customer_name, customer_phone, vehicle_year, vehicle_make, vehicle_model, concern, odometer, created_at)
        VALUES (1, '4401', 1, 1, 'Wendell Farrow', '555-0142', 2019, 'Halvard', 'Morrow', 'Service', 61200, 0);
      INSERT INTO bays (id, name, phase, phase_since, repair_order_id) VALUES (1, 'Bay 1', 'staged', 0, 1);
      INSERT INTO job_lines (id, repair_order_id, line_no, title, book_hours, bay_id, queued_at, updated_at, concern, cause)
        VALUES (1, 1, 1, 'Oil service', 0.8, 1, 0, 0, 'Service due', 'Oil dark');
      INSERT INTO punches (id, technician_id, kind, job_line_id, at, recorded_at, recorded_by) VALUES ('p1', 2, 'job-on', 1, 0, 0, 2);
      INSERT INTO punches (id, technician_id, kind, job_line_id, at, recorded_at, recorded_by, supersedes, reason) VALUES ('p2', 2, 'job-on', 1, 60, 0, 1, 'p1', 'late');
      INSERT INTO findings (id, job_line_id, technician_id, note, severity, created_at) VALUES (1, 1, 2, 'Worn belt', 'soon', 0);
      INSERT INTO timers (id, job_line_id, bay_id, kind, started_at, started_by) VALUES (1, 1, 1, 'warm-up', 0, 2);
      INSERT INTO approval_links (id, token_hash, repair_order_id, sent_by, sent_to, created_at, expires_at) VALUES (1, 'h', 1, 1, '[]', 0, 1);
      INSERT INTO approval_link_findings (link_id, finding_id, wording, severity, book_hours, labour_rate_cents) VALUES (1, 1, 'Worn belt', 'soon', 0.5, 12000);
      INSERT INTO mail_outbox (channel, recipient, text, next_attempt_at, created_at) VALUES ('text', '+16085550142', 'Ready', 0, 0);
      INSERT INTO screens (id, kind, name, created_at) VALUES (1, 'kiosk', 'Tablet by the door', 0);
      INSERT INTO offline_punches (id, kiosk_id, badge, kind, at, status, received_at) VALUES ('o1', 1, '1041', 'shift-in', 0, 'unverified', 0);
      INSERT INTO parts_holds (job_line_id, part, state, created_at, updated_at) VALUES (1, 'Belt', 'ordered', 0, 0);
    `);
    const counts = (db: Database.Database) =>
      [
        'users',
        'repair_orders',
        'bays',
        'job_lines',
        'punches',
        'findings',
        'timers',
        'approval_links',
        'approval_link_findings',
        'mail_outbox',
        'screens',
        'offline_punches',
        'parts_holds',
      ].map((table) => (db.prepare(`SELECT count(*) AS n FROM ${table}`).get() as { n: number }).n);
    const rowsBefore = counts(before);
    before.close();

    const after = openDatabase(file).connection;
    try {
      expect(counts(after)).toEqual(rowsBefore);
      expect(after.prepare('SELECT repair_order_id FROM bays WHERE id = 1').get()).toEqual({
        repair_order_id: 1,
      });
      expect(after.prepare("SELECT supersedes FROM punches WHERE id = 'p2'").get()).toEqual({
        supersedes: 'p1',
      });
      expect(after.prepare('SELECT concern, cause FROM job_lines WHERE id = 1').get()).toEqual({
        concern: 'Service due',
        cause: 'Oil dark',
      });
      expect(after.pragma('foreign_keys', { simple: true })).toBe(1);
      expect(() => after.exec('DELETE FROM repair_orders WHERE id = 1')).toThrow(
        'FOREIGN KEY constraint failed',
      );
      after.exec("UPDATE repair_orders SET customer_phone = '555-0199' WHERE id = 1");
      const found = (q: string) =>
        after.prepare('SELECT rowid FROM repair_orders_search WHERE repair_orders_search MATCH ?').all(q);
      expect(found('"5550199"')).toEqual([{ rowid: 1 }]);
      expect(found('"5550142"')).toEqual([]);
    } finally {
      after.close();
    }
  });
});

describe('start-up after a migration', () => {
  const dir = mkdtempSync(join(tmpdir(), 'baytime-broken-keys-'));
  afterAll(() => rmSync(dir, { recursive: true, force: true }));

  it('stops when a row breaks a foreign key', () => {
    const file = join(dir, 'shop.db');
    const before = new Database(file);
    migrate(drizzle(before), {
      migrationsFolder: migrationsUpTo('0016_constraints', join(dir, 'before')),
    });
    before.pragma('foreign_keys = OFF');
    before.exec(
      "INSERT INTO punches (id, technician_id, kind, at, recorded_at, recorded_by) VALUES ('p1', 99, 'shift-in', 0, 0, 99)",
    );
    before.close();
    expect(() => openDatabase(file)).toThrow('A migration left rows that break foreign keys: punches row');
  });
});
