import { queryOptions, useQuery } from '@tanstack/react-query';
import type { MailboxEntry, Page } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';

/** The newest hundred messages the local test mail server received, newest first. */
export function getMailbox(): Promise<Page<MailboxEntry>> {
  return officeApi.get<Page<MailboxEntry>>('/mailbox?limit=100');
}

export const mailboxQueryOptions = () => queryOptions({ queryKey: ['mailbox'], queryFn: getMailbox });

export function useMailbox() {
  // Mail leaves the outbox in the background: look again every little while.
  return useQuery({ ...mailboxQueryOptions(), refetchInterval: 10_000 });
}
