// The health resource: GET /api/health, for the "server unreachable / database down" notice.
import { useQuery } from '@tanstack/react-query';

import { apiGet } from '@/lib/api-client';
import { HealthResponseSchema } from '@/contracts/districts';
import { STALE_TIMES } from '@/lib/stale-times';

export const healthKeysRoot = ['health'] as const;

export const healthKeys = {
  all: healthKeysRoot,
  status: () => [...healthKeysRoot, 'status'] as const,
};

export function useHealthQuery() {
  return useQuery({
    queryKey: healthKeys.status(),
    queryFn: ({ signal }) =>
      apiGet('/api/health', {
        signal,
        schema: HealthResponseSchema,
      }),
    staleTime: STALE_TIMES.health,
    refetchInterval: STALE_TIMES.health,
  });
}
