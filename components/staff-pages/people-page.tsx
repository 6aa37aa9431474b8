import Head from 'expo-router/head';

import { GatedPage } from '@/components/layout/role-gate';
import { PeopleScreen } from '@/components/people/people-screen';
import { useAuthOptionsQuery, useMeQuery } from '@/hooks/use-auth';
import {
  useInviteMutation,
  usePeopleQuery,
  usePersonMutation,
  useResendInvitationMutation,
  useResetIdentityMutation,
} from '@/hooks/use-people';
import { useSettingsMutation, useSettingsQuery } from '@/hooks/use-settings';
import { can } from '@/lib/roles';

/** Admin: people, roles, invitations. */
export function PeoplePage() {
  const me = useMeQuery();
  const options = useAuthOptionsQuery();
  const people = usePeopleQuery(can(me.data?.role, 'people'));
  const invite = useInviteMutation();
  const update = usePersonMutation();
  const resend = useResendInvitationMutation();
  const resetIdentity = useResetIdentityMutation();
  const settings = useSettingsQuery(can(me.data?.role, 'people'));
  const saveSettings = useSettingsMutation();
  return (
    <>
      <Head>
        <title>People · Crestwatch</title>
      </Head>
      <GatedPage title="People" me={me} need="people" what="the people screen">
        {(who) => (
          <PeopleScreen
            people={people}
            selfId={who.id}
            demo={options.data?.provider === 'stand-in'}
            onInvite={(input) => invite.mutateAsync(input)}
            onChange={(id, patch) => update.mutateAsync({ id, patch })}
            onResend={(id) => resend.mutateAsync(id)}
            onResetIdentity={(id) => resetIdentity.mutateAsync(id)}
            invitationDays={settings.data?.settings.invitationDays ?? null}
            onInvitationDays={(invitationDays) => saveSettings.mutateAsync({ invitationDays })}
          />
        )}
      </GatedPage>
    </>
  );
}
