import { useLocalSearchParams } from 'expo-router';
import Head from 'expo-router/head';

import { DistrictCardView } from '@/components/district/district-card-view';
import { useDistrictAlertsQuery } from '@/hooks/use-alerts';
import { useDistrictQuery } from '@/hooks/use-districts';
import {
  ESTIMATE_ROUTE,
  estimateApiPath,
  useDistrictEstimateQuery,
  useDistrictHistoryQuery,
} from '@/hooks/use-estimates';
import { earlyFetchScript } from '@/lib/early-fetch';

// Starts the card's request while the page's HTML is still parsing.
const EARLY = earlyFetchScript(ESTIMATE_ROUTE, estimateApiPath);
import { useLayoutMode } from '@/hooks/use-layout-mode';
import { useDistrictSubscriptionMutation, useSubscriptionsQuery } from '@/hooks/use-subscriptions';

/** The district card: published estimate, charts, sensitivity, data, history, alerts. */
export default function DistrictScreen() {
  const params = useLocalSearchParams<{ code: string }>();
  const code = typeof params.code === 'string' ? params.code : '';
  const mode = useLayoutMode();
  const estimate = useDistrictEstimateQuery(code);
  const detail = useDistrictQuery(code);
  const history = useDistrictHistoryQuery(code);
  const alerts = useDistrictAlertsQuery(code);
  const subscriptions = useSubscriptionsQuery();
  const subscription = useDistrictSubscriptionMutation(code);
  const name = estimate.data?.district.name;
  return (
    <>
      <Head>
        <title>{name ? `${name} (${code}) · Crestwatch` : 'District · Crestwatch'}</title>
        <script>{EARLY}</script>
      </Head>
      <DistrictCardView
        code={code}
        estimate={estimate}
        detail={detail}
        history={history}
        alerts={alerts}
        subscribe={{
          subscriptions,
          onChange: subscription.mutate,
          pending: subscription.isPending,
          error: subscription.error,
        }}
        showBackLink={mode === 'phone'}
      />
    </>
  );
}
