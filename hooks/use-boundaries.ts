// The region's district boundaries: GET /api/boundaries (simplified GeoJSON; the server
// answers it with an ETag, so a refetch after the stale time costs a 304).
import { useQuery } from '@tanstack/react-query';

import { BoundaryCollectionSchema } from '@/contracts/boundaries';
import { apiGet } from '@/lib/api-client';
import type { BoundaryCollection } from '@/lib/map-scene';
import { STALE_TIMES } from '@/lib/stale-times';

export const boundaryKeysRoot = ['boundaries'] as const;

export const boundaryKeys = {
  all: boundaryKeysRoot,
  current: (detail: 'phone' | 'print') => [...boundaryKeysRoot, 'current', detail] as const,
  /** the versions history (hooks/use-boundary-uploads.ts) */
  versions: () => [...boundaryKeysRoot, 'versions'] as const,
};

export function fetchBoundaries(detail: 'phone' | 'print', signal?: AbortSignal): Promise<BoundaryCollection> {
  // The contract checks the collection's frame and keeps every member; the geometry's own
  // shape is read by lib/map-scene.ts, which is typed for it.
  return apiGet(`/api/boundaries?detail=${detail}`, {
    signal,
    schema: BoundaryCollectionSchema,
  }) as Promise<unknown> as Promise<BoundaryCollection>;
}

/** The current boundaries (boundaries change only when an analyst loads new ones). */
export function useBoundariesQuery(options: { detail?: 'phone' | 'print'; enabled?: boolean } = {}) {
  const detail = options.detail ?? 'phone';
  return useQuery({
    queryKey: boundaryKeys.current(detail),
    queryFn: ({ signal }) => fetchBoundaries(detail, signal),
    staleTime: STALE_TIMES.districtList,
    enabled: options.enabled ?? true,
  });
}
