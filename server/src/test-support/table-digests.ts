import { createHash } from 'node:crypto';
import type { INestApplication } from '@nestjs/common';
import { SQLITE, type Sqlite } from '../db/database.js';

/**
 * A digest of each table's content: "nothing changed" means every digest stayed the same. Search
 * indexes (virtual tables and their shadow tables) are derived from the tables and left out.
 */
export function tableDigests(app: INestApplication): Record<string, string> {
  const { connection } = app.get<Sqlite>(SQLITE);
  const tables = connection
    .prepare(
      "select name from pragma_table_list where schema = 'main' and type = 'table' and name not like 'sqlite_%' and name not like '__drizzle%' order by name",
    )
    .all() as { name: string }[];
  return Object.fromEntries(
    tables.map(({ name }) => {
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
