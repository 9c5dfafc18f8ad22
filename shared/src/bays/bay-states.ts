// Plain lists, kept out of the zod schemas: a screen that needs only these loads no zod.
export const BAY_STATES = ['free', 'staged', 'working', 'timer', 'held', 'check', 'ready'] as const;
export type BayState = (typeof BAY_STATES)[number];

export const HOLD_REASONS = ['parts', 'approval', 'tooling', 'sublet', 'other'] as const;
export type HoldReason = (typeof HOLD_REASONS)[number];

export const BAY_KINDS = ['two-post', 'four-post', 'alignment', 'flat', 'pit'] as const;
