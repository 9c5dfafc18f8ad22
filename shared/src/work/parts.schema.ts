import { z } from 'zod';
import { instantSchema, plainText } from '../input/fields.js';

/** Where a part stands once the office has ordered it; null while nobody has ordered it yet. */
export const PARTS_STATES = ['ordered', 'back-ordered'] as const;
export type PartsState = (typeof PARTS_STATES)[number];

export const partNameSchema = plainText(120, { min: 1, message: 'Say which part' });

/** `PUT /api/job-lines/:id/parts`: the office records or edits what a line held for parts waits for. */
export const partsDetailsSchema = z
  .object({
    part: partNameSchema,
    state: z.enum(PARTS_STATES).nullable().default(null),
    supplier: plainText(80).nullable().default(null),
    expectedAt: instantSchema.nullable().default(null),
  })
  .strict();
export type PartsDetailsBody = z.infer<typeof partsDetailsSchema>;

/** What a line held for parts waits for; `receivedAt` is set once the parts are in. */
export interface PartsHoldDto {
  part: string | null;
  state: PartsState | null;
  supplier: string | null;
  expectedAt: string | null;
  receivedAt: string | null;
}
