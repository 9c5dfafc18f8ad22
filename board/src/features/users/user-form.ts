import { z } from 'zod';
import { createUserSchema, updateUserSchema, type PersonRole, type UserDto } from '@baytime/shared';
import { centsToDollars, dollarsToCents } from '@/lib/form-errors';
import { checkedAsBody } from '@/lib/form';

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
  flatRate: dollars,
  hourlyRate: dollars,
  /** On: the person is paid overtime (not exempt). */
  paidOvertime: z.boolean(),
});
export type UserFields = z.input<typeof userFields>;

const FIELD_OF = { flatRateCents: 'flatRate', hourlyRateCents: 'hourlyRate', overtimeExempt: 'paidOvertime' };

const given = (text: string) => (text.trim() ? text.trim() : undefined);

function toBody(values: z.output<typeof userFields>) {
  const tech = values.role === 'technician';
  return {
    name: values.name,
    role: values.role,
    ...(tech
      ? {
          badge: given(values.badge),
          pin: given(values.pin),
          skillLevel: Number(values.skillLevel),
          flatRateCents: values.flatRate ? dollarsToCents(values.flatRate)! : undefined,
          hourlyRateCents: values.hourlyRate ? dollarsToCents(values.hourlyRate)! : undefined,
          overtimeExempt: !values.paidOvertime,
        }
      : { email: given(values.email), password: given(values.password) }),
  };
}

export const addUserFormSchema = checkedAsBody(userFields, toBody, createUserSchema, FIELD_OF);

/** An edit sends what it holds; an empty PIN or password leaves the old one. */
export const editUserFormSchema = checkedAsBody(userFields, toBody, updateUserSchema, FIELD_OF);

export const EMPTY_USER: UserFields = {
  role: 'technician',
  name: '',
  email: '',
  password: '',
  badge: '',
  pin: '',
  skillLevel: '3',
  flatRate: '',
  hourlyRate: '',
  paidOvertime: true,
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
    flatRate: centsToDollars(user.flatRateCents),
    hourlyRate: centsToDollars(user.hourlyRateCents),
    paidOvertime: !user.overtimeExempt,
  };
}
