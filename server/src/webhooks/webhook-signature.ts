import { createHmac, timingSafeEqual } from 'node:crypto';

export const SIGNATURE_HEADER = 'x-baytime-signature';
export const TIMESTAMP_HEADER = 'x-baytime-timestamp';
export const EVENT_HEADER = 'x-baytime-event';
export const DELIVERY_HEADER = 'x-baytime-delivery';

/**
 * `v1=` and the hex HMAC-SHA256, under the endpoint's secret, of `${timestamp}.${body}`: the receiver
 * checks the body came from this shop, and refuses an old timestamp so a captured delivery cannot be
 * replayed later.
 */
export function signWebhook(secret: string, timestamp: number, body: string): string {
  return `v1=${createHmac('sha256', secret).update(`${timestamp}.${body}`).digest('hex')}`;
}

/** What a receiver does (the tests' receiver and the README's example both use it). */
export function verifyWebhook(secret: string, timestamp: string, body: string, signature: string): boolean {
  const expected = Buffer.from(signWebhook(secret, Number(timestamp), body));
  const given = Buffer.from(signature);
  return /^\d+$/.test(timestamp) && given.length === expected.length && timingSafeEqual(given, expected);
}
