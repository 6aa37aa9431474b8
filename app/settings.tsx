import Head from 'expo-router/head';

import { SettingsScreen } from '@/components/admin/settings-form';
import { GatedPage } from '@/components/layout/role-gate';
import { useMeQuery } from '@/hooks/use-auth';
import { useSettingsMutation, useSettingsQuery } from '@/hooks/use-settings';
import { can } from '@/lib/roles';

/** Settings and the schedule: admins change them, analysts read them. */
export default function SettingsRoute() {
  const me = useMeQuery();
  const settings = useSettingsQuery(can(me.data?.role, 'settings.read'));
  const save = useSettingsMutation();
  return (
    <>
      <Head>
        <title>Settings · Crestwatch</title>
      </Head>
      <GatedPage title="Settings" me={me} need="settings.read" what="the settings">
        {(who) => (
          <SettingsScreen
            settings={settings}
            onSave={can(who.role, 'settings.write') ? (patch) => save.mutateAsync(patch) : null}
          />
        )}
      </GatedPage>
    </>
  );
}
