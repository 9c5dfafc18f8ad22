import { z } from 'zod';
import { plainText } from '../input/fields.js';
import { phoneSchema } from '../input/phone.js';

export const UNIT_SYSTEMS = ['metric', 'us'] as const;
export const CONCURRENT_SPLITS = ['even', 'full'] as const;
export const OVERTIME_RULES = ['federal', 'california'] as const;
/** How clock times read: "2:30 pm" or "14:30". */
export const CLOCK_FORMATS = ['12h', '24h'] as const;
export type ClockFormat = (typeof CLOCK_FORMATS)[number];

const hhmm = z.string().regex(/^([01]\d|2[0-3]):[0-5]\d$/, 'Use HH:MM');

/** Opening hours per weekday, 0 = Sunday; null = closed that day. */
export const openingHoursSchema = z
  .array(z.object({ open: hhmm, close: hhmm }).nullable())
  .length(7, 'Give one entry per weekday, Sunday first');
export type OpeningHours = z.infer<typeof openingHoursSchema>;

function isTimeZone(name: string): boolean {
  try {
    new Intl.DateTimeFormat('en-US', { timeZone: name });
    return true;
  } catch {
    return false;
  }
}

export const shopSettingsSchema = z.object({
  name: plainText(80, { min: 1, message: 'Name the shop' }),
  timeZone: z.string().max(64).refine(isTimeZone, 'Not a known IANA time zone'),
  workweekStartDay: z.number().int().min(0).max(6),
  workweekStartHour: z.number().int().min(0).max(23),
  units: z.enum(UNIT_SYSTEMS),
  clockFormat: z.enum(CLOCK_FORMATS),
  maxConcurrentJobs: z.number().int().min(1).max(4),
  concurrentSplit: z.enum(CONCURRENT_SPLITS),
  minimumWageCents: z.number().int().min(725, 'Not below the federal $7.25').max(100_00),
  overtimeRules: z.enum(OVERTIME_RULES),
  openingHours: openingHoursSchema,
  kioskIdleSeconds: z.number().int().min(15).max(600),
  payNonProductiveSeparately: z.boolean(),
  /** A technician may clock onto an unassigned line, which then becomes theirs. */
  techniciansTakeUnassigned: z.boolean(),
  /** The shop's phone, shown to customers on the approval page; E.164. */
  phone: z.preprocess((value) => value ?? '', phoneSchema).transform((phone) => phone ?? null),
  /** What a customer pays per book hour of labour. */
  labourRateCents: z
    .number()
    .int('The labour rate is a whole number of cents')
    .min(0)
    .max(100_000, 'The labour rate is at most $1,000 an hour'),
  /** Shown under prices: how tax is charged (prices here are before tax). */
  taxNote: plainText(200),
  /** How long an approval link stays valid. */
  approvalLinkHours: z
    .number()
    .int('Hours is a whole number')
    .min(1, 'A link lasts at least an hour')
    .max(720, 'A link lasts at most 30 days'),
  /** A city or county minimum wage above the state's, if any: the highest figure applies. */
  localMinimumWageCents: z.number().int().min(725, 'Not below the federal $7.25').max(100_00).nullable(),
  /** 29 CFR 785.19(a): a bona fide meal period is ordinarily 30 minutes or more; a shorter "meal" is paid rest. */
  minimumMealMinutes: z.number().int().min(10).max(60),
  /** A shift open longer than this is listed for the foreman: a shift-out may be missing. */
  longShiftHours: z.number().int().min(8).max(24),
  /** A line marked done with less clocked time than this waits for a foreman's sign-off before it is flagged. */
  minimumClockedMinutesForDone: z.number().int().min(0).max(120),
  /** A technician's own efficiency drives forecasts only after this many clocked hours in four weeks. */
  minimumClockedHoursForEfficiency: z.number().int().min(0).max(200),
  /**
   * 29 CFR 778.119–778.120 (for commissions, applied here by analogy): a line's flat-rate pay is shared over
   * the weeks it was clocked in when working out each week's overtime.
   */
  apportionSpanningLines: z.boolean(),
  /** The kiosk's "My week" shows the technician's estimated earnings. */
  kioskShowsPay: z.boolean(),
});
export type ShopSettings = z.infer<typeof shopSettingsSchema>;

/** The pay rules that take effect from a date: every week is paid with the rules in force when it began. */
export const PAY_RULE_FIELDS = [
  'overtimeRules',
  'minimumWageCents',
  'localMinimumWageCents',
  'payNonProductiveSeparately',
] as const satisfies readonly (keyof ShopSettings)[];
export type PayRules = Pick<ShopSettings, (typeof PAY_RULE_FIELDS)[number]>;

/** A calendar date in the shop's time zone. */
export const localDateSchema = z
  .string()
  .regex(/^\d{4}-\d{2}-\d{2}$/, 'Use a date like 2026-03-01')
  .refine(
    (day) =>
      !Number.isNaN(Date.parse(`${day}T12:00:00Z`)) &&
      new Date(`${day}T12:00:00Z`).toISOString().startsWith(day),
    'Not a calendar date',
  );

export const updateShopSchema = shopSettingsSchema
  .partial()
  .extend({
    /** The day a change of pay rules takes effect (default: today in the shop's zone). */
    payRulesFrom: localDateSchema.optional(),
  })
  .strict();
export type UpdateShopBody = z.infer<typeof updateShopSchema>;

export interface DatedPayRules extends PayRules {
  effectiveFrom: string;
}
