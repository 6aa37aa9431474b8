// The demo mailbox (admin, demo and test mode): GET /api/mailbox, what the local catcher received.
import { useQuery } from '@tanstack/react-query';

import { apiGet } from '@/lib/api-client';
import { STALE_TIMES } from '@/lib/stale-times';
import { MailboxResponseSchema } from '@/contracts/people';

export const mailboxKeysRoot = ['mailbox'] as const;

export const mailboxKeys = {
  all: mailboxKeysRoot,
  list: (to: string) => [...mailboxKeysRoot, 'list', to] as const,
};

export function useMailboxQuery(to: string, enabled = true) {
  const q = new URLSearchParams({ limit: '100' });
  if (to.trim()) q.set('to', to.trim());
  return useQuery({
    queryKey: mailboxKeys.list(to.trim()),
    queryFn: ({ signal }) =>
      apiGet(`/api/mailbox?${q.toString()}`, {
        signal,
        schema: MailboxResponseSchema,
      }),
    staleTime: STALE_TIMES.mailbox,
    select: (data) => data.messages,
    enabled,
  });
}
