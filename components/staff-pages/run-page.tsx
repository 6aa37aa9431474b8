import { useLocalSearchParams } from '@/lib/router';
import Head from 'expo-router/head';

import { GatedPage } from '@/components/layout/role-gate';
import { RunScreen } from '@/components/runs/run-screen';
import { useMeQuery } from '@/hooks/use-auth';
import { useIndicatorsQuery } from '@/hooks/use-indicators';
import { useLayoutMode } from '@/hooks/use-layout-mode';
import {
  REVIEWABLE_RUN_STATES,
  useDiscardRunMutation,
  usePublishRunMutation,
  useRunDistrictQuery,
  useRunNoteMutation,
  useRunQuery,
  useRunReviewQuery,
} from '@/hooks/use-runs';
import { can } from '@/lib/roles';

/** One run: progress, then the review of every district, publish or discard. `?district=` opens one. */
export function RunPage() {
  const params = useLocalSearchParams<{ id: string; district?: string }>();
  const id = Number(typeof params.id === 'string' ? params.id : NaN);
  const runId = Number.isInteger(id) && id > 0 ? id : 0;
  const code = typeof params.district === 'string' && params.district !== '' ? params.district : null;
  const mode = useLayoutMode();
  const me = useMeQuery();
  const allowed = can(me.data?.role, 'runs');
  const run = useRunQuery(allowed ? runId : 0);
  const reviewable = !!run.data && REVIEWABLE_RUN_STATES.includes(run.data.state);
  const review = useRunReviewQuery(runId, allowed && reviewable);
  const district = useRunDistrictQuery(runId, code, allowed && reviewable);
  const publish = usePublishRunMutation();
  const discard = useDiscardRunMutation();
  const note = useRunNoteMutation();
  // The driver's unit from the catalogue, for the thresholds the review prints.
  const indicators = useIndicatorsQuery(allowed && reviewable);
  const driver = run.data?.spec.selection.driver;
  const incomeUnit = indicators.data?.find((i) => i.code === driver)?.unit;
  return (
    <>
      <Head>
        <title>{`Run #${runId || '?'}${code ? ` · ${code}` : ''} · Crestwatch`}</title>
      </Head>
      <GatedPage title="Run" me={me} need="runs" what="the run review">
        {() => (
          <RunScreen
            runId={runId}
            selectedCode={code}
            wide={mode === 'wide'}
            run={run}
            review={review}
            district={district}
            incomeUnit={incomeUnit}
            onPublish={() => publish.mutateAsync(runId)}
            onDiscard={() => discard.mutateAsync(runId)}
            onSaveNote={(c, text) => note.mutateAsync({ id: runId, code: c, note: text })}
          />
        )}
      </GatedPage>
    </>
  );
}
