import { useQuery } from '@tanstack/react-query';

import { apiRequest } from './api-client';

// GET /api/mailbox: what the local fake SMTP server received (development and tests). The server
// answers 404 when mail goes to a real SMTP server instead.
export interface MailboxMessage {
  id: number;
  to: string;
  subject: string;
  text: string;
  receivedAt: string;
}

export const mailboxKeys = {
  all: ['mailbox'] as const,
  list: () => [...mailboxKeys.all, 'list'] as const,
};

// The outbox worker delivers every few seconds; a manager waiting for an invitation to appear
// should not have to reload.
const POLL_MS = 10_000;

export function useMailboxQuery() {
  return useQuery({
    queryKey: mailboxKeys.list(),
    queryFn: ({ signal }) => apiRequest<{ messages: MailboxMessage[] }>('/api/mailbox', { signal }),
    select: (data) => data.messages,
    refetchInterval: (query) => (query.state.status === 'error' ? false : POLL_MS),
  });
}
