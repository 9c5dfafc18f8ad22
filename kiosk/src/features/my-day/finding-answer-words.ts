import { oneLine, type MyAnsweredFinding, type MyJobLine } from '@baytime/shared';

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

/**
 * The answers My day shows: those the server listed and those heard live that it does not list yet,
 * one per finding, newest first. The list wins: an answer the office corrected reaches the tablet
 * only through it.
 */
export function mergeAnswers(
  listed: readonly MyAnsweredFinding[],
  heard: readonly MyAnsweredFinding[],
): MyAnsweredFinding[] {
  const byFinding = new Map<number, MyAnsweredFinding>();
  for (const answer of heard) byFinding.set(answer.findingId, answer);
  for (const answer of listed) byFinding.set(answer.findingId, answer);
  return [...byFinding.values()].sort(
    (a, b) => Date.parse(b.answeredAt) - Date.parse(a.answeredAt) || b.findingId - a.findingId,
  );
}

export interface AnswerNotice {
  findingId: number;
  text: string;
}

/** A notice for each answer on a line still on the technician's day that they have not dismissed. */
export function answerNotices(
  lines: readonly MyJobLine[],
  answers: readonly MyAnsweredFinding[],
  dismissed: ReadonlySet<number>,
): AnswerNotice[] {
  const lineById = new Map(lines.map((line) => [line.id, line]));
  return answers.flatMap((answered) => {
    const line = lineById.get(answered.jobLineId);
    return line && !dismissed.has(answered.findingId)
      ? [{ findingId: answered.findingId, text: findingAnswerNotice(line, answered.answer, answered.note) }]
      : [];
  });
}

/**
 * Lines back from waiting for approval that no known answer explains (the hold was released another
 * way, or the answer is older than the server lists): they still get the plain notice.
 */
export function linesUnexplained(
  answered: readonly MyJobLine[],
  answers: readonly MyAnsweredFinding[],
): MyJobLine[] {
  const explained = new Set(answers.map((a) => a.jobLineId));
  return answered.filter((line) => !explained.has(line.id));
}
