import { z } from 'zod';
import { HOLD_REASONS, type HoldReason } from '../bays/bays.schema.js';
import { vehicleInputSchema } from '../vehicles/vin.js';

export const JOB_LINE_STATUSES = ['queued', 'working', 'held', 'done'] as const;
export type JobLineStatus = (typeof JOB_LINE_STATUSES)[number];

/**
 * A line marked done with less clocked time than the shop's minimum is `awaiting` a foreman's sign-off and
 * stays out of the flagged figures until then; `signed` once a foreman or owner vouched for it.
 */
export const SIGN_OFF_STATES = ['awaiting', 'signed'] as const;
export type SignOffState = (typeof SIGN_OFF_STATES)[number];

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
  /** Set when the line was done with too little clocked time: awaiting a sign-off, or signed off. */
  signOff?: SignOffState | null;
}

/** A technician (or the foreman) pauses a line: anyone clocked on it is clocked off. */
export const holdLineSchema = z.object({ reason: z.enum(HOLD_REASONS) });
export type HoldLineBody = z.infer<typeof holdLineSchema>;

/** After the last line in a bay is done the bay goes to a final check or straight to ready. */
export const FINISH_NEXT = ['check', 'ready'] as const;
export const finishLineSchema = z.object({ next: z.enum(FINISH_NEXT).default('check') });
export type FinishLineBody = z.infer<typeof finishLineSchema>;

export const customerInputSchema = z.object({
  name: z.string().trim().min(1, 'Enter the customer’s name').max(80),
  phone: z.string().trim().max(30).optional(),
  email: z.email('Not an e-mail address').max(200).optional(),
});

export const createRepairOrderSchema = z.object({
  customer: customerInputSchema,
  vehicle: vehicleInputSchema,
  concern: z.string().trim().min(1, 'Say what the customer asked for').max(1000),
  promisedAt: z.iso.datetime({ offset: true }).optional(),
  lines: z.array(jobLineInputSchema).min(1, 'Add at least one job line').max(30),
  /** Saving an odometer lower than the last visit needs a reason. */
  odometerOverrideReason: z.string().trim().min(3).max(300).optional(),
});
export type CreateRepairOrderBody = z.infer<typeof createRepairOrderSchema>;

export const operationInputSchema = z.object({
  title: z.string().trim().min(1).max(120),
  defaultBookHours: z.number().min(0).max(99),
  skillLevel: z.number().int().min(1).max(5).default(1),
});
export type OperationInput = z.infer<typeof operationInputSchema>;

export interface OperationDto extends OperationInput {
  id: number;
  active: boolean;
}

export const updateOperationSchema = z
  .object({
    title: z.string().trim().min(1).max(120),
    defaultBookHours: z.number().min(0).max(99),
    skillLevel: z.number().int().min(1).max(5),
    active: z.boolean(),
  })
  .partial()
  .strict();
export type UpdateOperationBody = z.infer<typeof updateOperationSchema>;

/** A repair order as the office reads it: `GET /api/repair-orders` and `GET /api/repair-orders/:id`. */
export interface RepairOrderSummary {
  id: number;
  number: string;
  customerName: string;
  customerPhone: string | null;
  customerEmail: string | null;
  /** "2019 Halvard Tessel". */
  vehicle: string;
  vin: string;
  plate: string | null;
  odometer: number;
  concern: string;
  status: RepairOrderStatus;
  advisorId: number | null;
  advisorName: string | null;
  promisedAt: string | null;
  createdAt: string;
  /** Each line with the seconds everyone has clocked on it, split rule applied. */
  lines: (JobLineDto & { clockedSeconds: number })[];
}
