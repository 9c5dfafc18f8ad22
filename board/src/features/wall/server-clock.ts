/**
 * The board's clock: every timer and running total ticks from the server's time, never the TV's own
 * clock, which may be minutes off. The offset is taken each time a snapshot arrives.
 */
export interface ServerClock {
  /** Server time minus local time, in milliseconds, when the last snapshot arrived. */
  offsetMs: number;
}

export function clockFromServerTime(serverTime: string, receivedAtLocalMs: number): ServerClock {
  const server = Date.parse(serverTime);
  return { offsetMs: Number.isFinite(server) ? server - receivedAtLocalMs : 0 };
}

/** The server's "now" for a local timestamp. */
export function serverNow(clock: ServerClock, localMs: number): number {
  return localMs + clock.offsetMs;
}

/** Whole seconds from an ISO instant to `nowMs`, never negative (a clock a little behind is no news). */
export function secondsSince(iso: string | null, nowMs: number): number {
  if (!iso) return 0;
  const then = Date.parse(iso);
  return Number.isFinite(then) ? Math.max(0, Math.floor((nowMs - then) / 1000)) : 0;
}

/** Whole seconds from `nowMs` until an ISO instant, never negative; null when there is no instant. */
export function secondsUntil(iso: string | null, nowMs: number): number | null {
  if (!iso) return null;
  const then = Date.parse(iso);
  return Number.isFinite(then) ? Math.max(0, Math.ceil((then - nowMs) / 1000)) : null;
}
