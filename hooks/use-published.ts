// What officials see — the region, every district card and its history, briefs, the district
// list's standings and the alerts — is built from published runs. One function refreshes all
// of it after a change made here (publish, discard, an upload revert, a spec change); one
// watcher learns of a publish made on another device: it asks GET /api/published (the latest
// published run id, never cached) when the app regains focus and once a minute.
import { useQuery, useQueryClient, type QueryClient } from '@tanstack/react-query';
import { useEffect, useRef } from 'react';

import { PublishedResponseSchema, type PublishedResponse } from '@/contracts/districts';
import { apiGet } from '@/lib/api-client';
import { PUBLISHED_POLL_MS, STALE_TIMES } from '@/lib/stale-times';

import { alertKeysRoot } from './use-alerts';
import { briefKeysRoot } from './use-briefs';
import { districtKeysRoot } from './use-districts';
import { estimateKeysRoot } from './use-estimates';
import { regionKeysRoot } from './use-region';

export const publishedKeysRoot = ['published'] as const;

export const publishedKeys = {
  all: publishedKeysRoot,
  latest: () => [...publishedKeysRoot, 'latest'] as const,
};

/** Every query root whose answer a publish changes. */
export const PUBLISHED_ROOTS = [
  estimateKeysRoot,
  regionKeysRoot,
  briefKeysRoot,
  districtKeysRoot,
  alertKeysRoot,
] as const;

export function invalidatePublished(client: QueryClient): Promise<unknown> {
  return Promise.all(PUBLISHED_ROOTS.map((queryKey) => client.invalidateQueries({ queryKey })));
}

export type PublishedAnswer = PublishedResponse;

export function fetchPublished(signal?: AbortSignal): Promise<PublishedAnswer> {
  return apiGet('/api/published', { signal, schema: PublishedResponseSchema });
}

/**
 * Mount once while someone is signed in. The first answer only records the id; a later,
 * different id refreshes every published answer this device holds.
 */
export function usePublishedWatch(enabled: boolean) {
  const client = useQueryClient();
  const latest = useQuery({
    queryKey: publishedKeys.latest(),
    queryFn: ({ signal }) => fetchPublished(signal),
    staleTime: STALE_TIMES.published,
    refetchInterval: PUBLISHED_POLL_MS,
    refetchOnWindowFocus: 'always',
    enabled,
  });
  const seen = useRef<number | null | undefined>(undefined);
  const runId = latest.data?.runId;
  useEffect(() => {
    if (runId === undefined) return;
    if (seen.current !== undefined && seen.current !== runId) void invalidatePublished(client);
    seen.current = runId;
  }, [runId, client]);
}
