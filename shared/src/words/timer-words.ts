import type { TimerDto } from '../timers/timers.schema.js';

type TimerState = TimerDto['estimate']['status'];

/**
 * A timer's state in a word or two, for the wall's tile and the kiosk's panel. A warm-up or cool-down
 * whose readings level off short of the target says so: it will not get there at this rate.
 */
export const TIMER_STATE_WORDS: Readonly<Record<TimerState, string>> = {
  running: 'Running',
  done: 'Done',
  reached: 'Reached',
  estimating: 'Estimating',
  'not-enough-readings': 'Estimating',
  'beyond-asymptote': 'Won’t reach target',
  'moving-away': 'Moving away',
};

/** How far to trust a temperature estimate, quietly beside it. */
export const TIMER_CONFIDENCE_WORDS: Readonly<Record<TimerDto['estimate']['confidence'], string>> = {
  low: 'rough estimate',
  medium: 'fair estimate',
  high: 'good estimate',
};

/** A temperature timer whose readings go the wrong way. */
export function movingAwayWords(kind: TimerDto['kind']): string {
  return kind === 'cool-down' ? 'Not cooling' : 'Not warming';
}
