import { queryOptions, useQuery } from '@tanstack/react-query';
import type { MailboxMessageView } from '../../../../shared/mail/outbox';
import { apiRequest } from '../../../lib/api-client';
import { mailboxKeys } from './get-mailbox';

export const getMailboxMessage = (id: string) =>
  apiRequest<{ message: MailboxMessageView }>(`/api/mailbox/${encodeURIComponent(id)}`).then((r) => r.message);

export const getMailboxMessageQueryOptions = (id: string) =>
  queryOptions({ queryKey: mailboxKeys.detail(id), queryFn: () => getMailboxMessage(id), staleTime: Infinity, enabled: id.length > 0 });

export const useMailboxMessage = (id: string) => useQuery(getMailboxMessageQueryOptions(id));

export const attachmentUrl = (id: string, index: number) => `/api/mailbox/${encodeURIComponent(id)}/attachments/${index}`;
