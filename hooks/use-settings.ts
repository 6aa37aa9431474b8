// The settings resource: GET /api/settings (staff) with the schedule and its next start,
// PATCH /api/settings (admin, audited).
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';

import { apiGet, apiSend } from '@/lib/api-client';
import { STALE_TIMES } from '@/lib/stale-times';
import { SettingsResponseSchema, type Settings } from '@/contracts/settings';

import { auditKeysRoot } from './use-audit';

export const settingsKeysRoot = ['settings'] as const;

export const settingsKeys = {
  all: settingsKeysRoot,
  current: () => [...settingsKeysRoot, 'current'] as const,
};

export function useSettingsQuery(enabled = true) {
  return useQuery({
    queryKey: settingsKeys.current(),
    queryFn: ({ signal }) => apiGet('/api/settings', { signal, schema: SettingsResponseSchema }),
    staleTime: STALE_TIMES.settings,
    enabled,
  });
}

export function useSettingsMutation() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (patch: Partial<Settings>) =>
      apiSend('PATCH', '/api/settings', { json: patch, schema: SettingsResponseSchema }),
    onSuccess: (data) => client.setQueryData(settingsKeys.current(), data),
    onSettled: () => client.invalidateQueries({ queryKey: auditKeysRoot }),
  });
}
