import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ChangeFindingAnswerBody, FindingAnswerBody, FindingAnswerResult } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';
import { findingsKey } from './get-findings';

export function answerFinding({
  id,
  body,
}: {
  id: number;
  body: FindingAnswerBody;
}): Promise<FindingAnswerResult> {
  return officeApi.post<FindingAnswerResult>(`/findings/${id}/answer`, body);
}

export function useAnswerFinding() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: answerFinding,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: findingsKey }),
  });
}

export function changeFindingAnswer({
  id,
  body,
}: {
  id: number;
  body: ChangeFindingAnswerBody;
}): Promise<FindingAnswerResult> {
  return officeApi.patch<FindingAnswerResult>(`/findings/${id}/answer`, body);
}

/** A recorded answer changed, with a reason: the findings and the RO's lines are read again. */
export function useChangeFindingAnswer() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: changeFindingAnswer,
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: findingsKey }),
        queryClient.invalidateQueries({ queryKey: ['repair-order'] }),
      ]),
  });
}
