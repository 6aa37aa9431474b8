// Renders the staff routes in a memory router with a fresh QueryClient that never retries
// (error states show at once). Tests mock `apiGet` and `apiSend` (the api-client boundary).
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { Slot } from 'expo-router';
import { renderRouter } from 'expo-router/testing-library';

import AlertsRoute from '@/app/alerts';
import AuditRoute from '@/app/audit';
import MailboxRoute from '@/app/mailbox';
import PeopleRoute from '@/app/people';
import RunRoute from '@/app/runs/[id]';
import RunsRoute from '@/app/runs/index';
import SettingsRoute from '@/app/settings';
import SpecRoute from '@/app/specs/[id]';
import SpecsIndexRoute from '@/app/specs/index';
import SubscriptionsRoute from '@/app/subscriptions';
import UploadRoute from '@/app/uploads/[id]';
import UploadsRoute from '@/app/uploads/index';
import type { MeResponse } from '@/contracts/districts';

export function renderStaff(initialUrl: string) {
  const client = new QueryClient({ defaultOptions: { queries: { retry: false, gcTime: Infinity } } });
  function TestLayout() {
    return (
      <QueryClientProvider client={client}>
        <Slot />
      </QueryClientProvider>
    );
  }
  const result = renderRouter(
    {
      _layout: TestLayout,
      index: () => null,
      'district/[code]': () => null,
      alerts: AlertsRoute,
      audit: AuditRoute,
      mailbox: MailboxRoute,
      people: PeopleRoute,
      settings: SettingsRoute,
      subscriptions: SubscriptionsRoute,
      'runs/index': RunsRoute,
      'runs/[id]': RunRoute,
      'specs/index': SpecsIndexRoute,
      'specs/[id]': SpecRoute,
      'uploads/index': UploadsRoute,
      'uploads/[id]': UploadRoute,
    },
    { initialUrl },
  );
  return { ...result, client };
}

export function me(role: 'admin' | 'analyst' | 'official', id = 1): MeResponse {
  return { id, email: `${role}@crestwatch.example`, name: `Demo ${role}`, role, csrfToken: 'test-token' };
}
