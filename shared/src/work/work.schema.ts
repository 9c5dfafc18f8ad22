import { z } from 'zod';
import { HOLD_REASONS, type HoldReason } from '../bays/bays.schema.js';
import { idSchema, instantSchema, plainText } from '../input/fields.js';
import { addVinRuleIssues, vehicleDetailsSchema } from '../vehicles/vin.js';
import { partNameSchema, type PartsHoldDto } from './parts.schema.js';

export const JOB_LINE_STATUSES = ['queued', 'working', 'held', 'done'] as const;
export type JobLineStatus = (typeof JOB_LINE_STATUSES)[number];

export const REPAIR_ORDER_STATUSES = ['open', 'done', 'closed'] as const;
export type RepairOrderStatus = (typeof REPAIR_ORDER_STATUSES)[number];

export const PRIORITIES = ['low', 'normal', 'high', 'urgent'] as const;
export type Priority = (typeof PRIORITIES)[number];

/** Book hours of a line: a tenth of an hour up to what one line can sensibly sell. */
export const bookHoursSchema = z
  .number({ error: 'Book hours is a number of hours, like 1.5' })
  .min(0.1, 'Book hours is at least 0.1')
  .max(99.9, 'Book hours is at most 99.9');
const skillLevelSchema = z.number().int().min(1).max(5);
const lineTitleSchema = plainText(120, { min: 1, message: 'Name the job' });

export const jobLineInputSchema = z.object({
  title: lineTitleSchema,
  bookHours: bookHoursSchema,
  skillLevel: skillLevelSchema.optional(),
});

export const patchJobLineSchema = z
  .object({
    technicianId: idSchema.nullable(),
    bayId: idSchema.nullable(),
    priority: z.enum(PRIORITIES),
    status: z.enum(JOB_LINE_STATUSES),
    holdReason: z.enum(HOLD_REASONS),
    completedAt: instantSchema,
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

/**
 * A technician (or the foreman) pauses a line: anyone clocked on it is clocked off. Held for parts,
 * the technician may say which part is needed; the office records the rest.
 */
export const holdLineSchema = z
  .object({ reason: z.enum(HOLD_REASONS), part: partNameSchema.optional() })
  .refine((body) => body.part === undefined || body.reason === 'parts', {
    path: ['part'],
    message: 'Only a line held for parts names a part',
  });
export type HoldLineBody = z.infer<typeof holdLineSchema>;

/** After the last line in a bay is done the bay goes to a final check or straight to ready. */
export const FINISH_NEXT = ['check', 'ready'] as const;
export const finishLineSchema = z.object({ next: z.enum(FINISH_NEXT).default('check') });
export type FinishLineBody = z.infer<typeof finishLineSchema>;

export const customerInputSchema = z.object({
  name: plainText(80, { min: 1, message: 'Enter the customer’s name' }),
  phone: plainText(30).optional(),
  email: z.email('Not an e-mail address').max(200).optional(),
});

export const createRepairOrderSchema = z
  .object({
    customer: customerInputSchema,
    vehicle: vehicleDetailsSchema,
    concern: plainText(1000, { min: 1, multiline: true, message: 'Say what the customer asked for' }),
    promisedAt: instantSchema.optional(),
    lines: z.array(jobLineInputSchema).min(1, 'Add at least one job line').max(30),
    /** Saving an odometer lower than the last visit needs a reason. */
    odometerOverrideReason: plainText(300, { min: 3, multiline: true, message: 'Say why' }).optional(),
    /** A VIN outside the 49 CFR 565 rules (built before 1981, or abroad) is saved with a reason. */
    vinOverrideReason: plainText(300, { min: 3, multiline: true, message: 'Say why' }).optional(),
  })
  .superRefine((body, ctx) => {
    if (!body.vinOverrideReason) addVinRuleIssues(body.vehicle, ctx, ['vehicle']);
  });
export type CreateRepairOrderBody = z.infer<typeof createRepairOrderSchema>;

export const operationInputSchema = z.object({
  title: lineTitleSchema,
  defaultBookHours: bookHoursSchema,
  skillLevel: skillLevelSchema.default(1),
});
export type OperationInput = z.infer<typeof operationInputSchema>;

export interface OperationDto extends OperationInput {
  id: number;
  active: boolean;
}

export const updateOperationSchema = z
  .object({
    title: lineTitleSchema,
    defaultBookHours: bookHoursSchema,
    skillLevel: skillLevelSchema,
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
  /** Each line with the seconds everyone has clocked on it, split rule applied, and its parts hold. */
  lines: (JobLineDto & { clockedSeconds: number; parts: PartsHoldDto | null })[];
}
