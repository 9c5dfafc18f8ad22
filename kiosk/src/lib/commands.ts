import { ApiError } from '@baytime/shared/client';

/**
 * Commands (hold, done, timers, findings) are not punches: they are sent at once or not at all,
 * never queued. Punches tapped before a command go first, so the server sees them in order.
 */
let beforeCommand: () => Promise<unknown> = () => Promise.resolve();
const FLUSH_WAIT_MS = 3_000;

export function setBeforeCommand(flush: () => Promise<unknown>) {
  beforeCommand = flush;
}

export const OFFLINE_MESSAGE = 'No connection: try again when the link is back.';

export async function sendCommand<T>(send: () => Promise<T>): Promise<T> {
  if (typeof navigator !== 'undefined' && navigator.onLine === false)
    throw new ApiError(0, 'The tablet is offline');
  await Promise.race([
    beforeCommand().catch(() => undefined),
    new Promise((resolve) => setTimeout(resolve, FLUSH_WAIT_MS)),
  ]);
  return send();
}

function sentence(text: string): string {
  const trimmed = text.trim();
  if (!trimmed) return trimmed;
  const capital = trimmed[0]!.toUpperCase() + trimmed.slice(1);
  return /[.!?:]$/.test(capital) ? capital : `${capital}.`;
}

/** Why a command did not go through, in words a technician can act on. */
export function commandProblem(error: unknown): string {
  if (!(error instanceof ApiError)) return 'Something went wrong. Try again.';
  if (error.isNetwork) return OFFLINE_MESSAGE;
  if (error.status === 401) return 'Your sign-in ran out. Sign in again.';
  if (error.status >= 500) return 'The shop server had a problem. Try again in a moment.';
  const field = Object.values(error.fieldErrors)[0];
  return sentence(field ?? error.message) || 'The server did not accept it.';
}
