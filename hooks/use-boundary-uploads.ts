// Staff's side of the district boundaries: the boundary upload (POST /api/boundaries: a
// dry run, or a commit of the whole file), the versions history
// (GET /api/boundaries/versions) and revert (POST /api/boundaries/versions/:id/revert).
// Kept apart from use-boundaries.ts so the region's first page does not carry them. A
// commit or a revert changes the map, the upload history and the series derived from land
// area, so both refresh all three.
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';

import {
  BoundaryRevertAnswerSchema,
  BoundaryUploadAnswerSchema,
  BoundaryVersionsSchema,
  type BoundaryUploadOptions,
} from '@/contracts/boundaries';
import { apiGet, apiSend } from '@/lib/api-client';
import type { PickedFile } from '@/lib/pick-file.types';
import { STALE_TIMES } from '@/lib/stale-times';

import { boundaryKeys, boundaryKeysRoot } from './use-boundaries';
import { invalidatePublished } from './use-published';
import { uploadKeysRoot } from './use-uploads';

/** The boundary versions, newest first (another analyst may load a file meanwhile: the uploads' stale time). */
export function useBoundaryVersionsQuery(enabled = true) {
  return useQuery({
    queryKey: boundaryKeys.versions(),
    queryFn: ({ signal }) => apiGet('/api/boundaries/versions', { signal, schema: BoundaryVersionsSchema }),
    staleTime: STALE_TIMES.uploads,
    enabled,
  });
}

export function boundaryQueryString(options: BoundaryUploadOptions): string {
  const q = new URLSearchParams();
  q.set('codeProperty', options.codeProperty.trim() || 'code');
  if (options.repair) q.set('repair', 'true');
  if (options.commit) q.set('commit', 'true');
  return `?${q.toString()}`;
}

function useAfterBoundaryChange() {
  const client = useQueryClient();
  return () =>
    Promise.all([
      client.invalidateQueries({ queryKey: boundaryKeysRoot }),
      client.invalidateQueries({ queryKey: uploadKeysRoot }),
      // Land area and the ratios built on it are district series.
      invalidatePublished(client),
    ]);
}

/**
 * Sends a boundary file: a dry run (the checks and the preview; nothing is written), or
 * with `commit` the same checks and, when the whole file is accepted, a new boundary version.
 */
export function useBoundaryUploadMutation() {
  const refresh = useAfterBoundaryChange();
  return useMutation({
    mutationFn: ({ file, options }: { file: PickedFile; options: BoundaryUploadOptions }) => {
      const form = new FormData();
      file.appendTo(form, 'file');
      return apiSend('POST', `/api/boundaries${boundaryQueryString(options)}`, {
        form,
        schema: BoundaryUploadAnswerSchema,
      });
    },
    onSettled: (_data, _error, { options }) => (options.commit ? refresh() : undefined),
  });
}

/** Reverts a boundary version: the one before it is in force again. */
export function useRevertBoundaryMutation() {
  const refresh = useAfterBoundaryChange();
  return useMutation({
    mutationFn: (id: number) =>
      apiSend('POST', `/api/boundaries/versions/${id}/revert`, { schema: BoundaryRevertAnswerSchema }),
    onSettled: refresh,
  });
}
