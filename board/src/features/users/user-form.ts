import { z } from 'zod';
import {
  createUserSchema,
  PAY_TYPES,
  shopDayKey,
  updateUserSchema,
  type DatedPayRate,
  type PersonRole,
  type UserDto,
} from '@baytime/shared';
import { dollarsToCents } from '@/lib/form-errors';
import { checkedAsBody } from '@/lib/form';
import { EMPTY_PAY, missingRates, PAY_FIELD_OF, payBody, payDraftOf } from './components/pay-fields';

export const ROLE_LABELS: Record<PersonRole, string> = {
  owner: 'Owner',
  foreman: 'Foreman',
  advisor: 'Service advisor',
  technician: 'Technician',
};

/** A rate typed in dollars ("28.5", "$28.50"); empty leaves it as it is. */
const dollars = z
  .string()
  .trim()
  .refine((text) => text === '' || dollarsToCents(text) !== null, 'Type an amount in dollars, like 28.50');

/** What the people form holds: text as typed, and overtime said the way people say it. */
const userFields = z.object({
  role: z.enum(['technician', 'foreman', 'advisor', 'owner']),
  name: z.string(),
  email: z.string(),
  password: z.string(),
  badge: z.string(),
  pin: z.string(),
  skillLevel: z.string(),
  payType: z.enum(PAY_TYPES),
  flatRate: dollars,
  hourlyRate: dollars,
  guarantee: dollars,
  /** On: the person is paid overtime (not exempt). */
  paidOvertime: z.boolean(),
});
export type UserFields = z.input<typeof userFields>;

const given = (text: string) => (text.trim() ? text.trim() : undefined);

/** Adding a technician sends the first pay rate; an edit leaves rates to the dated pay dialog. */
function toBody(values: z.output<typeof userFields>, withPay: boolean) {
  const tech = values.role === 'technician';
  return {
    name: values.name,
    role: values.role,
    ...(tech
      ? {
          badge: given(values.badge),
          pin: given(values.pin),
          skillLevel: Number(values.skillLevel),
          ...(withPay ? payBody(values).body : {}),
        }
      : { email: given(values.email), password: given(values.password) }),
  };
}

export const addUserFormSchema = checkedAsBody(
  userFields.superRefine((values, ctx) => {
    if (values.role !== 'technician') return;
    for (const [field, message] of Object.entries(missingRates(values)))
      ctx.addIssue({ code: 'custom', path: [field], message });
  }),
  (values) => toBody(values, true),
  createUserSchema,
  PAY_FIELD_OF,
);

/** An edit sends what it holds; an empty PIN or password leaves the old one. */
export const editUserFormSchema = checkedAsBody(
  userFields,
  (values) => toBody(values, false),
  updateUserSchema,
  PAY_FIELD_OF,
);

export const EMPTY_USER: UserFields = {
  role: 'technician',
  name: '',
  email: '',
  password: '',
  badge: '',
  pin: '',
  skillLevel: '3',
  ...EMPTY_PAY,
};

export function fieldsOf(user: UserDto): UserFields {
  return {
    role: user.role === 'display' || user.role === 'kiosk' ? 'advisor' : user.role,
    name: user.name,
    email: user.email ?? '',
    password: '',
    badge: user.badge ?? '',
    pin: '',
    skillLevel: String(user.skillLevel),
    ...payDraftOf(user),
  };
}

/** The newest rate when it starts on a later calendar day in the shop's time zone than `now`. */
export function rateToCome(user: UserDto, now: Date, timeZone: string): DatedPayRate | null {
  const newest = user.payRates[0];
  return newest && newest.effectiveFrom > shopDayKey(now, timeZone) ? newest : null;
}

/** A refused change in the people table, saying whose it was unless the server's words already do. */
export function refusalAbout(user: Pick<UserDto, 'name'>, text: string): string {
  return text.startsWith(user.name) ? text : `${user.name}: ${text}`;
}

/** Where a refused addition of a person is shown: a field, or the form's own message. */
export interface AddRefusal {
  field: 'badge' | 'email' | null;
  message: string;
}

/**
 * A 409 on adding a person. Only the server's "That e-mail or badge is already in use" is about the badge
 * (a technician) or the e-mail (office staff); any other refusal is shown in the server's own words, never
 * passed off as a taken badge.
 */
export function addRefusal(serverMessage: string, technician: boolean): AddRefusal {
  if (/already in use/i.test(serverMessage))
    return technician
      ? { field: 'badge', message: 'Someone already has this badge' }
      : { field: 'email', message: 'Someone already uses this e-mail' };
  return { field: null, message: serverMessage };
}
