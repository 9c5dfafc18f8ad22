import type { Logger } from '@nestjs/common';

/**
 * Runs background work (a subscription, a ticker, a start-up step) so that a failure is logged and
 * the server keeps serving: one bad row or setting must never stop the shop.
 */
export function keepServing(logger: Logger, what: string, work: () => void): void {
  try {
    work();
  } catch (error) {
    logger.error(
      `${what} failed: ${error instanceof Error ? error.message : String(error)}`,
      (error as Error)?.stack,
    );
  }
}
