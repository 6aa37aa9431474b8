// The subscriptions resource: GET/POST /api/subscriptions, DELETE /api/subscriptions/:id.
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';

import { apiGet, apiSend } from '@/lib/api-client';
import {
  SubscriptionAnswerSchema,
  SubscriptionsResponseSchema,
  type Subscription,
  type SubscriptionInput,
} from '@/contracts/alerts';
import { STALE_TIMES } from '@/lib/stale-times';

import { alertKeys } from './use-alerts';

export const subscriptionKeysRoot = ['subscriptions'] as const;

export const subscriptionKeys = {
  all: subscriptionKeysRoot,
  own: () => [...subscriptionKeysRoot, 'own'] as const,
};

export function useSubscriptionsQuery() {
  return useQuery({
    queryKey: subscriptionKeys.own(),
    queryFn: ({ signal }) =>
      apiGet('/api/subscriptions', {
        signal,
        schema: SubscriptionsResponseSchema,
      }),
    staleTime: STALE_TIMES.subscriptions,
    select: (data) => data.subscriptions,
  });
}

/** How one district is covered by the caller's subscriptions. */
export function coverageOf(subscriptions: Subscription[], code: string) {
  const own = subscriptions.filter((s) => s.scope === 'district' && s.districtCodes.includes(code));
  const viaSet = subscriptions.some((s) => s.scope === 'districts' && s.districtCodes.includes(code));
  const viaRegion = subscriptions.some((s) => s.scope === 'region');
  return { own, viaSet, viaRegion };
}

/** Subscribe to, or stop, instant alerts of every kind for one district. */
export function useDistrictSubscriptionMutation(code: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: async (action: { subscribe: true } | { subscribe: false; ids: number[] }) => {
      if (action.subscribe) {
        // A district followed from its card: every track, including tracks created later.
        const input: SubscriptionInput = {
          tracks: 'all',
          scope: 'district',
          districtCodes: [code],
          kinds: [],
          delivery: 'instant',
          attachBrief: false,
        };
        await apiSend('POST', '/api/subscriptions', { json: input });
      } else {
        for (const id of action.ids) await apiSend('DELETE', `/api/subscriptions/${id}`);
      }
    },
    onSettled: async () => {
      await client.invalidateQueries({ queryKey: subscriptionKeys.all });
      await client.invalidateQueries({ queryKey: alertKeys.feed() });
    },
  });
}

/** Any subscription: one district, a set, or the whole region, with its kinds and delivery. */
export function useSubscribeMutation() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (input: SubscriptionInput) =>
      apiSend('POST', '/api/subscriptions', {
        json: input,
        schema: SubscriptionAnswerSchema,
      }),
    onSettled: async () => {
      await client.invalidateQueries({ queryKey: subscriptionKeys.all });
      await client.invalidateQueries({ queryKey: alertKeys.feed() });
    },
  });
}

/** Removes one of the caller's subscriptions. */
export function useUnsubscribeMutation() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (id: number) => apiSend('DELETE', `/api/subscriptions/${id}`),
    onSettled: async () => {
      await client.invalidateQueries({ queryKey: subscriptionKeys.all });
      await client.invalidateQueries({ queryKey: alertKeys.feed() });
    },
  });
}
