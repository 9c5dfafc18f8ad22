import type { Logger } from '@nestjs/common';

/**
 * Runs background work (a subscription, a ticker, a start-up step), at once or in steps that end with
 * a promise, so that a failure is logged and the server keeps serving: one bad row or setting must
 * never stop the shop.
 */
export function keepServing(logger: Logger, what: string, work: () => void | Promise<void>): void {
  const failed = (error: unknown) =>
    logger.error(
      `${what} failed: ${error instanceof Error ? error.message : String(error)}`,
      (error as Error)?.stack,
    );
  try {
    const steps = work();
    if (steps instanceof Promise) steps.catch(failed);
  } catch (error) {
    failed(error);
  }
}
