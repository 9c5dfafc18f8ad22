import { formatShopInstant } from '@baytime/shared';
import { ApiError } from '@baytime/shared/client';

/** What the customer reads when the page cannot be shown, in plain words. */
export function unavailableText(error: unknown): { title: string; text: string } {
  if (error instanceof ApiError) {
    if (error.status === 404)
      return {
        title: 'This link does not work',
        text: 'Check that the whole link from the message was opened, or call the shop.',
      };
    if (error.status === 410) return { title: 'This link is closed', text: error.message };
    if (error.status === 429)
      return { title: 'Too many tries', text: 'Wait a few minutes, then open the link again.' };
    if (error.isNetwork)
      return { title: 'No connection', text: 'Check your connection, then open the link again.' };
  }
  return { title: 'Something went wrong', text: 'Open the link again in a moment, or call the shop.' };
}

/** "1.5 h × $135.00" — hours as a person writes them. */
export function hoursText(hours: number): string {
  return `${Number(hours.toFixed(2))} h`;
}

/**
 * "Thu, Dec 3, 5:30 pm (shop time)": a time on the shop's clock, said so, since the customer may read
 * the page in another zone or on a phone set wrong.
 */
export function shopTimeText(instant: string, shopTimeZone: string): string {
  return `${formatShopInstant(new Date(instant), shopTimeZone)} (shop time)`;
}
