export const TIMER_KINDS = ['warm-up', 'cool-down', 'hold'] as const;
export type TimerKind = (typeof TIMER_KINDS)[number];
