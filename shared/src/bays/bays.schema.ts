import { z } from 'zod';
import { plainText } from '../input/fields.js';

import { BAY_KINDS } from './bay-states.js';

export { BAY_KINDS, BAY_STATES, HOLD_REASONS, type BayState, type HoldReason } from './bay-states.js';

export const bayNameSchema = plainText(24, { min: 1, message: 'Name the bay' });

export const createBaySchema = z.object({
  name: bayNameSchema,
  kind: z.enum(BAY_KINDS).optional(),
});
export type CreateBayBody = z.infer<typeof createBaySchema>;

export const updateBaySchema = z
  .object({
    name: bayNameSchema,
    kind: z.enum(BAY_KINDS),
    active: z.boolean(),
    position: z.number().int().min(0).max(999),
  })
  .partial()
  .strict();
export type UpdateBayBody = z.infer<typeof updateBaySchema>;

/** `PUT /api/bays/order`: every bay in use, in the order the wall shows them. */
export const bayOrderSchema = z.object({ bayIds: z.array(z.number().int().positive()).min(1).max(200) });
export type BayOrderBody = z.infer<typeof bayOrderSchema>;

export interface BayDto {
  id: number;
  name: string;
  kind: (typeof BAY_KINDS)[number];
  position: number;
  active: boolean;
}

export const createScreenSchema = z.object({ name: plainText(60, { min: 1, message: 'Name the screen' }) });
export type CreateScreenBody = z.infer<typeof createScreenSchema>;

export interface ScreenPairing {
  id: number;
  code: string;
  expiresAt: string;
}
