// Saved model specs: GET/POST /api/specs, PUT/DELETE /api/specs/:id (delete archives).
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';

import { apiGet, apiSend } from '@/lib/api-client';
import { STALE_TIMES } from '@/lib/stale-times';
import { SpecAnswerSchema, SpecsResponseSchema, type SpecInput } from '@/contracts/settings';

import { invalidatePublished } from './use-published';

export const specKeysRoot = ['specs'] as const;

export const specKeys = {
  all: specKeysRoot,
  list: () => [...specKeysRoot, 'list'] as const,
};

export function useSpecsQuery(enabled = true) {
  return useQuery({
    queryKey: specKeys.list(),
    queryFn: ({ signal }) => apiGet('/api/specs', { signal, schema: SpecsResponseSchema }),
    staleTime: STALE_TIMES.specs,
    enabled,
  });
}

/** Saves a new spec (id null) or replaces a saved one. */
export function useSaveSpecMutation() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: ({ id, input }: { id: number | null; input: SpecInput }) =>
      id === null
        ? apiSend('POST', '/api/specs', { json: input, schema: SpecAnswerSchema })
        : apiSend('PUT', `/api/specs/${id}`, { json: input, schema: SpecAnswerSchema }),
    onSettled: () => Promise.all([client.invalidateQueries({ queryKey: specKeysRoot }), invalidatePublished(client)]),
  });
}

/** Archives a spec: runs keep their own copy, new runs cannot use it. */
export function useArchiveSpecMutation() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (id: number) => apiSend('DELETE', `/api/specs/${id}`),
    onSettled: () => Promise.all([client.invalidateQueries({ queryKey: specKeysRoot }), invalidatePublished(client)]),
  });
}
