import type { TimerKind } from '@baytime/shared';

/** What a technician sees to before a timer starts: each kind has its own hazards. */
export interface TimerCaution {
  /** What makes it dangerous, above the checks. */
  heading: string;
  /** Each seen to before starting; none where the job's own cautions cover it. */
  checks: readonly string[];
  /** Where the figures and the steps come from: the maker, never Baytime. */
  source: string;
}

export const TIMER_CAUTIONS: { readonly [K in TimerKind]: TimerCaution } = {
  'warm-up': {
    heading: 'The engine runs in the bay. Before you start:',
    checks: [
      'Exhaust extraction connected to the tailpipe',
      'Parking brake set',
      'Wheels chocked',
      'Lift locks engaged if the vehicle is raised',
      'Stay clear of moving parts: fan, belts, pulleys',
      'Hot fluid and exhaust: keep hands, hoses and leads away',
    ],
    source:
      'Use the temperature from the vehicle maker’s procedure and follow its steps: Baytime does not suggest one.',
  },
  'cool-down': {
    heading: 'Hot fluid and hot parts. While it cools:',
    checks: [
      'Never open the radiator cap or coolant tank while hot: the system is under pressure',
      'Hot fluid and surfaces burn: gloves on, and no bare hands on the engine or exhaust',
      'The cooling fan can start by itself while the engine is hot: keep hands clear',
    ],
    source:
      'Use the temperature from the vehicle maker’s procedure and follow its steps: Baytime does not suggest one.',
  },
  'set-time': {
    heading: 'The job’s own cautions apply while the time runs.',
    checks: [],
    source: 'Take the time from the vehicle maker’s procedure or the product’s instructions.',
  },
};
