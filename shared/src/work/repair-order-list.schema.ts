import { z } from 'zod';
import { pageQuerySchema, type Page } from '../paging/page.schema.js';
import { REPAIR_ORDER_STATUSES, type RepairOrderSummary } from './work.schema.js';

const idTextSchema = z
  .string()
  .max(12, 'Not an id')
  .regex(/^[1-9]\d*$/, 'Not an id')
  .transform(Number);

/**
 * `GET /api/repair-orders`: newest first, a page at a time. `q` finds the RO number, the customer's
 * name or phone, the plate or the VIN as written on the RO; `promised=today` keeps ROs promised for
 * the shop's today; `late=true` keeps open ROs whose promised time has passed.
 */
export const repairOrderListQuerySchema = pageQuerySchema.extend({
  status: z.enum(REPAIR_ORDER_STATUSES).optional(),
  q: z
    .string()
    .trim()
    .max(100, 'Search for at most 100 characters')
    .optional()
    .transform((q) => q || undefined),
  advisorId: idTextSchema.optional(),
  promised: z.literal('today', { error: 'promised can only be today' }).optional(),
  late: z
    .enum(['true', 'false'], { error: 'late is true or false' })
    .optional()
    .transform((late) => late === 'true'),
});
export type RepairOrderListQuery = z.infer<typeof repairOrderListQuerySchema>;

export type RepairOrderPage = Page<RepairOrderSummary>;
