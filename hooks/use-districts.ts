// The districts resource: query keys and queries for GET /api/districts[/:code].
import { useQuery } from '@tanstack/react-query';

import { apiGet } from '@/lib/api-client';
import {
  DistrictDetailResponseSchema,
  DistrictListResponseSchema,
  type DistrictDetailResponse,
  type DistrictListResponse,
} from '@/contracts/districts';
import { earlyJson } from '@/lib/early-fetch';
import { STALE_TIMES } from '@/lib/stale-times';
import { withTrack } from '@/lib/track-choice';

/** Every districts key starts here, so one invalidation (after an upload) refreshes them all. */
export const districtKeysRoot = ['districts'] as const;

export const districtKeys = {
  all: districtKeysRoot,
  /** the list with one track's standings (null: the headline track) */
  list: (track: string | null = null) => [...districtKeysRoot, 'list', track] as const,
  detail: (code: string) => [...districtKeysRoot, 'detail', code] as const,
};

/** The district list's path; the home route also starts it early from the page's <head>. */
export const DISTRICTS_PATH = '/api/districts';

export async function fetchDistricts(track: string | null, signal?: AbortSignal): Promise<DistrictListResponse> {
  // The home route starts this request from the page's <head> (lib/early-fetch.ts).
  const path = withTrack(DISTRICTS_PATH, track);
  const early = await earlyJson(path, DistrictListResponseSchema);
  return early ?? apiGet(path, { signal, schema: DistrictListResponseSchema });
}

export function fetchDistrict(code: string, signal?: AbortSignal): Promise<DistrictDetailResponse> {
  return apiGet(`/api/districts/${encodeURIComponent(code)}`, { signal, schema: DistrictDetailResponseSchema });
}

/**
 * All districts, sorted by name (the server's order), with the standings of `track` (omitted:
 * the headline track); `enabled: false` where no list is shown.
 */
export function useDistrictsQuery(options: { enabled?: boolean; track?: string | null } = {}) {
  const track = options.track ?? null;
  return useQuery({
    queryKey: districtKeys.list(track),
    queryFn: ({ signal }) => fetchDistricts(track, signal),
    staleTime: STALE_TIMES.districtList,
    select: (data) => data.districts,
    enabled: options.enabled ?? true,
  });
}

/** One district's header and yearly series. */
export function useDistrictQuery(code: string) {
  return useQuery({
    queryKey: districtKeys.detail(code),
    queryFn: ({ signal }) => fetchDistrict(code, signal),
    staleTime: STALE_TIMES.districtDetail,
    enabled: code !== '',
  });
}
