// The briefs resource: GET /api/briefs/district/:code and /api/briefs/region — the content
// of a brief (figures rounded for reading, charts as vector scenes) for the print view.
// The PDFs are the same content at /api/briefs/district/<CODE>.pdf and /api/briefs/region.pdf.
import { useQuery } from '@tanstack/react-query';

import { apiGet } from '@/lib/api-client';
import {
  DistrictBriefContentSchema,
  RegionBriefContentSchema,
  type DistrictBriefContent,
  type RegionBriefContent,
} from '@/contracts/briefs';
import { STALE_TIMES } from '@/lib/stale-times';

export const briefKeysRoot = ['briefs'] as const;

export const briefKeys = {
  all: briefKeysRoot,
  district: (code: string) => [...briefKeysRoot, 'district', code] as const,
  region: () => [...briefKeysRoot, 'region'] as const,
};

export function fetchDistrictBrief(code: string, signal?: AbortSignal): Promise<DistrictBriefContent> {
  return apiGet(`/api/briefs/district/${encodeURIComponent(code)}`, { signal, schema: DistrictBriefContentSchema });
}

export function fetchRegionBrief(signal?: AbortSignal): Promise<RegionBriefContent> {
  return apiGet('/api/briefs/region', { signal, schema: RegionBriefContentSchema });
}

/** PDF paths, for links that open the printable file. */
export const briefPdfPath = {
  district: (code: string) => `/api/briefs/district/${encodeURIComponent(code)}.pdf`,
  region: () => '/api/briefs/region.pdf',
};

/** A district's brief from the latest published run. */
export function useDistrictBriefQuery(code: string) {
  return useQuery({
    queryKey: briefKeys.district(code),
    queryFn: ({ signal }) => fetchDistrictBrief(code, signal),
    // A brief is the published estimate in words: it changes when a run is published.
    staleTime: STALE_TIMES.estimate,
    enabled: code !== '',
  });
}

/** The region brief from the latest published run. */
export function useRegionBriefQuery() {
  return useQuery({
    queryKey: briefKeys.region(),
    queryFn: ({ signal }) => fetchRegionBrief(signal),
    staleTime: STALE_TIMES.estimate,
  });
}
