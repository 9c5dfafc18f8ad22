import { createHash } from 'node:crypto';
import type { INestApplication } from '@nestjs/common';
import type Database from 'better-sqlite3';
import { SQLITE, type Sqlite } from '../db/database.js';

/**
 * A digest of each table's content: "nothing changed" means every digest stayed the same. Search
 * indexes (virtual tables and their shadow tables) are derived from the tables and left out, and so
 * are the tables named in `except`.
 */
export function tableDigests(app: INestApplication, except: readonly string[] = []): Record<string, string> {
  return digestsOf(app.get<Sqlite>(SQLITE).connection, except);
}

/** The same digests, read through any connection to the database (one holding an older snapshot, say). */
export function digestsOf(
  connection: Database.Database,
  except: readonly string[] = [],
): Record<string, string> {
  const tables = connection
    .prepare(
      "select name from pragma_table_list where schema = 'main' and type = 'table' and name not like 'sqlite_%' and name not like '__drizzle%' order by name",
    )
    .all() as { name: string }[];
  return Object.fromEntries(
    tables
      .filter(({ name }) => !except.includes(name))
      .map(({ name }) => {
        const rows = connection
          .prepare(`select * from "${name}"`)
          .raw()
          .all()
          .map((row) => JSON.stringify(row))
          .sort();
        return [name, createHash('sha256').update(JSON.stringify(rows)).digest('hex')];
      }),
  );
}

/**
 * Rows the server's connection inserted, updated or deleted since it opened (SQLite's
 * `total_changes()`), rolled-back writes included. The server has this one connection, so while the
 * count stands still no table can have changed: the digests need computing only when it moves.
 */
export function rowsWritten(app: INestApplication): number {
  const { connection } = app.get<Sqlite>(SQLITE);
  return (connection.prepare('select total_changes() as n').get() as { n: number }).n;
}
