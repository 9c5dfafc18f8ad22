import retry from 'retry';

export interface RetryPolicy {
  /** The wait after the first failure. */
  firstMs: number;
  /** The longest wait, however many failures. */
  maxMs: number;
  /** Spread each wait over 1 to 2 times its value (whole ms), so clients that failed together retry apart. */
  jitter?: boolean;
}

/**
 * The one back-off of every durable outbox (mail, webhooks, the kiosk's punches): the wait before the
 * next try after `failedAttempts` failures, doubling from `firstMs` up to `maxMs`. The outboxes keep
 * their due time in storage, so they ask node-retry for the wait rather than let it sleep.
 */
export function retryDelayMs(
  failedAttempts: number,
  { firstMs, maxMs, jitter = false }: RetryPolicy,
): number {
  return retry.createTimeout(Math.max(0, failedAttempts - 1), {
    factor: 2,
    minTimeout: firstMs,
    maxTimeout: maxMs,
    randomize: jitter,
  });
}
