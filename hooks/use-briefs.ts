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
import { withTrack } from '@/lib/track-choice';

export const briefKeysRoot = ['briefs'] as const;

export const briefKeys = {
  all: briefKeysRoot,
  district: (code: string, track: string | null = null) => [...briefKeysRoot, 'district', code, track] as const,
  region: (track: string | null = null) => [...briefKeysRoot, 'region', track] as const,
};

export function fetchDistrictBrief(
  code: string,
  track: string | null,
  signal?: AbortSignal,
): Promise<DistrictBriefContent> {
  return apiGet(withTrack(`/api/briefs/district/${encodeURIComponent(code)}`, track), {
    signal,
    schema: DistrictBriefContentSchema,
  });
}

export function fetchRegionBrief(track: string | null, signal?: AbortSignal): Promise<RegionBriefContent> {
  return apiGet(withTrack('/api/briefs/region', track), { signal, schema: RegionBriefContentSchema });
}

/** PDF paths, for links that open the printable file (each for one track; null: the headline track). */
export const briefPdfPath = {
  district: (code: string, track: string | null = null) =>
    withTrack(`/api/briefs/district/${encodeURIComponent(code)}.pdf`, track),
  /** the first page shows every track's standing side by side */
  summary: (code: string) => `/api/briefs/district/${encodeURIComponent(code)}/summary.pdf`,
  region: (track: string | null = null) => withTrack('/api/briefs/region.pdf', track),
};

/** A district's brief from a track's latest published run. */
export function useDistrictBriefQuery(code: string, track: string | null = null) {
  return useQuery({
    queryKey: briefKeys.district(code, track),
    queryFn: ({ signal }) => fetchDistrictBrief(code, track, signal),
    // A brief is the published estimate in words: it changes when a run is published.
    staleTime: STALE_TIMES.estimate,
    enabled: code !== '',
  });
}

/** The region brief from a track's latest published run. */
export function useRegionBriefQuery(track: string | null = null) {
  return useQuery({
    queryKey: briefKeys.region(track),
    queryFn: ({ signal }) => fetchRegionBrief(track, signal),
    staleTime: STALE_TIMES.estimate,
  });
}
