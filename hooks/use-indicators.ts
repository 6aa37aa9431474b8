// The indicator catalogue: GET /api/indicators (codes, names, units, derivations, coverage).
import { useQuery } from '@tanstack/react-query';

import { apiGet } from '@/lib/api-client';
import { STALE_TIMES } from '@/lib/stale-times';
import { IndicatorsResponseSchema } from '@/contracts/settings';

export const indicatorKeysRoot = ['indicators'] as const;

export const indicatorKeys = {
  all: indicatorKeysRoot,
  list: () => [...indicatorKeysRoot, 'list'] as const,
};

export function useIndicatorsQuery(enabled = true) {
  return useQuery({
    queryKey: indicatorKeys.list(),
    queryFn: ({ signal }) =>
      apiGet('/api/indicators', {
        signal,
        schema: IndicatorsResponseSchema,
      }),
    staleTime: STALE_TIMES.indicators,
    select: (data) => data.indicators,
    enabled,
  });
}
