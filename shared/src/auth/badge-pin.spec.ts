import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { badgeLoginSchema } from './auth.schema.js';
import { badgeProblem, pinProblem } from './badge-pin.js';

const firstMessage = (result: { error?: { issues: { message: string }[] } }) =>
  result.error?.issues[0]?.message ?? null;

describe('badge and PIN checks without zod', () => {
  it('take badges of 3 to 8 digits and PINs of 4 to 8', () => {
    expect(badgeProblem('123')).toBeNull();
    expect(badgeProblem('12345678')).toBeNull();
    expect(badgeProblem('12')).toBe('A badge is 3 to 8 digits');
    expect(badgeProblem('123456789')).toBe('A badge is 3 to 8 digits');
    expect(badgeProblem('12a4')).toBe('A badge is 3 to 8 digits');
    expect(pinProblem('1234')).toBeNull();
    expect(pinProblem('123')).toBe('A PIN is 4 to 8 digits');
  });

  it('say what the server says of the same badge and PIN', () => {
    const typed = fc.oneof(fc.stringMatching(/^\d{0,10}$/), fc.string({ maxLength: 10 }));
    fc.assert(
      fc.property(typed, typed, (badge, pin) => {
        const server = firstMessage(badgeLoginSchema.safeParse({ badge, pin }));
        expect(badgeProblem(badge) ?? pinProblem(pin)).toBe(server);
      }),
    );
  });
});
