// The badge and PIN rules without zod: the kiosk's keypad checks them before any schema is loaded.
export const BADGE_RULE = { pattern: /^\d{3,8}$/, message: 'A badge is 3 to 8 digits' } as const;
export const PIN_RULE = { pattern: /^\d{4,8}$/, message: 'A PIN is 4 to 8 digits' } as const;

/** What is wrong with a typed badge number, or null when nothing is. */
export function badgeProblem(badge: string): string | null {
  return BADGE_RULE.pattern.test(badge) ? null : BADGE_RULE.message;
}

/** What is wrong with a typed PIN, or null when nothing is. */
export function pinProblem(pin: string): string | null {
  return PIN_RULE.pattern.test(pin) ? null : PIN_RULE.message;
}
