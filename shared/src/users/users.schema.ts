import { z } from 'zod';
import { DEVICE_ROLES, ROLES, type Role } from '../auth/auth.schema.js';
import { plainText } from '../input/fields.js';
import { PAY_TYPES, type PayRate } from '../pay/pay-types.js';
import { localDateSchema } from '../shop/shop.schema.js';

export { shortName } from './short-name.js';

/** A pay rate per hour in cents. */
const cents = z
  .number('A rate is a number of cents')
  .int('A rate is whole cents')
  .min(0, 'A rate cannot be below $0.00')
  .max(1_000_00, 'At most $1,000.00 an hour');
const personName = plainText(80, { min: 1, message: 'Enter a name' });

export const createUserSchema = z
  .object({
    name: personName,
    role: z.enum(ROLES).exclude([...DEVICE_ROLES]),
    email: z.email().max(200).optional(),
    password: z.string().min(10, 'A password has at least 10 characters').max(200).optional(),
    badge: z
      .string()
      .regex(/^\d{3,8}$/, 'A badge is 3 to 8 digits')
      .optional(),
    pin: z
      .string()
      .regex(/^\d{4,8}$/, 'A PIN is 4 to 8 digits')
      .optional(),
    skillLevel: z.number().int().min(1).max(5).optional(),
    flatRateCents: cents.optional(),
    hourlyRateCents: cents.optional(),
    overtimeExempt: z.boolean().optional(),
    payType: z.enum(PAY_TYPES).optional(),
    guaranteeCents: cents.optional(),
    /** The first day (shop's zone) the rates apply; default today. */
    effectiveFrom: localDateSchema.optional(),
  })
  .superRefine((user, ctx) => {
    if (user.role === 'technician') {
      if (!user.badge)
        ctx.addIssue({ code: 'custom', path: ['badge'], message: 'A technician needs a badge' });
      if (!user.pin) ctx.addIssue({ code: 'custom', path: ['pin'], message: 'A technician needs a PIN' });
      if (user.payType === 'flat-rate-guarantee' && !user.guaranteeCents)
        ctx.addIssue({
          code: 'custom',
          path: ['guaranteeCents'],
          message: 'Give the hourly guarantee for productive time',
        });
    } else {
      if (!user.email)
        ctx.addIssue({ code: 'custom', path: ['email'], message: 'Office staff need an e-mail' });
      if (!user.password)
        ctx.addIssue({ code: 'custom', path: ['password'], message: 'Office staff need a password' });
    }
  });
export type CreateUserBody = z.infer<typeof createUserSchema>;

export const updateUserSchema = z
  .object({
    name: personName,
    role: z.enum(ROLES).exclude(['display']),
    email: z.email().max(200),
    password: z.string().min(10, 'A password has at least 10 characters').max(200),
    badge: z.string().regex(/^\d{3,8}$/, 'A badge is 3 to 8 digits'),
    pin: z.string().regex(/^\d{4,8}$/, 'A PIN is 4 to 8 digits'),
    skillLevel: z.number().int().min(1).max(5),
    flatRateCents: cents,
    hourlyRateCents: cents,
    overtimeExempt: z.boolean(),
    active: z.boolean(),
    payType: z.enum(PAY_TYPES),
    guaranteeCents: cents,
    /** With a change of pay type, rate or overtime rule: the first day (shop's zone) it applies; default today. */
    effectiveFrom: localDateSchema,
  })
  .partial()
  .strict();
export type UpdateUserBody = z.infer<typeof updateUserSchema>;
export type UpdateUserFields = z.input<typeof updateUserSchema>;

export interface UserDto {
  id: number;
  name: string;
  role: Role;
  email: string | null;
  badge: string | null;
  skillLevel: number;
  flatRateCents: number;
  hourlyRateCents: number;
  overtimeExempt: boolean;
  active: boolean;
  /** With the rates above: those in force today. */
  payType: PayRate['payType'];
  guaranteeCents: number;
  /** Every rate recorded, newest first: each applies from its date until the next. */
  payRates: DatedPayRate[];
}

export interface DatedPayRate extends PayRate {
  effectiveFrom: string;
  recordedAt: string;
}
