import { oneLine, type MyJobLine } from '@baytime/shared';

export type FindingAnswer = 'approved' | 'declined';

const heldForApproval = (line: MyJobLine) => line.status === 'held' && line.holdReason === 'approval';

/**
 * Lines that waited for the customer's answer in `before` and no longer do in `after`: the answer
 * came, and the line is back in the technician's queue.
 */
export function linesAnswered(before: readonly MyJobLine[], after: readonly MyJobLine[]): MyJobLine[] {
  const waited = new Set(before.filter(heldForApproval).map((line) => line.id));
  return after.filter((line) => waited.has(line.id) && !heldForApproval(line));
}

/** The longest finding note a notice quotes: about one line on the tablet. */
export const NOTICE_NOTE_MAX = 60;

/** A finding's note on one line, cut at a word with an ellipsis when it is longer than `max`. */
export const shortNote = (note: string, max = NOTICE_NOTE_MAX) => oneLine(note, max);

/**
 * The notice on My day, from the answer the tablet heard for the line (null: it heard none, e.g.
 * offline) and the note of the finding it answered.
 */
export function findingAnswerNotice(
  line: MyJobLine,
  answer: FindingAnswer | null,
  findingNote: string | null = null,
): string {
  const where = `RO ${line.repairOrderNumber} line ${line.lineNo}`;
  const work = findingNote ? `“${shortNote(findingNote)}”` : 'the extra work';
  if (answer === 'approved')
    return `Customer approved ${work} on ${where}: it is added to the RO, and this line is back in your queue.`;
  if (answer === 'declined')
    return `Customer declined ${work} on ${where}: carry on with the rest of the line.`;
  return `Customer answered on ${where}: this line is back in your queue.`;
}
