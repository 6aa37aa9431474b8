// The region resource: GET /api/region (latest published run, counts per standing, pooled curve).
import { useQuery } from '@tanstack/react-query';

import { apiGet } from '@/lib/api-client';
import {
  RegionResponseSchema,
  type PublishedRunMeta,
  type RegionDistrict,
  type RegionResponse,
} from '@/contracts/estimates';
import { earlyJson } from '@/lib/early-fetch';
import { STALE_TIMES } from '@/lib/stale-times';
import { withTrack } from '@/lib/track-choice';

export const regionKeysRoot = ['region'] as const;

export const regionKeys = {
  all: regionKeysRoot,
  summary: (track: string | null = null) => [...regionKeysRoot, 'summary', track] as const,
};

/** The region's path; the home route also starts it early from the page's <head>. */
export const REGION_PATH = '/api/region';

export async function fetchRegion(track: string | null, signal?: AbortSignal): Promise<RegionResponse> {
  // The home route starts this request from the page's <head> (lib/early-fetch.ts).
  const path = withTrack(REGION_PATH, track);
  const early = await earlyJson(path, RegionResponseSchema);
  return early ?? apiGet(path, { signal, schema: RegionResponseSchema });
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
 * The region's districts with their standings in a track's run (the list, the map, the
 * counts). They ride on the region answer (same key, same fetch): one request for the
 * overview, the list and the run line.
 */
export function useRegionDistrictsQuery(options: { enabled?: boolean; track?: string | null } = {}) {
  const track = options.track ?? null;
  return useQuery({
    queryKey: regionKeys.summary(track),
    queryFn: ({ signal }) => fetchRegion(track, signal),
    staleTime: STALE_TIMES.region,
    select: (data): RegionDistrict[] => data.districts,
    enabled: options.enabled ?? true,
  });
}

/** The published run the region's standings come from (the same answer as the list's). */
export function usePublishedRunQuery(options: { enabled?: boolean; track?: string | null } = {}) {
  const track = options.track ?? null;
  return useQuery({
    queryKey: regionKeys.summary(track),
    queryFn: ({ signal }) => fetchRegion(track, signal),
    staleTime: STALE_TIMES.region,
    select: (data): PublishedRunMeta | null => data.run ?? null,
    enabled: options.enabled ?? true,
  });
}
