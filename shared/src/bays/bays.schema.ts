import { z } from 'zod';

export const BAY_STATES = ['free', 'staged', 'working', 'timer', 'held', 'check', 'ready'] as const;
export type BayState = (typeof BAY_STATES)[number];

export const HOLD_REASONS = ['parts', 'approval', 'tooling', 'sublet', 'other'] as const;
export type HoldReason = (typeof HOLD_REASONS)[number];

export const BAY_KINDS = ['two-post', 'four-post', 'alignment', 'flat', 'pit'] as const;

export const createBaySchema = z.object({
  name: z.string().trim().min(1).max(24),
  kind: z.enum(BAY_KINDS).optional(),
});
export type CreateBayBody = z.infer<typeof createBaySchema>;

export const updateBaySchema = z
  .object({
    name: z.string().trim().min(1).max(24),
    kind: z.enum(BAY_KINDS),
    active: z.boolean(),
    position: z.number().int().min(0).max(999),
  })
  .partial()
  .strict();
export type UpdateBayBody = z.infer<typeof updateBaySchema>;

export interface BayDto {
  id: number;
  name: string;
  kind: (typeof BAY_KINDS)[number];
  position: number;
  active: boolean;
}

export const createScreenSchema = z.object({ name: z.string().trim().min(1).max(60) });
export type CreateScreenBody = z.infer<typeof createScreenSchema>;

export interface ScreenPairing {
  id: number;
  code: string;
  expiresAt: string;
}
