import { queryOptions, useQuery } from '@tanstack/react-query';
import type { MailboxListItem } from '../../../../shared/mail/outbox';
import { apiRequest } from '../../../lib/api-client';

export const mailboxKeys = {
  all: ['mailbox'] as const,
  list: () => [...mailboxKeys.all, 'list'] as const,
  detail: (id: string) => [...mailboxKeys.all, 'detail', id] as const,
};

export const getMailbox = () => apiRequest<{ items: MailboxListItem[] }>('/api/mailbox').then((r) => r.items);

// New messages arrive while the page is open (a run finishing at the next table): look again every few seconds.
export const getMailboxQueryOptions = () => queryOptions({ queryKey: mailboxKeys.list(), queryFn: getMailbox, refetchInterval: 5000, retry: false });

export const useMailbox = () => useQuery(getMailboxQueryOptions());
