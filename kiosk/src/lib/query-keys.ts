/**
 * Every cache key of the kiosk, in one place. What is under `me` belongs to the technician signed
 * in and goes when they sign out. The live channel's table (`live-queries.ts`) and the mutations
 * name keys only through these.
 */
export const queryKeys = {
  me: () => ['me'] as const,
  myDay: {
    all: () => ['me', 'day'] as const,
    /** Keyed by technician, so one tech never sees the day of the one before on a shared tablet. */
    of: (technicianId: number) => ['me', 'day', technicianId] as const,
  },
  timecards: {
    of: (technicianId: number) => ['me', 'timecard', technicianId] as const,
    week: (technicianId: number, week: string | undefined) =>
      ['me', 'timecard', technicianId, week ?? 'current'] as const,
  },
  timers: () => ['timers'] as const,
  bays: () => ['bays'] as const,
  holdPresets: () => ['hold-presets'] as const,
  offlineKey: () => ['offline-key'] as const,
  shop: () => ['shop'] as const,
  health: () => ['health'] as const,
};
