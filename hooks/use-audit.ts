// The audit log (admin): GET /api/audit, newest first, filtered; older pages by id.
import { useInfiniteQuery } from '@tanstack/react-query';

import { apiGet } from '@/lib/api-client';
import { STALE_TIMES } from '@/lib/stale-times';
import { AuditResponseSchema, type AuditFilter } from '@/contracts/people';

export const auditKeysRoot = ['audit'] as const;

export const auditKeys = {
  all: auditKeysRoot,
  list: (filter: AuditFilter) => [...auditKeysRoot, 'list', filter] as const,
};

/** Entries per page. */
export const AUDIT_PAGE = 50;

export function auditPath(filter: AuditFilter, beforeId?: number): string {
  const q = new URLSearchParams({ limit: String(AUDIT_PAGE) });
  for (const key of ['action', 'actor', 'targetType', 'since', 'until'] as const) {
    const v = filter[key]?.trim();
    if (v) q.set(key, v);
  }
  if (beforeId) q.set('beforeId', String(beforeId));
  return `/api/audit?${q.toString()}`;
}

export function useAuditQuery(filter: AuditFilter, enabled = true) {
  return useInfiniteQuery({
    queryKey: auditKeys.list(filter),
    queryFn: ({ signal, pageParam }) =>
      apiGet(auditPath(filter, pageParam), {
        signal,
        schema: AuditResponseSchema,
      }),
    initialPageParam: undefined as number | undefined,
    getNextPageParam: (last) =>
      last.entries.length === AUDIT_PAGE ? last.entries[last.entries.length - 1].id : undefined,
    staleTime: STALE_TIMES.audit,
    enabled,
  });
}
