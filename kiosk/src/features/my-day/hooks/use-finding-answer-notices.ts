import { useEffect, useRef, useState } from 'react';
import type { MyJobLine } from '@baytime/shared';
import { onLive } from '@/lib/socket';
import { findingAnswerNotice, linesAnswered, type FindingAnswer } from '../finding-answer-words';

/** An answer heard this long before the day changed still explains the change. */
const ANSWER_FRESH_MS = 60_000;

/**
 * Notices for lines the customer's answer released, kept while the line waits in the queue: the
 * technician sees why a line held for approval is back, and what was answered.
 */
export function useFindingAnswerNotices(lines: readonly MyJobLine[] | undefined): string[] {
  const answers = useRef(new Map<number, { answer: FindingAnswer; note: string | null; at: number }>());
  const previous = useRef<readonly MyJobLine[] | undefined>(undefined);
  const [notices, setNotices] = useState<ReadonlyMap<number, string>>(new Map());

  useEffect(
    () =>
      onLive('finding.answered', ({ jobLineId, note, answer }) => {
        answers.current.set(jobLineId, { answer, note, at: Date.now() });
      }),
    [],
  );

  useEffect(() => {
    const before = previous.current;
    previous.current = lines;
    if (!before || !lines) return;
    const answered = linesAnswered(before, lines);
    const heardFor = (lineId: number) => {
      const heard = answers.current.get(lineId);
      return heard && Date.now() - heard.at < ANSWER_FRESH_MS ? heard : null;
    };
    setNotices((current) => {
      const next = new Map(
        [...current].filter(([id]) => lines.some((line) => line.id === id && line.status === 'queued')),
      );
      for (const line of answered) {
        const heard = heardFor(line.id);
        next.set(line.id, findingAnswerNotice(line, heard?.answer ?? null, heard?.note ?? null));
      }
      return next.size === current.size && answered.length === 0 ? current : next;
    });
  }, [lines]);

  return [...notices.values()];
}
