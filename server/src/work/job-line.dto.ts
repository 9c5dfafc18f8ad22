import type { JobLineDto } from '@baytime/shared';
import type { jobLines } from '../db/schema/index.js';

export function toJobLineDto(row: typeof jobLines.$inferSelect): JobLineDto {
  return {
    id: row.id,
    repairOrderId: row.repairOrderId,
    lineNo: row.lineNo,
    title: row.title,
    bookHours: row.bookHours,
    skillLevel: row.skillLevel,
    status: row.status,
    holdReason: row.holdReason,
    priority: row.priority,
    technicianId: row.technicianId,
    bayId: row.bayId,
    promisedAt: row.promisedAt?.toISOString() ?? null,
    completedAt: row.completedAt?.toISOString() ?? null,
    signOff: row.signOff,
    completedBy: row.completedBy,
    concern: row.concern,
    cause: row.cause,
    correction: row.correction,
    cancelReason: row.cancelReason,
  };
}
