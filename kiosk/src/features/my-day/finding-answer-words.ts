import type { MyJobLine } from '@baytime/shared';

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

/** The notice on My day, from the answer the tablet heard for the line (null: it heard none, e.g. offline). */
export function findingAnswerNotice(line: MyJobLine, answer: FindingAnswer | null): string {
  const where = `RO ${line.repairOrderNumber} line ${line.lineNo}`;
  if (answer === 'approved')
    return `Customer approved the extra work on ${where}: it is added to the RO, and this line is back in your queue.`;
  if (answer === 'declined')
    return `Customer declined the extra work on ${where}: carry on with the rest of the line.`;
  return `Customer answered on ${where}: this line is back in your queue.`;
}
