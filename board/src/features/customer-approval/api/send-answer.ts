import { useMutation } from '@tanstack/react-query';
import type { PublicApprovalAnswerBody, PublicApprovalResult } from '@baytime/shared';
import { publicApi } from '@/lib/api-client';

export function sendAnswer({
  token,
  body,
}: {
  token: string;
  body: PublicApprovalAnswerBody;
}): Promise<PublicApprovalResult> {
  return publicApi.post<PublicApprovalResult>(`/public/approvals/${encodeURIComponent(token)}`, body);
}

export function useSendAnswer() {
  return useMutation({ mutationFn: sendAnswer });
}
