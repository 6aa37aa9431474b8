import {
  onlineManager,
  QueryClient,
  replaceEqualDeep,
  type InvalidateOptions,
  type InvalidateQueryFilters,
  type QueryKey,
} from '@tanstack/react-query';

import { ApiError } from './api-client';
import { offlineCopySavedAt } from './offline-copies';

/** Most attempts for one query: the first plus two retries, for flaky networks and restarts. */
const MAX_FAILURES = 3;

/** Retry transport faults and 5xx, never a 4xx: the same request gets the same refusal. */
export function shouldRetry(failureCount: number, error: unknown): boolean {
  if (error instanceof ApiError && error.isClientError) return false;
  return failureCount < MAX_FAILURES - 1;
}

/**
 * Keeps unchanged parts of a new answer (react-query's default), except across an offline
 * copy: a copy and a fresh answer stay distinct objects, so a screen can tell which it shows.
 */
export function shareUnlessOfflineCopy(previous: unknown, next: unknown): unknown {
  if (offlineCopySavedAt(previous) !== null || offlineCopySavedAt(next) !== null) return next;
  return replaceEqualDeep(previous, next);
}

/**
 * While offline, an invalidation (after a change, successful or refused) marks the queries
 * stale without refetching them: a refetch would only wait for the network, and a change's
 * busy state waits for it. They refetch when the connection returns (refetchOnReconnect).
 */
class CrestwatchQueryClient extends QueryClient {
  override invalidateQueries<TTaggedQueryKey extends QueryKey = QueryKey>(
    filters?: InvalidateQueryFilters<TTaggedQueryKey>,
    options?: InvalidateOptions,
  ): Promise<void> {
    return super.invalidateQueries(onlineManager.isOnline() ? filters : { ...filters, refetchType: 'none' }, options);
  }
}

/** One client for the app's lifetime (the root layout creates it once). */
export function createQueryClient(): QueryClient {
  return new CrestwatchQueryClient({
    defaultOptions: {
      queries: {
        retry: shouldRetry,
        // 0.5 s, 1 s, then capped: the user sees the error state within a few seconds.
        retryDelay: (attempt) => Math.min(500 * 2 ** attempt, 4000),
        // Ask even while the device says it is offline: the service worker may hold an
        // offline copy of the answer. Retries still wait for the connection.
        networkMode: 'offlineFirst',
        structuralSharing: shareUnlessOfflineCopy,
      },
      // A change is sent now or refused, never held back and sent later (lib/api-client.ts
      // refuses it at once while offline).
      mutations: { networkMode: 'always' },
    },
  });
}
