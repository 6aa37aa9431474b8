import Head from 'expo-router/head';

import { SubscriptionsScreen } from '@/components/alerts/subscriptions-screen';
import { GatedPage } from '@/components/layout/role-gate';
import { useMeQuery } from '@/hooks/use-auth';
import { useDistrictsQuery } from '@/hooks/use-districts';
import { useTracksQuery } from '@/hooks/use-tracks';
import { shownTracks } from '@/lib/track-choice';
import { useSubscribeMutation, useSubscriptionsQuery, useUnsubscribeMutation } from '@/hooks/use-subscriptions';

/** The signed-in person's subscriptions: district, set or region; kinds; instant or digest; brief. */
export default function SubscriptionsRoute() {
  const me = useMeQuery();
  const subscriptions = useSubscriptionsQuery();
  const districts = useDistrictsQuery();
  const tracks = useTracksQuery();
  const subscribe = useSubscribeMutation();
  const unsubscribe = useUnsubscribeMutation();
  return (
    <>
      <Head>
        <title>Subscriptions · Crestwatch</title>
      </Head>
      <GatedPage title="Subscriptions" me={me} need="read" what="your subscriptions">
        {() => (
          <SubscriptionsScreen
            subscriptions={subscriptions}
            districts={districts}
            tracks={shownTracks(tracks.data ?? [])}
            onSubscribe={(input) => subscribe.mutateAsync(input)}
            onRemove={(id) => unsubscribe.mutateAsync(id)}
          />
        )}
      </GatedPage>
    </>
  );
}
