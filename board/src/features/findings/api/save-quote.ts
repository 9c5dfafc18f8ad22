import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { FindingDto, FindingQuoteBody } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';
import { findingsKey } from './get-findings';

/** The wording the customer reads and the price they are quoted, as the advisor reviewed them. */
export function saveQuote({ id, body }: { id: number; body: FindingQuoteBody }): Promise<FindingDto> {
  return officeApi.patch<FindingDto>(`/findings/${id}/quote`, body);
}

export function useSaveQuote() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: saveQuote,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: findingsKey }),
  });
}
