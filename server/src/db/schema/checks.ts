import { getTableName, sql } from 'drizzle-orm';
import { check, type SQLiteColumn } from 'drizzle-orm/sqlite-core';

/**
 * A CHECK that the column holds one of `values` (or NULL): the database refuses what the zod schemas
 * already refuse, whoever writes. The SQL names the bare column, so it stays valid when drizzle-kit
 * rebuilds the table under a temporary name.
 */
export function oneOf(column: SQLiteColumn, values: readonly string[]) {
  const list = values.map((value) => `'${value.replaceAll("'", "''")}'`).join(', ');
  return check(
    `${getTableName(column.table)}_${column.name}_check`,
    sql.raw(`"${column.name}" in (${list})`),
  );
}
