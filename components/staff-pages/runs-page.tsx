import { useRouter } from '@/lib/router';
import Head from 'expo-router/head';
import { useState } from 'react';

import { GatedPage } from '@/components/layout/role-gate';
import { RunsScreen } from '@/components/runs/runs-screen';
import { useMeQuery } from '@/hooks/use-auth';
import { useRunsQuery, useStartRunMutation } from '@/hooks/use-runs';
import { useSettingsQuery } from '@/hooks/use-settings';
import { useTracksQuery } from '@/hooks/use-tracks';
import { can } from '@/lib/roles';

/** Start a run ("re-estimate now") and list the recent ones. */
export function RunsPage() {
  const router = useRouter();
  const me = useMeQuery();
  const allowed = can(me.data?.role, 'runs');
  // The list shows every track's runs, or one track's (GET /api/runs?track=).
  const [shown, setShown] = useState<string>('all');
  const runs = useRunsQuery(allowed, shown === 'all' ? null : shown);
  const tracks = useTracksQuery({ enabled: allowed });
  const settings = useSettingsQuery(allowed);
  const start = useStartRunMutation();
  return (
    <>
      <Head>
        <title>Runs · Crestwatch</title>
      </Head>
      <GatedPage title="Runs" me={me} need="runs" what="the runs screen">
        {() => (
          <RunsScreen
            runs={runs}
            tracks={tracks}
            listTrack={shown}
            onListTrack={setShown}
            settings={settings}
            onStart={(track) => start.mutateAsync(track)}
            onOpen={(id) => router.push({ pathname: '/runs/[id]', params: { id: String(id) } })}
          />
        )}
      </GatedPage>
    </>
  );
}
