import { sql, type SQL } from 'drizzle-orm';
import type { Db } from '../db/database.js';
import { repairOrders } from '../db/schema/index.js';

/**
 * `repair_orders_search` is an FTS5 table with the trigram tokenizer, kept by triggers on
 * `repair_orders` (see the `repair_orders_search` migration): any three characters in a row of the RO
 * number, the customer's name or phone (also as bare digits), the plate or the VIN find their ROs
 * through the index. A word shorter than a trigram narrows those matches; alone it reads the table.
 */
const SEARCHED_COLUMNS = ['number', 'customer_name', 'customer_phone', 'phone_digits', 'plate', 'vin'];
const TRIGRAM = 3;

const phrase = (word: string) => `"${word.replaceAll('"', '""')}"`;
const containing = (word: string) => `%${word.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;

/** The search table's rows (one per RO, its rowid the RO's id) whose text holds every word of `q`. */
function matching(q: string): SQL {
  const words = q.split(/\s+/).filter(Boolean);
  const long = words.filter((word) => [...word].length >= TRIGRAM);
  const short = words.filter((word) => [...word].length < TRIGRAM);
  const conditions: SQL[] = [];
  if (long.length) conditions.push(sql`repair_orders_search MATCH ${long.map(phrase).join(' AND ')}`);
  for (const word of short)
    conditions.push(
      sql`(${sql.join(
        SEARCHED_COLUMNS.map((column) => sql`${sql.identifier(column)} LIKE ${containing(word)} ESCAPE '\\'`),
        sql` OR `,
      )})`,
    );
  return sql`SELECT rowid FROM repair_orders_search WHERE ${sql.join(conditions, sql` AND `)}`;
}

/**
 * ROs whose searched text holds every word of `q`, in any column, ignoring case. `newestFirst`: SQLite
 * walks the ROs newest first and keeps the matches (for a search that matches many, whose first page
 * lies close to the start of that walk), instead of finding every match first and sorting them.
 */
export function repairOrderSearch(q: string, newestFirst = false): SQL {
  // A unary `+` keeps SQLite from looking the matches up by id, so it walks an index in the page's order.
  const id = newestFirst ? sql`+${repairOrders.id}` : sql`${repairOrders.id}`;
  return sql`${id} IN (${matching(q)})`;
}

/** How many ROs the search finds, counted in the search table alone. */
export function repairOrderSearchCount(db: Db, q: string): number {
  return db.get<{ n: number }>(sql`SELECT count(*) AS n FROM (${matching(q)})`).n;
}
