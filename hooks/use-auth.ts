// The auth resource: GET /api/auth/options (how to sign in), GET /api/me (who is signed in,
// and the CSRF token every state-changing call carries), POST /api/auth/sign-out.
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';

import { apiGet, apiSend, ME_PATH, rememberCsrfToken } from '@/lib/api-client';
import { clearOfflineCopies } from '@/lib/offline-copies';
import { AuthOptionsResponseSchema, MeResponseSchema, type MeResponse } from '@/contracts/districts';
import { STALE_TIMES } from '@/lib/stale-times';

export const authKeysRoot = ['auth'] as const;

export const authKeys = {
  all: authKeysRoot,
  options: () => [...authKeysRoot, 'options'] as const,
  me: () => [...authKeysRoot, 'me'] as const,
};

export function useAuthOptionsQuery() {
  return useQuery({
    queryKey: authKeys.options(),
    queryFn: ({ signal }) =>
      apiGet('/api/auth/options', {
        signal,
        schema: AuthOptionsResponseSchema,
      }),
    staleTime: STALE_TIMES.authOptions,
  });
}

export async function fetchMe(signal?: AbortSignal): Promise<MeResponse> {
  const me = await apiGet(ME_PATH, {
    signal,
    schema: MeResponseSchema,
  });
  rememberCsrfToken(typeof me.csrfToken === 'string' ? me.csrfToken : null);
  return me;
}

/** The signed-in person; fails with ApiError 401 `unauthenticated` when nobody is. */
export function useMeQuery() {
  return useQuery({
    queryKey: authKeys.me(),
    queryFn: ({ signal }) => fetchMe(signal),
    staleTime: STALE_TIMES.me,
  });
}

/**
 * Ends the session. Everything cached belonged to the person who just left, so every query
 * is reset (its data dropped; the ones on screen ask again and now get 401); the caller
 * then sends the browser to the sign-in page. The answers kept for reading offline are
 * deleted before the request is sent, so they are gone even when it fails.
 */
export function useSignOutMutation() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: async () => {
      await clearOfflineCopies();
      await apiSend('POST', '/api/auth/sign-out');
    },
    onSuccess: () => {
      rememberCsrfToken(null);
      void client.resetQueries();
    },
  });
}
