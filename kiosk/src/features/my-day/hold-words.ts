import { HOLD_REASON_LABELS, type HoldReason } from '@baytime/shared';

/** What a technician taps to hold a line, in plain words, in the order shops meet them most. */
export const HOLD_CHOICES: readonly { reason: HoldReason; words: string; hint: string }[] = [
  { reason: 'parts', words: 'Waiting for parts', hint: 'Parts ordered or on their way' },
  { reason: 'approval', words: 'Waiting for customer approval', hint: 'The advisor is asking the customer' },
  { reason: 'tooling', words: 'Waiting for a tool', hint: 'A tool or piece of equipment is busy or missing' },
  { reason: 'sublet', words: 'At a sublet shop', hint: 'A part or the vehicle is out with another shop' },
  { reason: 'other', words: HOLD_REASON_LABELS.other, hint: 'Tell the foreman why' },
];
