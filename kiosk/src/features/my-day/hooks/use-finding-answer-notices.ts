import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import type { MyAnsweredFinding, MyDay, MyJobLine } from '@baytime/shared';
import { queryKeys } from '@/lib/query-keys';
import { useSession } from '@/lib/session';
import { onLive } from '@/lib/socket';
import {
  answerNotices,
  findingAnswerNotice,
  linesAnswered,
  linesUnexplained,
  mergeAnswers,
  type AnswerNotice,
} from '../finding-answer-words';

/**
 * Notices for lines back from waiting for approval that no answer on My day explains, kept while the
 * line waits in the queue. The answers themselves show as `useAnsweredFindings` notices.
 */
export function useFindingAnswerNotices(lines: readonly MyJobLine[] | undefined): string[] {
  const queryClient = useQueryClient();
  const technicianId = useSession()?.user.id;
  const previous = useRef<readonly MyJobLine[] | undefined>(undefined);
  const [notices, setNotices] = useState<ReadonlyMap<number, string>>(new Map());

  useEffect(() => {
    const before = previous.current;
    previous.current = lines;
    if (!before || !lines) return;
    const listed =
      technicianId === undefined
        ? []
        : (queryClient.getQueryData<MyDay>(queryKeys.myDay.of(technicianId))?.answeredFindings ?? []);
    const answered = linesUnexplained(linesAnswered(before, lines), listed);
    setNotices((current) => {
      const next = new Map(
        [...current].filter(([id]) => lines.some((line) => line.id === id && line.status === 'queued')),
      );
      for (const line of answered) next.set(line.id, findingAnswerNotice(line, null));
      return next.size === current.size && answered.length === 0 ? current : next;
    });
  }, [lines, queryClient, technicianId]);

  return [...notices.values()];
}

const dismissedKey = (technicianId: number) => `baytime.kiosk.dismissed-answers.${technicianId}`;

function loadDismissed(technicianId: number | undefined): Set<number> {
  if (technicianId === undefined) return new Set();
  try {
    const stored: unknown = JSON.parse(localStorage.getItem(dismissedKey(technicianId)) ?? '[]');
    return new Set(Array.isArray(stored) ? stored.filter((id) => typeof id === 'number') : []);
  } catch {
    return new Set();
  }
}

export interface AnsweredFindings {
  notices: AnswerNotice[];
  dismiss: (findingId: number) => void;
}

/**
 * The customer's answers on the technician's lines: those My day lists (the kiosk signs out after a
 * minute idle, so most answers come while nobody is signed in) and those heard live since. A
 * dismissed one stays dismissed through the next sign-in on this tablet.
 */
export function useAnsweredFindings(
  lines: readonly MyJobLine[],
  listed: readonly MyAnsweredFinding[],
): AnsweredFindings {
  const technicianId = useSession()?.user.id;
  const [heard, setHeard] = useState<readonly MyAnsweredFinding[]>([]);
  const [dismissed, setDismissed] = useState(() => loadDismissed(technicianId));

  useEffect(
    () =>
      onLive('finding.answered', ({ findingId, jobLineId, note, answer }) => {
        setHeard((current) => [
          ...current.filter((a) => a.findingId !== findingId),
          { findingId, jobLineId, note, answer, answeredAt: new Date().toISOString() },
        ]);
      }),
    [],
  );

  const answers = useMemo(() => mergeAnswers(listed, heard), [listed, heard]);
  const dismiss = useCallback(
    (findingId: number) => {
      // Only answers still shown are kept, so the stored list stays as short as the day's answers.
      const next = new Set([...dismissed, findingId].filter((id) => answers.some((a) => a.findingId === id)));
      setDismissed(next);
      if (technicianId === undefined) return;
      try {
        localStorage.setItem(dismissedKey(technicianId), JSON.stringify([...next]));
      } catch {
        // only a nicety: at worst the notice shows again at the next sign-in
      }
    },
    [answers, dismissed, technicianId],
  );

  return { notices: answerNotices(lines, answers, dismissed), dismiss };
}
