import { z } from 'zod';

/** No list answer holds more rows than this, whatever `limit` asks for. */
export const PAGE_LIMIT_MAX = 100;
export const PAGE_LIMIT_DEFAULT = 50;

/**
 * `?limit=` as written in the address: whole digits only (so "0x10" or "1e3" is refused, not read as a
 * number), at least 1; a larger one than the maximum is clamped rather than refused.
 */
export const pageLimitSchema = z
  .string()
  .max(12, 'limit is a whole number')
  .regex(/^\d+$/, 'limit is a whole number')
  .transform(Number)
  .pipe(z.number().int().min(1, 'limit is at least 1'))
  .transform((limit) => Math.min(limit, PAGE_LIMIT_MAX))
  .optional()
  .transform((limit) => limit ?? PAGE_LIMIT_DEFAULT);

/** `?cursor=`: the `nextCursor` of the previous page, opaque to clients. */
export const pageCursorSchema = z
  .string()
  .max(100, 'Not a cursor from this list')
  .regex(/^[A-Za-z0-9_-]+$/, 'Not a cursor from this list')
  .optional();

export const pageQuerySchema = z.object({ limit: pageLimitSchema, cursor: pageCursorSchema });
export type PageQuery = z.infer<typeof pageQuerySchema>;

/** One page of a list: follow `nextCursor` (null on the last page) for the next; `total` counts every match. */
export interface Page<T> {
  items: T[];
  nextCursor: string | null;
  total: number;
}
