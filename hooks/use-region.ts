// The region resource: GET /api/region (latest published run, counts per standing, pooled curve).
import { useQuery } from '@tanstack/react-query';

import { apiGet } from '@/lib/api-client';
import type { RegionResponse } from '@/lib/estimate-types';
import { STALE_TIMES } from '@/lib/stale-times';

export const regionKeysRoot = ['region'] as const;

export const regionKeys = {
  all: regionKeysRoot,
  summary: () => [...regionKeysRoot, 'summary'] as const,
};

function isRegionResponse(body: unknown): boolean {
  return typeof body === 'object' && body !== null && Array.isArray((body as RegionResponse).districts) && 'run' in body;
}

export function fetchRegion(signal?: AbortSignal): Promise<RegionResponse> {
  return apiGet<RegionResponse>('/api/region', { signal, accept: isRegionResponse });
}

/** The region as the latest published run sees it. */
export function useRegionQuery() {
  return useQuery({
    queryKey: regionKeys.summary(),
    queryFn: ({ signal }) => fetchRegion(signal),
    staleTime: STALE_TIMES.region,
  });
}
