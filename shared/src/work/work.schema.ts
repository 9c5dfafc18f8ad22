import { z } from 'zod';
import { HOLD_REASONS, type HoldReason } from '../bays/bays.schema.js';

export const JOB_LINE_STATUSES = ['queued', 'working', 'held', 'done'] as const;
export type JobLineStatus = (typeof JOB_LINE_STATUSES)[number];

export const REPAIR_ORDER_STATUSES = ['open', 'done', 'closed'] as const;
export type RepairOrderStatus = (typeof REPAIR_ORDER_STATUSES)[number];

export const PRIORITIES = ['low', 'normal', 'high', 'urgent'] as const;
export type Priority = (typeof PRIORITIES)[number];

export const jobLineInputSchema = z.object({
  title: z.string().trim().min(1).max(120),
  bookHours: z.number().min(0).max(99),
  skillLevel: z.number().int().min(1).max(5).optional(),
});

export const patchJobLineSchema = z
  .object({
    technicianId: z.number().int().positive().nullable(),
    bayId: z.number().int().positive().nullable(),
    priority: z.enum(PRIORITIES),
    status: z.enum(JOB_LINE_STATUSES),
    holdReason: z.enum(HOLD_REASONS),
    completedAt: z.iso.datetime({ offset: true }),
  })
  .partial()
  .strict()
  .refine((patch) => patch.status !== 'held' || patch.holdReason !== undefined, {
    path: ['holdReason'],
    message: 'A held line needs a reason',
  });
export type PatchJobLineBody = z.infer<typeof patchJobLineSchema>;

export interface JobLineDto {
  id: number;
  repairOrderId: number;
  lineNo: number;
  title: string;
  bookHours: number;
  skillLevel: number;
  status: JobLineStatus;
  holdReason: HoldReason | null;
  priority: Priority;
  technicianId: number | null;
  bayId: number | null;
  promisedAt: string | null;
  completedAt: string | null;
}

/** A technician (or the foreman) pauses a line: anyone clocked on it is clocked off. */
export const holdLineSchema = z.object({ reason: z.enum(HOLD_REASONS) });
export type HoldLineBody = z.infer<typeof holdLineSchema>;

/** After the last line in a bay is done the bay goes to a final check or straight to ready. */
export const FINISH_NEXT = ['check', 'ready'] as const;
export const finishLineSchema = z.object({ next: z.enum(FINISH_NEXT).default('check') });
export type FinishLineBody = z.infer<typeof finishLineSchema>;
