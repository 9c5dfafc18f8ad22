/**
 * Screens with work in progress (a finding with photos from the camera, which takes the tablet
 * away from the page) ask for a longer idle time before the kiosk signs the technician out.
 */
const holds = new Map<symbol, number>();

/** Asks for at least `seconds` of idle time until the returned release is called. */
export function holdIdle(seconds: number): () => void {
  const key = Symbol('idle-hold');
  holds.set(key, seconds);
  return () => void holds.delete(key);
}

/** The longest idle time asked for right now, or 0. */
export function idleHoldSeconds(): number {
  let longest = 0;
  for (const seconds of holds.values()) longest = Math.max(longest, seconds);
  return longest;
}
