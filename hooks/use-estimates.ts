// The published-estimate resource of one district: GET /api/districts/:code/estimate and
// /history (the card, its sensitivity strip and its history section).
import { useQuery } from '@tanstack/react-query';

import { apiGet } from '@/lib/api-client';
import { earlyJson } from '@/lib/early-fetch';
import {
  DistrictEstimateResponseSchema,
  DistrictHistoryResponseSchema,
  type DistrictEstimateResponse,
} from '@/contracts/estimates';
import { DISTRICT_CODE_PART } from '@/contracts/patterns';
import { STALE_TIMES } from '@/lib/stale-times';

/** Publishing a run changes every estimate: hooks/use-published.ts invalidates this root with the others it changes. */
export const estimateKeysRoot = ['estimates'] as const;

export const estimateKeys = {
  all: estimateKeysRoot,
  district: (code: string) => [...estimateKeysRoot, 'district', code] as const,
  history: (code: string) => [...estimateKeysRoot, 'history', code] as const,
};

const path = (code: string, tail: string) => `/api/districts/${encodeURIComponent(code)}/${tail}`;

export async function fetchDistrictEstimate(code: string, signal?: AbortSignal): Promise<DistrictEstimateResponse> {
  // The card's route starts this request from the page's <head> (lib/early-fetch.ts).
  const early = await earlyJson(path(code, 'estimate'), DistrictEstimateResponseSchema);
  return early ?? apiGet(path(code, 'estimate'), { signal, schema: DistrictEstimateResponseSchema });
}

/** The card's route, for its inline early request (codes need no escaping: letters, digits, _ and -). */
export const ESTIMATE_ROUTE = new RegExp(`^/district/(${DISTRICT_CODE_PART})/?$`);
export const estimateApiPath = (code: string) => `/api/districts/${code}/estimate`;

/** The district's estimate in the latest published run, with its sensitivity variants. */
export function useDistrictEstimateQuery(code: string) {
  return useQuery({
    queryKey: estimateKeys.district(code),
    queryFn: ({ signal }) => fetchDistrictEstimate(code, signal),
    staleTime: STALE_TIMES.estimate,
    enabled: code !== '',
  });
}

/** The district's estimates across published runs, newest first. */
export function useDistrictHistoryQuery(code: string, enabled = true) {
  return useQuery({
    queryKey: estimateKeys.history(code),
    queryFn: ({ signal }) => apiGet(path(code, 'history'), { signal, schema: DistrictHistoryResponseSchema }),
    staleTime: STALE_TIMES.estimate,
    enabled: enabled && code !== '',
  });
}
