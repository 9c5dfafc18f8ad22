import { ApiError } from '@baytime/shared/client';

export type FieldErrors = Record<string, string | undefined>;

/** First message per top-level field of a failed zod parse (or a server 400 with the same paths). */
export function issuesToFieldErrors(
  issues: readonly { path: readonly PropertyKey[]; message: string }[],
): FieldErrors {
  const errors: FieldErrors = {};
  for (const issue of issues) {
    const key = issue.path.map(String).join('.');
    errors[key] ??= issue.message;
  }
  return errors;
}

/** What to say about a failed save that is not one field's fault. */
export function formErrorText(error: unknown): string {
  if (error instanceof ApiError) {
    if (error.isNetwork) return 'No connection to the shop server. Nothing was saved; try again.';
    if (error.status === 403) return 'Your role cannot change this.';
    return error.message || 'The server refused the change.';
  }
  return 'Something went wrong. Nothing was saved.';
}

/** Dollars typed by a person ("28.5", "$28.50") to cents; null when it is not an amount. */
export function dollarsToCents(text: string): number | null {
  const cleaned = text.trim().replace(/^\$/, '').replace(/,/g, '');
  if (!/^\d+(\.\d{0,2})?$/.test(cleaned)) return null;
  return Math.round(parseFloat(cleaned) * 100);
}

export function centsToDollars(cents: number): string {
  return (cents / 100).toFixed(2);
}

const money = new Intl.NumberFormat('en-US', { style: 'currency', currency: 'USD' });

export function formatMoney(cents: number): string {
  return money.format(cents / 100);
}
