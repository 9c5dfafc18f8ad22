import Database from 'better-sqlite3';
import { drizzle, type BetterSQLite3Database } from 'drizzle-orm/better-sqlite3';
import { migrate } from 'drizzle-orm/better-sqlite3/migrator';
import { count } from 'drizzle-orm';
import type { AnySQLiteTable } from 'drizzle-orm/sqlite-core';
import { fileURLToPath } from 'node:url';
import * as schema from './schema/index.js';
import { runPendingUpgrades } from './upgrades.js';

export type Db = BetterSQLite3Database<typeof schema>;
export interface Sqlite {
  connection: Database.Database;
  db: Db;
}
export const DB = Symbol('DB');
export const SQLITE = Symbol('SQLITE');

const migrationsFolder = fileURLToPath(new URL('../../drizzle', import.meta.url));

/**
 * One writer connection, migrated before anything else runs (a failed migration stops start-up).
 * WAL with synchronous=NORMAL: a commit reaches the kernel at once (a kill -9 loses nothing), and
 * `WalSync` fsyncs the WAL off the event loop before a write is answered (nor does a power cut).
 */
export function openDatabase(file: string): Sqlite {
  const connection = new Database(file);
  connection.pragma('journal_mode = WAL');
  connection.pragma('synchronous = NORMAL');
  connection.pragma('busy_timeout = 5000');
  const db = drizzle(connection, { schema });
  migrateWithTableRebuilds(connection, db);
  connection.pragma('foreign_keys = ON');
  return { connection, db };
}

/**
 * SQLite adds a foreign key or a CHECK to a table only by rebuilding it (copy, drop, rename), and a
 * parent table cannot be dropped while foreign keys are enforced; the pragma is a no-op inside the
 * migrator's transaction. So migrations run with foreign keys off, as SQLite's ALTER TABLE page
 * describes for such changes, and start-up stops if any row then breaks a foreign key.
 */
function migrateWithTableRebuilds(connection: Database.Database, db: Db): void {
  connection.pragma('foreign_keys = OFF');
  const appliedBefore = appliedMigrations(connection);
  migrate(db, { migrationsFolder });
  runPendingUpgrades(connection);
  // Only a migration can have broken a key: the check reads every key of every row (most of a second
  // on years of punches), so a start with nothing to migrate goes without it.
  if (appliedMigrations(connection) === appliedBefore) return;
  const broken = connection.pragma('foreign_key_check') as { table: string; rowid: number; parent: string }[];
  if (broken.length)
    throw new Error(
      `A migration left rows that break foreign keys: ${broken
        .slice(0, 5)
        .map((row) => `${row.table} row ${row.rowid} → ${row.parent}`)
        .join(', ')}`,
    );
}

/** Migrations recorded as applied; none before the first start. */
function appliedMigrations(connection: Database.Database): number {
  const recorded = connection
    .prepare("SELECT 1 FROM sqlite_master WHERE type = 'table' AND name = '__drizzle_migrations'")
    .get();
  return recorded
    ? (connection.prepare('SELECT count(*) AS n FROM __drizzle_migrations').get() as { n: number }).n
    : 0;
}

export function countRows(db: Db, table: AnySQLiteTable): number {
  return db.select({ rows: count() }).from(table).get()?.rows ?? 0;
}
