import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Page, TextboxEntry } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';

/** The newest hundred texts the local text box received, newest first. */
export function getTexts(): Promise<Page<TextboxEntry>> {
  return officeApi.get<Page<TextboxEntry>>('/textbox?limit=100');
}

export const textsQueryOptions = () => queryOptions({ queryKey: ['textbox'], queryFn: getTexts });

export function useTexts() {
  // Texts leave the outbox in the background: look again every little while.
  return useQuery({ ...textsQueryOptions(), refetchInterval: 10_000 });
}
