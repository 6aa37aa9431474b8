// The districts resource: query keys and queries for GET /api/districts[/:code].
import { useQuery } from '@tanstack/react-query';

import { apiGet } from '@/lib/api-client';
import {
  DistrictDetailResponseSchema,
  DistrictListResponseSchema,
  type DistrictDetailResponse,
  type DistrictListResponse,
} from '@/contracts/districts';
import { STALE_TIMES } from '@/lib/stale-times';

/** Every districts key starts here, so one invalidation (after an upload) refreshes them all. */
export const districtKeysRoot = ['districts'] as const;

export const districtKeys = {
  all: districtKeysRoot,
  /** every district's code and name (the standings come with the region: hooks/use-region.ts) */
  list: () => [...districtKeysRoot, 'list'] as const,
  detail: (code: string) => [...districtKeysRoot, 'detail', code] as const,
};

export const DISTRICTS_PATH = '/api/districts';

export function fetchDistricts(signal?: AbortSignal): Promise<DistrictListResponse> {
  return apiGet(DISTRICTS_PATH, { signal, schema: DistrictListResponseSchema });
}

export function fetchDistrict(code: string, signal?: AbortSignal): Promise<DistrictDetailResponse> {
  return apiGet(`/api/districts/${encodeURIComponent(code)}`, { signal, schema: DistrictDetailResponseSchema });
}

/**
 * Every district's code and name, sorted by name (the server's order), for choosing one by
 * search; `enabled: false` where none is chosen. The region list reads the region's rows.
 */
export function useDistrictsQuery(options: { enabled?: boolean } = {}) {
  return useQuery({
    queryKey: districtKeys.list(),
    queryFn: ({ signal }) => fetchDistricts(signal),
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
