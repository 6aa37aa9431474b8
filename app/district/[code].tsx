import { useLocalSearchParams } from '@/lib/router';
import Head from 'expo-router/head';

import { DistrictCardView } from '@/components/district/district-card-view';
import { RefreshButton } from '@/components/ui/refresh-button';
import { useDistrictAlertsQuery } from '@/hooks/use-alerts';
import { useDistrictQuery } from '@/hooks/use-districts';
import {
  ESTIMATE_ROUTE,
  estimateApiPath,
  useDistrictEstimateQuery,
  useDistrictHistoryQuery,
} from '@/hooks/use-estimates';
import { useLayoutMode } from '@/hooks/use-layout-mode';
import { useDistrictSubscriptionMutation, useSubscriptionsQuery } from '@/hooks/use-subscriptions';
import { useTrackChoice } from '@/hooks/use-tracks';
import { earlyFetchScript } from '@/lib/early-fetch';

// Starts the card's request (with the URL's or the device's track) while the page's HTML is still parsing.
const EARLY = earlyFetchScript(ESTIMATE_ROUTE, estimateApiPath);

/** The district card: published estimate, charts, sensitivity, data, history, alerts. */
export default function DistrictScreen() {
  const params = useLocalSearchParams<{ code: string }>();
  const code = typeof params.code === 'string' ? params.code : '';
  const mode = useLayoutMode();
  // ?track= wins over the device's remembered track, which wins over the headline track.
  const choice = useTrackChoice();
  const estimate = useDistrictEstimateQuery(code, choice.request);
  const detail = useDistrictQuery(code);
  const history = useDistrictHistoryQuery(code, true, choice.request);
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
        onChooseTrack={choice.choose}
        refresh={
          <RefreshButton queries={[estimate, detail, history, alerts]} what="this district" testID="card-refresh" />
        }
      />
    </>
  );
}
