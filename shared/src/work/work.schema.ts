import { z } from 'zod';
import { HOLD_REASONS, type HoldReason } from '../bays/bays.schema.js';
import { idSchema, instantSchema, plainText } from '../input/fields.js';
import { phoneEditSchema, phoneSchema } from '../input/phone.js';
import { addVinRuleIssues, vehicleDetailsSchema } from '../vehicles/vin.js';
import { partNameSchema, type PartsHoldDto } from './parts.schema.js';

/** `cancelled`: taken off the RO with a reason after time was clocked on it; never flagged. */
export const JOB_LINE_STATUSES = ['queued', 'working', 'held', 'done', 'cancelled'] as const;
export type JobLineStatus = (typeof JOB_LINE_STATUSES)[number];

/**
 * A line marked done with less clocked time than the shop's minimum is `awaiting` a foreman's sign-off and
 * stays out of the flagged figures until then; `signed` once a foreman or owner vouched for it.
 */
export const SIGN_OFF_STATES = ['awaiting', 'signed'] as const;
export type SignOffState = (typeof SIGN_OFF_STATES)[number];

/** Statuses of a line nobody works on any more. */
export const CLOSED_LINE_STATUSES = ['done', 'cancelled'] as const satisfies readonly JobLineStatus[];

export function isOpenLine(line: { status: JobLineStatus }): boolean {
  return !(CLOSED_LINE_STATUSES as readonly JobLineStatus[]).includes(line.status);
}

export const REPAIR_ORDER_STATUSES = ['open', 'done', 'closed'] as const;
export type RepairOrderStatus = (typeof REPAIR_ORDER_STATUSES)[number];

/**
 * The one rule for an RO's status: `closed` once the vehicle was picked up; `done` when it has lines
 * and none of them is open; `open` otherwise.
 */
export function repairOrderStatus(
  lines: readonly { status: JobLineStatus }[],
  closedAt: Date | string | null,
): RepairOrderStatus {
  if (closedAt !== null) return 'closed';
  return lines.length > 0 && !lines.some(isOpenLine) ? 'done' : 'open';
}

export const PRIORITIES = ['low', 'normal', 'high', 'urgent'] as const;
export type Priority = (typeof PRIORITIES)[number];

/** Book hours of a line: a tenth of an hour up to what one line can sensibly sell. */
export const bookHoursSchema = z
  .number({ error: 'Book hours is a number of hours, like 1.5' })
  .min(0.1, 'Book hours is at least 0.1')
  .max(99.9, 'Book hours is at most 99.9');
const skillLevelSchema = z.number().int().min(1).max(5);
const lineTitleSchema = plainText(120, { min: 1, message: 'Name the job' });
/** The longest concern a line holds. */
export const CONCERN_MAX_LENGTH = 1000;
/** The three Cs of a line: what the customer asked for, what the technician found, what was done. */
const concernSchema = plainText(CONCERN_MAX_LENGTH, {
  min: 1,
  multiline: true,
  message: 'Say what the customer asked for',
});
const causeSchema = plainText(1000, { multiline: true });
const correctionSchema = plainText(1000, { multiline: true });
const reasonSchema = plainText(300, { min: 3, multiline: true, message: 'Say why' });

export const jobLineInputSchema = z.object({
  title: lineTitleSchema,
  bookHours: bookHoursSchema,
  skillLevel: skillLevelSchema.optional(),
  /** The customer's words for this line; the RO's concern when left out. */
  concern: concernSchema.optional(),
});
export type JobLineInput = z.infer<typeof jobLineInputSchema>;

/** A line's details as an editor read them: the record, not new input, so only their shape is checked. */
const readLineDetailsSchema = z
  .object({
    title: z.string().max(CONCERN_MAX_LENGTH),
    bookHours: z.number(),
    skillLevel: skillLevelSchema,
    concern: z.string().max(CONCERN_MAX_LENGTH),
    cause: z.string().max(CONCERN_MAX_LENGTH).nullable(),
    correction: z.string().max(CONCERN_MAX_LENGTH).nullable(),
  })
  .partial()
  .strict();
export type LineDetailField = keyof z.infer<typeof readLineDetailsSchema>;

/**
 * `PATCH /api/job-lines/:id/details`: the advisor corrects a line after the fact. With `was` (each
 * changed field as the editor read it) the edit is refused with 409 when one of those fields changed
 * since, so two people never silently undo each other; a change to another field, or to the line's
 * status or assignment, is no conflict. Without `was` the edit is taken as it comes.
 */
export const editJobLineSchema = z
  .object({
    title: lineTitleSchema,
    bookHours: bookHoursSchema,
    skillLevel: skillLevelSchema,
    concern: concernSchema,
    cause: causeSchema,
    correction: correctionSchema,
    was: readLineDetailsSchema,
  })
  .partial()
  .strict();
export type EditJobLineBody = z.infer<typeof editJobLineSchema>;

/** A line with clocked time is never deleted: it is cancelled with a reason. */
export const cancelJobLineSchema = z.object({ reason: reasonSchema });
export type CancelJobLineBody = z.infer<typeof cancelJobLineSchema>;

/** `PUT /api/repair-orders/:id/line-order`: every line of the RO, in the new order. */
export const lineOrderSchema = z.object({
  lineIds: z.array(idSchema).min(1).max(200),
});
export type LineOrderBody = z.infer<typeof lineOrderSchema>;

