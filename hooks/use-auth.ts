// The auth resource: GET /api/auth/options (how to sign in) and GET /api/me (who is signed in).
import { useQuery } from '@tanstack/react-query';

import { apiGet } from '@/lib/api-client';
import type { AuthOptionsResponse, MeResponse } from '@/lib/api-types';
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
      apiGet<AuthOptionsResponse>('/api/auth/options', {
        signal,
        accept: (b) => typeof (b as AuthOptionsResponse | null)?.signInUrl === 'string',
      }),
    staleTime: STALE_TIMES.authOptions,
  });
}

/** The signed-in person; fails with ApiError 401 `unauthenticated` when nobody is. */
export function useMeQuery() {
  return useQuery({
    queryKey: authKeys.me(),
    queryFn: ({ signal }) =>
      apiGet<MeResponse>('/api/me', { signal, accept: (b) => typeof (b as MeResponse | null)?.email === 'string' }),
    staleTime: STALE_TIMES.me,
  });
}
