// The people resource (admin): GET /api/people, POST /api/people/invitations, PATCH /api/people/:id,
// POST /api/people/:id/invitation (re-send), POST /api/people/:id/identity-reset.
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';

import { apiGet, apiSend } from '@/lib/api-client';
import { STALE_TIMES } from '@/lib/stale-times';
import {
  InviteAnswerSchema,
  PeopleResponseSchema,
  PersonAnswerSchema,
  type InviteInput,
  type PersonPatch,
} from '@/contracts/people';

import { auditKeysRoot } from './use-audit';
import { mailboxKeysRoot } from './use-mailbox';

export const peopleKeysRoot = ['people'] as const;

export const peopleKeys = {
  all: peopleKeysRoot,
  list: () => [...peopleKeysRoot, 'list'] as const,
};

export function usePeopleQuery(enabled = true) {
  return useQuery({
    queryKey: peopleKeys.list(),
    queryFn: ({ signal }) => apiGet('/api/people', { signal, schema: PeopleResponseSchema }),
    staleTime: STALE_TIMES.people,
    select: (data) => data.people,
    enabled,
  });
}

/** Invites an address with a role; the server sends the invitation e-mail. */
export function useInviteMutation() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (input: InviteInput) =>
      apiSend('POST', '/api/people/invitations', {
        json: input,
        schema: InviteAnswerSchema,
      }),
    onSettled: () =>
      Promise.all([
        client.invalidateQueries({ queryKey: peopleKeysRoot }),
        client.invalidateQueries({ queryKey: auditKeysRoot }),
        client.invalidateQueries({ queryKey: mailboxKeysRoot }),
      ]),
  });
}

/** Changes a person's role or name, or (de)activates them. */
export function usePersonMutation() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: ({ id, patch }: { id: number; patch: PersonPatch }) =>
      apiSend('PATCH', `/api/people/${id}`, {
        json: patch,
        schema: PersonAnswerSchema,
      }),
    onSettled: () =>
      Promise.all([
        client.invalidateQueries({ queryKey: peopleKeysRoot }),
        client.invalidateQueries({ queryKey: auditKeysRoot }),
      ]),
  });
}

/** Re-sends a pending or lapsed invitation; the server renews its expiry and e-mails it. */
export function useResendInvitationMutation() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (id: number) => apiSend('POST', `/api/people/${id}/invitation`, { schema: InviteAnswerSchema }),
    onSettled: () =>
      Promise.all([
        client.invalidateQueries({ queryKey: peopleKeysRoot }),
        client.invalidateQueries({ queryKey: auditKeysRoot }),
        client.invalidateQueries({ queryKey: mailboxKeysRoot }),
      ]),
  });
}

/** Forgets the Google identity a person is pinned to; their next sign-in pins a new one. */
export function useResetIdentityMutation() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (id: number) => apiSend('POST', `/api/people/${id}/identity-reset`, { schema: PersonAnswerSchema }),
    onSettled: () =>
      Promise.all([
        client.invalidateQueries({ queryKey: peopleKeysRoot }),
        client.invalidateQueries({ queryKey: auditKeysRoot }),
      ]),
  });
}
