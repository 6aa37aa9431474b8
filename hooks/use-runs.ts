// The runs resource: GET /api/runs[/:id], /review, /districts/:code; POST /api/runs (start),
// /publish, /discard; PUT a district's note. A run that is queued or running is polled.
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';

import { apiGet, apiSend } from '@/lib/api-client';
import { RUN_POLL_MS, STALE_TIMES } from '@/lib/stale-times';
import { withTrack } from '@/lib/track-choice';
import {
  DistrictReviewSchema,
  PublishAnswerSchema,
  ReviewResponseSchema,
  RunListResponseSchema,
  RunStartedSchema,
  RunViewSchema,
  type RunState,
} from '@/contracts/runs';

import { invalidatePublished } from './use-published';

export const runKeysRoot = ['runs'] as const;

export const runKeys = {
  all: runKeysRoot,
  list: () => [...runKeysRoot, 'list'] as const,
  detail: (id: number) => [...runKeysRoot, 'detail', id] as const,
  review: (id: number) => [...runKeysRoot, 'review', id] as const,
  district: (id: number, code: string) => [...runKeysRoot, 'district', id, code] as const,
};

/** States whose estimates are not written yet: keep asking. */
export const ACTIVE_RUN_STATES: readonly RunState[] = ['queued', 'running'];
/** States whose estimates can be read. */
export const REVIEWABLE_RUN_STATES: readonly RunState[] = ['in_review', 'published', 'discarded'];

/** The recent runs, of one track when `track` is given (the list key is their common prefix). */
export function useRunsQuery(enabled = true, track: string | null = null) {
  return useQuery({
    queryKey: [...runKeys.list(), track] as const,
    queryFn: ({ signal }) => apiGet(withTrack('/api/runs?limit=30', track), { signal, schema: RunListResponseSchema }),
    staleTime: STALE_TIMES.runs,
    select: (data) => data.runs,
    // While a run in the list is working, its state changes by itself.
    refetchInterval: (query) =>
      query.state.data?.runs.some((r) => ACTIVE_RUN_STATES.includes(r.state)) ? RUN_POLL_MS * 2 : false,
    enabled,
  });
}

export function useRunQuery(id: number) {
  return useQuery({
    queryKey: runKeys.detail(id),
    queryFn: ({ signal }) => apiGet(`/api/runs/${id}`, { signal, schema: RunViewSchema }),
    staleTime: STALE_TIMES.runDetail,
    refetchInterval: (query) =>
      query.state.data && ACTIVE_RUN_STATES.includes(query.state.data.state) ? RUN_POLL_MS : false,
    enabled: id > 0,
  });
}

export function useRunReviewQuery(id: number, enabled: boolean) {
  return useQuery({
    queryKey: runKeys.review(id),
    queryFn: ({ signal }) =>
      apiGet(`/api/runs/${id}/review`, {
        signal,
        schema: ReviewResponseSchema,
      }),
    staleTime: STALE_TIMES.runReview,
    enabled: enabled && id > 0,
  });
}

export function useRunDistrictQuery(id: number, code: string | null, enabled: boolean) {
  return useQuery({
    queryKey: runKeys.district(id, code ?? ''),
    queryFn: ({ signal }) =>
      apiGet(`/api/runs/${id}/districts/${encodeURIComponent(code ?? '')}`, {
        signal,
        schema: DistrictReviewSchema,
      }),
    staleTime: STALE_TIMES.runReview,
    enabled: enabled && id > 0 && !!code,
  });
}

/** "Re-estimate now": queues a run of one track ('all': one per active track; none: the headline track). */
export function useStartRunMutation() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (track?: string) =>
      apiSend('POST', '/api/runs', {
        json: track ? { track } : {},
        schema: RunStartedSchema,
      }),
    onSettled: () => client.invalidateQueries({ queryKey: runKeys.list() }),
  });
}

function useAfterRunChange() {
  const client = useQueryClient();
  return (id: number) =>
    Promise.all([
      client.invalidateQueries({ queryKey: runKeys.detail(id) }),
      client.invalidateQueries({ queryKey: runKeys.list() }),
      client.invalidateQueries({ queryKey: runKeys.review(id) }),
      // Publishing (or discarding) changes what officials see: every card, the region, briefs, alerts.
      invalidatePublished(client),
    ]);
}

export function usePublishRunMutation() {
  const refresh = useAfterRunChange();
  return useMutation({
    mutationFn: (id: number) => apiSend('POST', `/api/runs/${id}/publish`, { schema: PublishAnswerSchema }),
    onSettled: (_data, _error, id) => refresh(id),
  });
}

export function useDiscardRunMutation() {
  const refresh = useAfterRunChange();
  return useMutation({
    mutationFn: (id: number) => apiSend('POST', `/api/runs/${id}/discard`),
    onSettled: (_data, _error, id) => refresh(id),
  });
}

/** Attaches (or replaces) a district's note for the next brief. */
export function useRunNoteMutation() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: ({ id, code, note }: { id: number; code: string; note: string }) =>
      apiSend('PUT', `/api/runs/${id}/districts/${encodeURIComponent(code)}/note`, { json: { note } }),
    onSettled: (_data, _error, { id, code }) =>
      Promise.all([
        client.invalidateQueries({ queryKey: runKeys.district(id, code) }),
        client.invalidateQueries({ queryKey: runKeys.review(id) }),
      ]),
  });
}
