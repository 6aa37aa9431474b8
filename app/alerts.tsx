import Head from 'expo-router/head';

import { AlertsFeedScreen } from '@/components/alerts/alerts-feed-screen';
import { GatedPage } from '@/components/layout/role-gate';
import { useAlertFeedQuery, useMarkAlertReadMutation } from '@/hooks/use-alerts';
import { useMeQuery } from '@/hooks/use-auth';

/** The caller's alerts feed: newest first, unread marked, each opening its district card. */
export default function AlertsRoute() {
  const me = useMeQuery();
  const feed = useAlertFeedQuery(me.status === 'success');
  const markRead = useMarkAlertReadMutation();
  return (
    <>
      <Head>
        <title>Your alerts · Crestwatch</title>
      </Head>
      <GatedPage title="Alerts" me={me} need="read" what="your alerts">
        {() => (
          <AlertsFeedScreen
            feed={feed}
            onRead={markRead.mutate}
            onReadAll={(ids) => ids.forEach((id) => markRead.mutate(id))}
          />
        )}
      </GatedPage>
    </>
  );
}
