// The districts resource: query keys and queries for GET /api/districts[/:code].
import { useQuery } from '@tanstack/react-query';

import { apiGet } from '@/lib/api-client';
import type { DistrictDetailResponse, DistrictListResponse } from '@/contracts/districts';
import { earlyJson } from '@/lib/early-fetch';
import { STALE_TIMES } from '@/lib/stale-times';

/** Every districts key starts here, so one invalidation (after an upload) refreshes them all. */
export const districtKeysRoot = ['districts'] as const;

export const districtKeys = {
  all: districtKeysRoot,
  list: () => [...districtKeysRoot, 'list'] as const,
  detail: (code: string) => [...districtKeysRoot, 'detail', code] as const,
};

function isListResponse(body: unknown): boolean {
  return typeof body === 'object' && body !== null && Array.isArray((body as DistrictListResponse).districts);
}

function isDetailResponse(body: unknown): boolean {
  if (typeof body !== 'object' || body === null) return false;
  const b = body as DistrictDetailResponse;
  return typeof b.district === 'object' && b.district !== null && Array.isArray(b.series) && Array.isArray(b.indicators);
}

export async function fetchDistricts(signal?: AbortSignal): Promise<DistrictListResponse> {
  // The home route starts this request from the page's <head> (lib/early-fetch.ts).
  const early = await earlyJson<DistrictListResponse>('/api/districts', isListResponse);
  return early ?? apiGet<DistrictListResponse>('/api/districts', { signal, accept: isListResponse });
}

export function fetchDistrict(code: string, signal?: AbortSignal): Promise<DistrictDetailResponse> {
  return apiGet<DistrictDetailResponse>(`/api/districts/${encodeURIComponent(code)}`, {
    signal,
    accept: isDetailResponse,
  });
}

/** All districts, sorted by name (the server's order); `enabled: false` where no list is shown. */
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
