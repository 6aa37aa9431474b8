// The people resource (admin): GET /api/people, POST /api/people/invitations, PATCH /api/people/:id.
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';

import { apiGet, apiSend } from '@/lib/api-client';
import { STALE_TIMES } from '@/lib/stale-times';
import type { InviteAnswer, InviteInput, PeopleResponse, Person, PersonPatch } from '@/contracts/people';

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
    queryFn: ({ signal }) =>
      apiGet<PeopleResponse>('/api/people', { signal, accept: (b) => Array.isArray((b as PeopleResponse).people) }),
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
      apiSend<InviteAnswer>('POST', '/api/people/invitations', {
        json: input,
        accept: (b) => typeof b === 'object' && b !== null && 'user' in b,
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
      apiSend<{ person: Person }>('PATCH', `/api/people/${id}`, {
        json: patch,
        accept: (b) => typeof b === 'object' && b !== null && 'person' in b,
      }),
    onSettled: () =>
      Promise.all([
        client.invalidateQueries({ queryKey: peopleKeysRoot }),
        client.invalidateQueries({ queryKey: auditKeysRoot }),
      ]),
  });
}