export const patchJobLineSchema = z
  .object({
    technicianId: idSchema.nullable(),
    bayId: idSchema.nullable(),
    priority: z.enum(PRIORITIES),
    /** A line is cancelled only with a reason: `POST /api/job-lines/:id/cancel`. */
    status: z.enum(JOB_LINE_STATUSES).exclude(['cancelled']),
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
  /** Set when the line was done with too little clocked time: awaiting a sign-off, or signed off. */
  signOff?: SignOffState | null;
  /** Who marked it done (a technician at the kiosk, or the foreman). */
  completedBy: number | null;
  concern: string;
  cause: string | null;
  correction: string | null;
  /** Why it was cancelled; null unless cancelled. */
  cancelReason: string | null;
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
export const finishLineSchema = z.object({
  next: z.enum(FINISH_NEXT).default('check'),
  cause: causeSchema.optional(),
  correction: correctionSchema.optional(),
});
export type FinishLineBody = z.infer<typeof finishLineSchema>;
export type FinishLineFields = z.input<typeof finishLineSchema>;

/**
 * A technician marking a line done at the kiosk writes the cause and correction: they are the RO's
 * record for the customer and any warranty claim. The foreman may still finish a line without them.
 */
export const kioskDoneSchema = finishLineSchema.extend({
  cause: plainText(1000, { min: 3, multiline: true, message: 'Say what you found' }),
  correction: plainText(1000, { min: 3, multiline: true, message: 'Say what you did' }),
});

const emailSchema = z.email('Not an e-mail address').max(200);

export const customerInputSchema = z.object({
  name: plainText(80, { min: 1, message: 'Enter the customer’s name' }),
  phone: phoneSchema,
  email: emailSchema.optional(),
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
    /**
     * The RO's reference in the system it comes from. One RO per reference in the shop: sending the
     * same reference again answers the RO already written and changes nothing.
     */
    externalRef: plainText(64, {
      min: 1,
      message: 'Give the reference of the RO in its own system',
    }).optional(),
  })
  .superRefine((body, ctx) => {
    if (!body.vinOverrideReason) addVinRuleIssues(body.vehicle, ctx, ['vehicle']);
  });
export type CreateRepairOrderBody = z.infer<typeof createRepairOrderSchema>;

/** An RO's own record as the office edits it: the customer and vehicle on it, the concern, the promise. */
const repairOrderDetailsSchema = z
  .object({
    customer: z
      .object({
        name: customerInputSchema.shape.name,
        phone: phoneEditSchema,
        email: z
          .union([z.literal(''), emailSchema])
          .transform((email) => email || null)
          .nullable(),
      })
      .partial()
      .strict(),
    vehicle: vehicleDetailsSchema
      .pick({ year: true, make: true, model: true, odometer: true })
      .extend({
        plate: plainText(16)
          .transform((plate) => plate || null)
          .nullable(),
      })
      .partial()
      .strict(),
    concern: plainText(1000, { min: 1, multiline: true, message: 'Say what the customer asked for' }),
    promisedAt: instantSchema.nullable(),
  })
  .partial()
  .strict();

/**
 * `PATCH /api/repair-orders/:id`: corrections after the fact, each audited with what it was. A
 * promise of null takes the promise back; a phone, e-mail or plate left empty (or null) is taken off,
 * as a customer may have no phone or e-mail on file. A reading lowered below the vehicle's highest
 * needs a reason, as at intake. With `was` (each changed field as the editor read it) the edit is
 * refused with 409 when one of those fields changed since; a change to another field is no conflict.
 * Without `was` the edit is taken as it comes.
 */
export const editRepairOrderSchema = repairOrderDetailsSchema
  .extend({ odometerOverrideReason: reasonSchema, was: repairOrderDetailsSchema })
  .partial()
  .strict();
export type EditRepairOrderBody = z.infer<typeof editRepairOrderSchema>;

/** `POST /api/repair-orders/:id/lines`: a line added after the RO was written. */
export const addJobLineSchema = jobLineInputSchema;
export type AddJobLineBody = JobLineInput;

/** `POST /api/bays/:id/final-check`: the road test or final look is done; the bay goes to ready. */
export const finalCheckSchema = z.object({ note: plainText(500, { multiline: true }).optional() });
export type FinalCheckBody = z.infer<typeof finalCheckSchema>;

/** One event in an RO's history, in plain words, from the audit trail. */
export interface RepairOrderHistoryEntry {
  at: string;
  actorName: string | null;
  action: string;
  text: string;
}

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
  /** The parts of `vehicle`, for a correction. */
  vehicleYear: number;
  vehicleMake: string;
  vehicleModel: string;
  vin: string;
  plate: string | null;
  odometer: number;
  concern: string;
  status: RepairOrderStatus;
  /** The RO's reference in the system it was imported from. */
  externalRef: string | null;
  advisorId: number | null;
  advisorName: string | null;
  promisedAt: string | null;
  createdAt: string;
  closedAt: string | null;
  /** An open line of it is late: see `isLineLate`. */
  late: boolean;
  /** Each line with the seconds everyone has clocked on it (split rule applied), whether it is late, and its parts hold. */
  lines: (JobLineDto & { clockedSeconds: number; late: boolean; parts: PartsHoldDto | null })[];
}
