import { queryOptions, useQuery } from '@tanstack/react-query';
import type { MailboxEntry } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';

/** What the local test mail server received, newest first. */
export function getMailbox(): Promise<MailboxEntry[]> {
  return officeApi.get<MailboxEntry[]>('/mailbox');
}

export const mailboxQueryOptions = () => queryOptions({ queryKey: ['mailbox'], queryFn: getMailbox });

export function useMailbox() {
  // Mail leaves the outbox in the background: look again every little while.
  return useQuery({ ...mailboxQueryOptions(), refetchInterval: 10_000 });
}
