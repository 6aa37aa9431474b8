// The runs resource: GET /api/runs[/:id], /review, /districts/:code; POST /api/runs (start),
// /publish, /discard; PUT a district's note. A run that is queued or running is polled.
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';

import { apiGet, apiSend } from '@/lib/api-client';
import { RUN_POLL_MS, STALE_TIMES } from '@/lib/stale-times';
import type { DistrictReview, PublishAnswer, ReviewResponse, RunListResponse, RunState, RunView } from '@/contracts/runs';

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

const isObject = (b: unknown): b is Record<string, unknown> => typeof b === 'object' && b !== null;

export function useRunsQuery(enabled = true) {
  return useQuery({
    queryKey: runKeys.list(),
    queryFn: ({ signal }) =>
      apiGet<RunListResponse>('/api/runs?limit=30', { signal, accept: (b) => isObject(b) && Array.isArray(b.runs) }),
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
    queryFn: ({ signal }) =>
      apiGet<RunView>(`/api/runs/${id}`, { signal, accept: (b) => isObject(b) && typeof b.state === 'string' }),
    staleTime: STALE_TIMES.runDetail,
    refetchInterval: (query) => (query.state.data && ACTIVE_RUN_STATES.includes(query.state.data.state) ? RUN_POLL_MS : false),
    enabled: id > 0,
  });
}

export function useRunReviewQuery(id: number, enabled: boolean) {
  return useQuery({
    queryKey: runKeys.review(id),
    queryFn: ({ signal }) =>
      apiGet<ReviewResponse>(`/api/runs/${id}/review`, {
        signal,
        accept: (b) => isObject(b) && Array.isArray(b.districts),
      }),
    staleTime: STALE_TIMES.runReview,
    enabled: enabled && id > 0,
  });
}

export function useRunDistrictQuery(id: number, code: string | null, enabled: boolean) {
  return useQuery({
    queryKey: runKeys.district(id, code ?? ''),
    queryFn: ({ signal }) =>
      apiGet<DistrictReview>(`/api/runs/${id}/districts/${encodeURIComponent(code ?? '')}`, {
        signal,
        accept: (b) => isObject(b) && Array.isArray(b.records),
      }),
    staleTime: STALE_TIMES.runReview,
    enabled: enabled && id > 0 && !!code,
  });
}

/** "Re-estimate now": queues a run of the given spec (the default when none). */
export function useStartRunMutation() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (specId?: number) =>
      apiSend<{ id: number; state: RunState }>('POST', '/api/runs', {
        json: specId ? { specId } : {},
        accept: (b) => isObject(b) && typeof b.id === 'number',
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
    mutationFn: (id: number) =>
      apiSend<PublishAnswer>('POST', `/api/runs/${id}/publish`, { accept: (b) => isObject(b) && 'alerts' in b }),
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
