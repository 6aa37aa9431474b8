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
import { withTrack } from '@/lib/track-choice';

/** Publishing a run changes every estimate: hooks/use-published.ts invalidates this root with the others it changes. */
export const estimateKeysRoot = ['estimates'] as const;

export const estimateKeys = {
  all: estimateKeysRoot,
  district: (code: string, track: string | null = null) => [...estimateKeysRoot, 'district', code, track] as const,
  history: (code: string, track: string | null = null) => [...estimateKeysRoot, 'history', code, track] as const,
};

const path = (code: string, tail: string, track: string | null) =>
  withTrack(`/api/districts/${encodeURIComponent(code)}/${tail}`, track);

export async function fetchDistrictEstimate(
  code: string,
  track: string | null,
  signal?: AbortSignal,
): Promise<DistrictEstimateResponse> {
  // The card's route starts this request from the page's <head> (lib/early-fetch.ts).
  const early = await earlyJson(path(code, 'estimate', track), DistrictEstimateResponseSchema);
  return early ?? apiGet(path(code, 'estimate', track), { signal, schema: DistrictEstimateResponseSchema });
}

/** The card's route, for its inline early request (codes need no escaping: letters, digits, _ and -). */
export const ESTIMATE_ROUTE = new RegExp(`^/district/(${DISTRICT_CODE_PART})/?$`);
export const estimateApiPath = (code: string) => `/api/districts/${code}/estimate`;

/** The district's estimate in a track's latest published run, with its sensitivity variants and every track's row. */
export function useDistrictEstimateQuery(code: string, track: string | null = null) {
  return useQuery({
    queryKey: estimateKeys.district(code, track),
    queryFn: ({ signal }) => fetchDistrictEstimate(code, track, signal),
    staleTime: STALE_TIMES.estimate,
    enabled: code !== '',
  });
}

/** The district's estimates across a track's published runs, newest first. */
export function useDistrictHistoryQuery(code: string, enabled = true, track: string | null = null) {
  return useQuery({
    queryKey: estimateKeys.history(code, track),
    queryFn: ({ signal }) => apiGet(path(code, 'history', track), { signal, schema: DistrictHistoryResponseSchema }),
    staleTime: STALE_TIMES.estimate,
    enabled: enabled && code !== '',
  });
}
