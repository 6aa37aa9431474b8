import Head from 'expo-router/head';

import { SettingsScreen } from '@/components/admin/settings-form';
import { TracksAdmin } from '@/components/admin/tracks-admin';
import { GatedPage } from '@/components/layout/role-gate';
import { useMeQuery } from '@/hooks/use-auth';
import { useSettingsMutation, useSettingsQuery } from '@/hooks/use-settings';
import { useSpecsQuery } from '@/hooks/use-specs';
import { useCreateTrackMutation, usePatchTrackMutation, useTracksQuery } from '@/hooks/use-tracks';
import { can } from '@/lib/roles';

/** Settings and the schedule: admins change them, analysts read them. */
export function SettingsPage() {
  const me = useMeQuery();
  const settings = useSettingsQuery(can(me.data?.role, 'settings.read'));
  const save = useSettingsMutation();
  const readable = can(me.data?.role, 'settings.read');
  const tracks = useTracksQuery({ enabled: readable });
  const specs = useSpecsQuery(can(me.data?.role, 'specs'));
  const create = useCreateTrackMutation();
  const patch = usePatchTrackMutation();
  return (
    <>
      <Head>
        <title>Settings · Crestwatch</title>
      </Head>
      <GatedPage title="Settings" me={me} need="settings.read" what="the settings">
        {(who) => {
          const admin = can(who.role, 'settings.write');
          return (
            <SettingsScreen settings={settings} onSave={admin ? (p) => save.mutateAsync(p) : null}>
              <TracksAdmin
                tracks={tracks}
                specs={specs.data?.specs ?? []}
                onCreate={admin ? (input) => create.mutateAsync(input) : null}
                onPatch={admin ? (code, p) => patch.mutateAsync({ code, patch: p }) : null}
              />
            </SettingsScreen>
          );
        }}
      </GatedPage>
    </>
  );
}
