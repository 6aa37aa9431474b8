// Renders app routes in a memory router with a fresh QueryClient that never retries, so
// error states show at once. Each test mocks `apiGet` (the api-client boundary).
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { Slot } from 'expo-router';
import { renderRouter } from 'expo-router/testing-library';

import { useRegionLocale } from '@/hooks/use-region-locale';

import DistrictScreen from '@/app/district/[code]';
import RegionScreen from '@/app/index';
import NotFoundScreen from '@/app/+not-found';
import NoAccessScreen from '@/app/no-access';
import SignInScreen from '@/app/sign-in';

/** The root layout's locale step (GET /api/me's regionLocale keys the screens), on request. */
function Localised() {
  const locale = useRegionLocale();
  return <Slot key={locale} />;
}

export function renderApp(initialUrl: string, options: { regionLocale?: boolean } = {}) {
  const client = new QueryClient({ defaultOptions: { queries: { retry: false, gcTime: Infinity } } });
  function TestLayout() {
    return <QueryClientProvider client={client}>{options.regionLocale ? <Localised /> : <Slot />}</QueryClientProvider>;
  }
  const result = renderRouter(
    {
      _layout: TestLayout,
      index: RegionScreen,
      'district/[code]': DistrictScreen,
      'sign-in': SignInScreen,
      'no-access': NoAccessScreen,
      '+not-found': NotFoundScreen,
    },
    { initialUrl },
  );
  return { ...result, client };
}
