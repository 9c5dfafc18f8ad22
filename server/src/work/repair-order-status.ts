import { eq } from 'drizzle-orm';
import { repairOrderStatus, type RepairOrderStatus } from '@baytime/shared';
import type { Db } from '../db/database.js';
import { jobLines, repairOrders } from '../db/schema/index.js';

/**
 * Brings the RO's stored status in line with its lines (`repairOrderStatus` decides): every use case
 * that changes a line's status, adds or removes a line, calls this once its rows are written.
 */
export function syncRepairOrderStatus(db: Db, repairOrderId: number): RepairOrderStatus {
  const ro = db.select().from(repairOrders).where(eq(repairOrders.id, repairOrderId)).get();
  if (!ro) return 'open';
  const lines = db
    .select({ status: jobLines.status })
    .from(jobLines)
    .where(eq(jobLines.repairOrderId, repairOrderId))
    .all();
  const status = repairOrderStatus(lines, ro.closedAt);
  if (status !== ro.status)
    db.update(repairOrders).set({ status }).where(eq(repairOrders.id, repairOrderId)).run();
  return status;
}
