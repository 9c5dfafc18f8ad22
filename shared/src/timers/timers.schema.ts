import { z } from 'zod';
import { idSchema, instantSchema, plainText } from '../input/fields.js';
import type { EtaConfidence, TemperatureEtaStatus } from './estimator.js';

export const TIMER_KINDS = ['warm-up', 'cool-down', 'set-time'] as const;
export type TimerKind = (typeof TIMER_KINDS)[number];

/** Plausible shop temperatures in °C: below a winter yard, above any fluid a tech would check. */
const celsius = z
  .number()
  .min(-40, 'Below −40 °C: check the reading')
  .max(300, 'Above 300 °C: check the reading');
const timerName = plainText(60, { min: 1, message: 'Type a name' });

export const startTimerSchema = z
  .object({
    jobLineId: idSchema,
    bayId: idSchema.optional(),
    kind: z.enum(TIMER_KINDS),
    targetC: celsius.optional(),
    /** Where the temperature levels off: the room for a cool-down, above the target for a warm-up. */
    ambientC: celsius.optional(),
    durationSeconds: z
      .number()
      .int()
      .min(10)
      .max(48 * 3600)
      .optional(),
    label: timerName.optional(),
    /** The tech confirmed the engine-running caution before a warm-up or cool-down. */
    cautionAcknowledged: z.boolean().optional(),
  })
  .superRefine((timer, ctx) => {
    if (timer.kind === 'set-time' && timer.durationSeconds === undefined)
      ctx.addIssue({ code: 'custom', path: ['durationSeconds'], message: 'A set time needs a duration' });
    if (timer.kind !== 'set-time') {
      if (timer.targetC === undefined)
        ctx.addIssue({
          code: 'custom',
          path: ['targetC'],
          message: 'Enter the target temperature from the maker’s procedure',
        });
      if (timer.cautionAcknowledged !== true)
        ctx.addIssue({
          code: 'custom',
          path: ['cautionAcknowledged'],
          message: 'Confirm the safety checks first',
        });
    }
  });
export type StartTimerBody = z.infer<typeof startTimerSchema>;

export const timerReadingSchema = z.object({
  tempC: celsius,
  at: instantSchema.optional(),
});
export type TimerReadingBody = z.infer<typeof timerReadingSchema>;

export const holdPresetSchema = z.object({
  name: timerName,
  durationSeconds: z
    .number()
    .int()
    .min(10)
    .max(48 * 3600),
});
export type HoldPresetBody = z.infer<typeof holdPresetSchema>;

export interface HoldPresetDto extends HoldPresetBody {
  id: number;
}

export interface TimerEstimateDto {
  status: TemperatureEtaStatus | 'running' | 'done';
  etaAt: string | null;
  secondsLeft: number | null;
  method: 'newton' | 'linear' | 'fixed' | null;
  confidence: EtaConfidence;
}

export interface TimerDto {
  id: number;
  kind: TimerKind;
  jobLineId: number;
  /** The technician the line is assigned to, when it is. */
  lineTechnicianId: number | null;
  bayId: number | null;
  label: string | null;
  targetC: number | null;
  ambientC: number | null;
  durationSeconds: number | null;
  startedAt: string;
  startedBy: number;
  reachedAt: string | null;
  endedAt: string | null;
  readings: { at: string; tempC: number }[];
  estimate: TimerEstimateDto;
}
