import { useLocalSearchParams, useRouter } from '@/lib/router';
import Head from 'expo-router/head';

import { GatedPage } from '@/components/layout/role-gate';
import { SpecsScreen } from '@/components/specs/specs-screen';
import { useMeQuery } from '@/hooks/use-auth';
import { useIndicatorsQuery } from '@/hooks/use-indicators';
import { useLayoutMode } from '@/hooks/use-layout-mode';
import { useArchiveSpecMutation, useSaveSpecMutation, useSpecsQuery } from '@/hooks/use-specs';
import { useTracksQuery, useTrackSpecMutation } from '@/hooks/use-tracks';
import { can } from '@/lib/roles';

/** The specs screen with one spec (or 'new', or none) open; /specs renders it with none. */
export function SpecsRouteBody({
  selected,
  notice = null,
}: {
  selected: 'new' | number | null;
  notice?: string | null;
}) {
  const router = useRouter();
  const mode = useLayoutMode();
  const me = useMeQuery();
  const allowed = can(me.data?.role, 'specs');
  const specs = useSpecsQuery(allowed);
  const indicators = useIndicatorsQuery(allowed);
  const save = useSaveSpecMutation();
  const archive = useArchiveSpecMutation();
  const tracks = useTracksQuery({ enabled: allowed });
  const trackSpec = useTrackSpecMutation();
  return (
    <GatedPage title="Model specs" me={me} need="specs" what="the model specs">
      {() => (
        <SpecsScreen
          specs={specs}
          indicators={indicators}
          selected={selected}
          wide={mode === 'wide'}
          onSave={async (id, input) => (await save.mutateAsync({ id, input })).spec}
          notice={notice}
          tracks={tracks}
          onChangeTrackSpec={(code, specId) => trackSpec.mutateAsync({ code, specId })}
          onArchive={async (spec) => {
            await archive.mutateAsync(spec.id);
            // An archived spec leaves the list: back to it, saying what happened.
            router.replace({ pathname: '/specs', params: { archived: spec.name } });
          }}
          onSaved={(spec) => router.replace({ pathname: '/specs/[id]', params: { id: String(spec.id) } })}
        />
      )}
    </GatedPage>
  );
}

/** One saved spec in the editor (`new` for a fresh one). */
export function SpecPage() {
  const params = useLocalSearchParams<{ id: string }>();
  const raw = typeof params.id === 'string' ? params.id : '';
  const selected = raw === 'new' ? 'new' : Number.isInteger(Number(raw)) && Number(raw) > 0 ? Number(raw) : -1;
  return (
    <>
      <Head>
        <title>{selected === 'new' ? 'New spec · Crestwatch' : 'Model spec · Crestwatch'}</title>
      </Head>
      <SpecsRouteBody selected={selected} />
    </>
  );
}
