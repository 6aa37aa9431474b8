// The alerts resource: the caller's feed (GET /api/alerts, POST /api/alerts/:id/read) and
// one district's published alerts (GET /api/districts/:code/alerts).
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';

import { apiGet, apiSend } from '@/lib/api-client';
import { AlertFeedResponseSchema, DistrictAlertsResponseSchema, type AlertFeedResponse } from '@/contracts/alerts';
import { STALE_TIMES } from '@/lib/stale-times';

export const alertKeysRoot = ['alerts'] as const;

export const alertKeys = {
  all: alertKeysRoot,
  feed: () => [...alertKeysRoot, 'feed'] as const,
  district: (code: string) => [...alertKeysRoot, 'district', code] as const,
};

/** What the caller's subscriptions cover, newest first, unread marked. */
export function useAlertFeedQuery(enabled = true) {
  return useQuery({
    queryKey: alertKeys.feed(),
    queryFn: ({ signal }) => apiGet('/api/alerts?limit=50', { signal, schema: AlertFeedResponseSchema }),
    staleTime: STALE_TIMES.alertFeed,
    enabled,
  });
}

/** Every alert published for one district. */
export function useDistrictAlertsQuery(code: string, enabled = true) {
  return useQuery({
    queryKey: alertKeys.district(code),
    queryFn: ({ signal }) =>
      apiGet(`/api/districts/${encodeURIComponent(code)}/alerts?limit=20`, {
        signal,
        schema: DistrictAlertsResponseSchema,
      }),
    staleTime: STALE_TIMES.estimate,
    enabled: enabled && code !== '',
  });
}

/** Marks one alert of the feed read; the feed shows it at once and refetches after. */
export function useMarkAlertReadMutation() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (id: number) => apiSend('POST', `/api/alerts/${id}/read`),
    onMutate: (id) => {
      client.setQueryData<AlertFeedResponse>(alertKeys.feed(), (old) =>
        old
          ? {
              alerts: old.alerts.map((a) => (a.id === id ? { ...a, read: true } : a)),
              unread: Math.max(0, old.unread - (old.alerts.some((a) => a.id === id && !a.read) ? 1 : 0)),
            }
          : old,
      );
    },
    onSettled: () => client.invalidateQueries({ queryKey: alertKeys.feed() }),
  });
}
