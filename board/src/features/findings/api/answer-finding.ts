import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { FindingAnswerBody, FindingAnswerResult } from '@baytime/shared';
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
