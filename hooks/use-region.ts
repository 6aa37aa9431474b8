// The region resource: GET /api/region (latest published run, counts per standing, pooled curve).
import { useQuery } from '@tanstack/react-query';

import { apiGet } from '@/lib/api-client';
import { RegionResponseSchema, type PublishedRunMeta, type RegionResponse } from '@/contracts/estimates';
import { STALE_TIMES } from '@/lib/stale-times';
import { withTrack } from '@/lib/track-choice';

import { districtKeys, fetchDistricts } from './use-districts';

export const regionKeysRoot = ['region'] as const;

export const regionKeys = {
  all: regionKeysRoot,
  summary: (track: string | null = null) => [...regionKeysRoot, 'summary', track] as const,
};

export function fetchRegion(track: string | null, signal?: AbortSignal): Promise<RegionResponse> {
  return apiGet(withTrack('/api/region', track), { signal, schema: RegionResponseSchema });
}

/** The region as a track's latest published run sees it (the wide overview: pooled curve, run). */
export function useRegionQuery(options: { enabled?: boolean; track?: string | null } = {}) {
  const track = options.track ?? null;
  return useQuery({
    queryKey: regionKeys.summary(track),
    queryFn: ({ signal }) => fetchRegion(track, signal),
    staleTime: STALE_TIMES.region,
    enabled: options.enabled ?? true,
  });
}

/**
 * The published run the district list's standings come from. It rides on the list's own
 * answer (same key, same fetch), so the phone home and the list make one request, not two.
 */
export function usePublishedRunQuery(options: { enabled?: boolean; track?: string | null } = {}) {
  const track = options.track ?? null;
  return useQuery({
    queryKey: districtKeys.list(track),
    queryFn: ({ signal }) => fetchDistricts(track, signal),
    staleTime: STALE_TIMES.districtList,
    select: (data): PublishedRunMeta | null => data.run ?? null,
    enabled: options.enabled ?? true,
  });
}
