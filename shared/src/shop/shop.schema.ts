import { z } from 'zod';
import { plainText } from '../input/fields.js';
import { phoneSchema } from '../input/phone.js';

export const UNIT_SYSTEMS = ['metric', 'us'] as const;
export const CONCURRENT_SPLITS = ['even', 'full'] as const;
export const OVERTIME_RULES = ['federal', 'california'] as const;

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
});
export type ShopSettings = z.infer<typeof shopSettingsSchema>;

export const updateShopSchema = shopSettingsSchema.partial().strict();
export type UpdateShopBody = z.infer<typeof updateShopSchema>;
