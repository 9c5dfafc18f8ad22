import { queryOptions, useQuery } from '@tanstack/react-query';
import type { MailboxMessage } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';

export function getMailMessage(id: string): Promise<MailboxMessage> {
  return officeApi.get<MailboxMessage>(`/mailbox/${encodeURIComponent(id)}`);
}

export const mailMessageQueryOptions = (id: string) =>
  queryOptions({
    queryKey: queryKeys.mailbox.message(id),
    queryFn: () => getMailMessage(id),
    // A received message never changes.
    staleTime: Infinity,
  });

export function useMailMessage(id: string | null) {
  return useQuery({ ...mailMessageQueryOptions(id ?? ''), enabled: id !== null });
}
