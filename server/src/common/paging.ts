import { BadRequestException } from '@nestjs/common';
import { sql, type SQL } from 'drizzle-orm';
import type { SQLiteColumn } from 'drizzle-orm/sqlite-core';
import type { Page } from '@baytime/shared';

/** Where the next page starts: just after the last row shown, in newest-first order. */
export interface Keyset {
  at: number;
  id: number;
}

const NOT_A_CURSOR = 'Not a cursor from this list';

export function encodeCursor({ at, id }: Keyset): string {
  return Buffer.from(`${at}.${id}`).toString('base64url');
}

export function decodeCursor(cursor: string | undefined): Keyset | undefined {
  if (cursor === undefined) return undefined;
  const match = /^(\d{1,15})\.(\d{1,12})$/.exec(Buffer.from(cursor, 'base64url').toString());
  if (!match)
    throw new BadRequestException({
      statusCode: 400,
      message: NOT_A_CURSOR,
      issues: [{ path: ['cursor'], message: NOT_A_CURSOR }],
    });
  return { at: Number(match[1]), id: Number(match[2]) };
}

/**
 * Rows after the keyset in newest-first order. A row-value comparison, so SQLite walks an index on
 * the time column (the rowid is its tie-breaker) from the cursor on instead of counting an offset.
 */
export function olderThan(at: SQLiteColumn, id: SQLiteColumn, keyset: Keyset | undefined): SQL | undefined {
  return keyset ? sql`(${at}, ${id}) < (${keyset.at}, ${keyset.id})` : undefined;
}

/** `rows` fetched with one more than `limit`: the extra row only tells that another page follows. */
export function toPage<Row, Item>(
  rows: Row[],
  limit: number,
  total: number,
  keysetOf: (row: Row) => Keyset,
  toItem: (rows: Row[]) => Item[],
): Page<Item> {
  const shown = rows.slice(0, limit);
  const last = shown.at(-1);
  return {
    items: toItem(shown),
    nextCursor: rows.length > limit && last ? encodeCursor(keysetOf(last)) : null,
    total,
  };
}
