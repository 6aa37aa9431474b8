// The uploads resource: GET /api/uploads[/:id], POST /api/uploads (dry run with preview),
// POST /api/uploads/:id/commit and /revert. Committing or reverting changes district series,
// so both refresh every districts key as well.
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';

import { apiGet, apiSend } from '@/lib/api-client';
import type { PickedFile } from '@/lib/pick-file.types';
import { STALE_TIMES } from '@/lib/stale-times';
import {
  RevertAnswerSchema,
  UploadAnswerSchema,
  UploadDetailResponseSchema,
  UploadListResponseSchema,
  type UploadOptions,
} from '@/contracts/uploads';

import { invalidatePublished } from './use-published';

export const uploadKeysRoot = ['uploads'] as const;

export const uploadKeys = {
  all: uploadKeysRoot,
  list: () => [...uploadKeysRoot, 'list'] as const,
  detail: (id: number) => [...uploadKeysRoot, 'detail', id] as const,
};

export function useUploadsQuery(enabled = true) {
  return useQuery({
    queryKey: uploadKeys.list(),
    queryFn: ({ signal }) =>
      apiGet('/api/uploads?limit=50', {
        signal,
        schema: UploadListResponseSchema,
      }),
    staleTime: STALE_TIMES.uploads,
    enabled,
  });
}

export function useUploadQuery(id: number | null) {
  return useQuery({
    queryKey: uploadKeys.detail(id ?? 0),
    queryFn: ({ signal }) => apiGet(`/api/uploads/${id}`, { signal, schema: UploadDetailResponseSchema }),
    staleTime: STALE_TIMES.uploadDetail,
    // A malformed id (≤ 0) is asked for too: the server's 400 is the screen's answer.
    enabled: id !== null,
  });
}

export function uploadQueryString(options: UploadOptions): string {
  const q = new URLSearchParams();
  if (options.allowNewDistricts) q.set('allowNewDistricts', 'true');
  if (options.decimalComma) q.set('decimalComma', 'true');
  if (options.changeFactor !== undefined) q.set('changeFactor', String(options.changeFactor));
  const s = q.toString();
  return s ? `?${s}` : '';
}

/** Dry run: the server reads and checks the file and answers with its preview; nothing is written. */
export function useUploadPreviewMutation() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: ({ file, options }: { file: PickedFile; options: UploadOptions }) => {
      const form = new FormData();
      file.appendTo(form, 'file');
      return apiSend('POST', `/api/uploads${uploadQueryString(options)}`, { form, schema: UploadAnswerSchema });
    },
    onSettled: () => client.invalidateQueries({ queryKey: uploadKeys.list() }),
  });
}

function useAfterDataChange() {
  const client = useQueryClient();
  return () =>
    Promise.all([
      client.invalidateQueries({ queryKey: uploadKeysRoot }),
      // New or reverted data changes the district list and each district's series.
      invalidatePublished(client),
    ]);
}

/** Commits a kept preview (checked again against the data as it is now). */
export function useCommitUploadMutation() {
  const refresh = useAfterDataChange();
  return useMutation({
    mutationFn: (id: number) => apiSend('POST', `/api/uploads/${id}/commit`, { schema: UploadAnswerSchema }),
    onSettled: refresh,
  });
}

/** Puts back every value an upload wrote (refused when a later upload changed them since). */
export function useRevertUploadMutation() {
  const refresh = useAfterDataChange();
  return useMutation({
    mutationFn: (id: number) =>
      apiSend('POST', `/api/uploads/${id}/revert`, {
        schema: RevertAnswerSchema,
      }),
    onSettled: refresh,
  });
}
