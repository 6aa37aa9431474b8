// The uploads resource: GET /api/uploads[/:id], POST /api/uploads (dry run with preview),
// POST /api/uploads/:id/commit and /revert. Committing or reverting changes district series,
// so both refresh every districts key as well.
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useCallback, useState } from 'react';

import { ApiError, apiGet, apiSend, type SendProgress } from '@/lib/api-client';
import type { PickedFile } from '@/lib/pick-file.types';
import { STALE_TIMES, UPLOAD_POLL_MS } from '@/lib/stale-times';
import {
  RevertAnswerSchema,
  UploadAnswerSchema,
  UploadDetailResponseSchema,
  UploadListResponseSchema,
  UploadProgressSchema,
  type UploadOptions,
  type UploadProgress,
} from '@/contracts/uploads';

import { invalidatePublished } from './use-published';

export const uploadKeysRoot = ['uploads'] as const;

export const uploadKeys = {
  all: uploadKeysRoot,
  list: () => [...uploadKeysRoot, 'list'] as const,
  detail: (id: number) => [...uploadKeysRoot, 'detail', id] as const,
  progress: (key: string) => [...uploadKeysRoot, 'progress', key] as const,
};

/** How one upload is followed: the key the server reports under, and where the bytes sent go. */
export type UploadWatch = { key: string; onSent: SendProgress };

/** What the screen knows of a running upload: bytes sent (the browser's count), then the server's phase. */
export type UploadProgressView = {
  sent: { loaded: number; total: number } | null;
  server: UploadProgress | null;
};

/** 32 hex digits: unguessable enough that two uploads never share a key. */
function newProgressKey(): string {
  const bytes = new Uint8Array(16);
  if (typeof crypto !== 'undefined' && typeof crypto.getRandomValues === 'function') crypto.getRandomValues(bytes);
  else for (let i = 0; i < bytes.length; i++) bytes[i] = Math.floor(Math.random() * 256);
  return Array.from(bytes, (b) => b.toString(16).padStart(2, '0')).join('');
}

/**
 * Follows one upload at a time: `begin()` picks a key and returns the watch to send with
 * the upload; the server's progress under that key is polled every UPLOAD_POLL_MS until
 * `end()`. Before the server has started (still receiving the file) the key is unknown
 * there, which is not an error.
 */
export function useUploadProgress() {
  const [key, setKey] = useState<string | null>(null);
  const [sent, setSent] = useState<UploadProgressView['sent']>(null);
  const server = useQuery({
    queryKey: uploadKeys.progress(key ?? ''),
    queryFn: async ({ signal }) => {
      try {
        return await apiGet(`/api/uploads/progress/${key}`, { signal, schema: UploadProgressSchema });
      } catch (error) {
        if (error instanceof ApiError && error.status === 404) return null;
        throw error;
      }
    },
    enabled: key !== null,
    staleTime: STALE_TIMES.uploadProgress,
    refetchInterval: UPLOAD_POLL_MS,
    retry: false,
  });
  const begin = useCallback((): UploadWatch => {
    const k = newProgressKey();
    setSent(null);
    setKey(k);
    return { key: k, onSent: (loaded, total) => setSent({ loaded, total }) };
  }, []);
  const end = useCallback(() => setKey(null), []);
  const progress: UploadProgressView | null = key ? { sent, server: server.data ?? null } : null;
  return { progress, begin, end };
}

function withProgress(path: string, watch?: UploadWatch): string {
  if (!watch) return path;
  return `${path}${path.includes('?') ? '&' : '?'}progress=${encodeURIComponent(watch.key)}`;
}

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
    mutationFn: ({ file, options, watch }: { file: PickedFile; options: UploadOptions; watch?: UploadWatch }) => {
      const form = new FormData();
      file.appendTo(form, 'file');
      return apiSend('POST', withProgress(`/api/uploads${uploadQueryString(options)}`, watch), {
        form,
        schema: UploadAnswerSchema,
        onUploadProgress: watch?.onSent,
      });
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
    mutationFn: ({ id, watch }: { id: number; watch?: UploadWatch }) =>
      apiSend('POST', withProgress(`/api/uploads/${id}/commit`, watch), { schema: UploadAnswerSchema }),
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
