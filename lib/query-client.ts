import { QueryClient } from '@tanstack/react-query';

import { ApiError } from './api-client';

/** Most attempts for one query: the first plus two retries, for flaky networks and restarts. */
const MAX_FAILURES = 3;

/** Retry transport faults and 5xx, never a 4xx: the same request gets the same refusal. */
export function shouldRetry(failureCount: number, error: unknown): boolean {
  if (error instanceof ApiError && error.isClientError) return false;
  return failureCount < MAX_FAILURES - 1;
}

/** One client for the app's lifetime (the root layout creates it once). */
export function createQueryClient(): QueryClient {
  return new QueryClient({
    defaultOptions: {
      queries: {
        retry: shouldRetry,
        // 0.5 s, 1 s, then capped: the user sees the error state within a few seconds.
        retryDelay: (attempt) => Math.min(500 * 2 ** attempt, 4000),
      },
    },
  });
}
