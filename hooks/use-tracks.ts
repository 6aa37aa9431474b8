// The tracks resource: GET /api/tracks (signed in); POST /api/tracks, PATCH /api/tracks/:code
// (admin); PUT /api/tracks/:code/spec (staff). And the track chosen on the region view and
// the district card: the URL's ?track= wins over the device's memory, which wins over the
// headline track (lib/track-choice.ts).
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useGlobalSearchParams, useRouter } from '@/lib/router';
import { useCallback, useSyncExternalStore } from 'react';

import {
  TrackAnswerSchema,
  TracksResponseSchema,
  type Track,
  type TrackCreateInput,
  type TrackPatchInput,
} from '@/contracts/tracks';
import { apiGet, apiSend } from '@/lib/api-client';
import { STALE_TIMES } from '@/lib/stale-times';
import { chosenTrack, requestedTrack, shownTracks } from '@/lib/track-choice';
import { rememberTrack, rememberedTrack, subscribeTrackMemory } from '@/lib/track-memory';

import { invalidatePublished } from './use-published';

export const trackKeysRoot = ['tracks'] as const;

export const trackKeys = {
  all: trackKeysRoot,
  list: () => [...trackKeysRoot, 'list'] as const,
};

export function fetchTracks(signal?: AbortSignal) {
  return apiGet('/api/tracks', { signal, schema: TracksResponseSchema });
}

/** Every track, archived ones included (staff screens show them; officials' screens filter them out). */
export function useTracksQuery(options: { enabled?: boolean } = {}) {
  return useQuery({
    queryKey: trackKeys.list(),
    queryFn: ({ signal }) => fetchTracks(signal),
    staleTime: STALE_TIMES.tracks,
    select: (data) => data.tracks,
    enabled: options.enabled ?? true,
  });
}

/** The device's remembered track (null on the server render and when none was chosen). */
export function useRememberedTrack(): string | null {
  return useSyncExternalStore(subscribeTrackMemory, rememberedTrack, () => null);
}

export type TrackChoice = {
  /** the code to send as ?track= (null: the server's headline track) */
  request: string | null;
  /** the track on screen, once the track list is known */
  chosen: Track | null;
  /** open tracks, the headline first; undefined while loading */
  tracks: Track[] | undefined;
  status: 'pending' | 'error' | 'success';
  /** switch track: puts it in the URL and remembers it on this device */
  choose: (code: string) => void;
};

/** The chosen track of the current page (reads the URL anywhere in the tree, the wide list included). */
export function useTrackChoice(options: { enabled?: boolean } = {}): TrackChoice {
  const params = useGlobalSearchParams<{ track?: string | string[] }>();
  const url = typeof params.track === 'string' ? params.track : null;
  const device = useRememberedTrack();
  const query = useTracksQuery(options);
  const list = query.data;
  const router = useRouter();
  const choose = useCallback(
    (code: string) => {
      rememberTrack(code);
      router.setParams({ track: code });
    },
    [router],
  );
  return {
    request: requestedTrack(url, device, list),
    chosen: list ? chosenTrack(url, device, list) : null,
    tracks: list ? shownTracks(list) : undefined,
    status: query.status,
    choose,
  };
}

function useTrackMutation<V>(fn: (input: V) => Promise<unknown>) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: fn,
    onSettled: () => Promise.all([client.invalidateQueries({ queryKey: trackKeysRoot }), invalidatePublished(client)]),
  });
}

/** Admin: a new track watching a saved spec's emissions indicator. */
export function useCreateTrackMutation() {
  return useTrackMutation((input: TrackCreateInput) =>
    apiSend('POST', '/api/tracks', { json: input, schema: TrackAnswerSchema }),
  );
}

/** Admin: rename, pause, resume, archive, or make the headline. */
export function usePatchTrackMutation() {
  return useTrackMutation(({ code, patch }: { code: string; patch: TrackPatchInput }) =>
    apiSend('PATCH', `/api/tracks/${encodeURIComponent(code)}`, { json: patch, schema: TrackAnswerSchema }),
  );
}

/** Staff: the track takes up another saved spec of its indicator (used from its next run). */
export function useTrackSpecMutation() {
  return useTrackMutation(({ code, specId }: { code: string; specId: number }) =>
    apiSend('PUT', `/api/tracks/${encodeURIComponent(code)}/spec`, { json: { specId }, schema: TrackAnswerSchema }),
  );
}
