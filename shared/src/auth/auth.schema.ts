import { z } from 'zod';
import { BADGE_RULE, PIN_RULE } from './badge-pin.js';

export { badgeProblem, BADGE_RULE, pinProblem, PIN_RULE } from './badge-pin.js';

export const ROLES = ['owner', 'foreman', 'advisor', 'technician', 'display', 'kiosk'] as const;
export type Role = (typeof ROLES)[number];
/** Paired devices, not people: a wall screen (`display`) and a technicians' tablet (`kiosk`). */
export const DEVICE_ROLES = ['display', 'kiosk'] as const satisfies readonly Role[];
export type DeviceRole = (typeof DEVICE_ROLES)[number];
export type PersonRole = Exclude<Role, DeviceRole>;
export const OFFICE_ROLES = ['owner', 'foreman', 'advisor'] as const satisfies readonly Role[];

export const loginSchema = z.object({
  email: z
    .email({
      error: (issue) => (issue.input ? 'That is not an e-mail address' : 'Enter your e-mail address'),
    })
    .max(200),
  password: z.string().min(1, 'Enter your password').max(200),
});
export type LoginBody = z.infer<typeof loginSchema>;

export const badgeLoginSchema = z.object({
  badge: z.string().regex(BADGE_RULE.pattern, BADGE_RULE.message),
  pin: z.string().regex(PIN_RULE.pattern, PIN_RULE.message),
});
export type BadgeLoginBody = z.infer<typeof badgeLoginSchema>;

export const pairScreenSchema = z.object({
  code: z
    .string()
    .trim()
    .toUpperCase()
    .regex(/^[A-Z0-9]{6}$/, 'A pairing code is 6 letters or digits'),
});
export type PairScreenBody = z.infer<typeof pairScreenSchema>;

export interface AuthUser {
  id: number;
  name: string;
  role: Role;
}

export interface SignInAnswer {
  accessToken: string;
  user: AuthUser;
}

/**
 * An office sign-in's answer, which also says until when the sign-in is renewed (ISO): the token in
 * hand at that time is its last, and the office warns before that token runs out.
 */
export interface OfficeSignInAnswer extends SignInAnswer {
  renewableUntil: string;
}
