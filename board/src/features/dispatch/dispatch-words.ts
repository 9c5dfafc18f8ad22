import { PERSON_STATUS_WORDS, PRIORITY_WORDS, inSentence, type DispatchLane } from '@baytime/shared';

export const PRIORITY_LABELS = PRIORITY_WORDS;

/** A technician's status after their name in a menu: "skill 3 · on break". */
export const TECH_STATUS_LABELS: Record<DispatchLane['technician']['status'], string> = {
  'on-job': inSentence(PERSON_STATUS_WORDS['on-job']),
  idle: inSentence(PERSON_STATUS_WORDS.idle),
  'on-break': inSentence(PERSON_STATUS_WORDS['on-break']),
  off: inSentence(PERSON_STATUS_WORDS.off),
};
