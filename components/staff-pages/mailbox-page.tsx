import Head from 'expo-router/head';
import { useState } from 'react';

import { MailboxScreen } from '@/components/admin/mailbox';
import { GatedPage } from '@/components/layout/role-gate';
import { useMeQuery } from '@/hooks/use-auth';
import { useMailboxQuery } from '@/hooks/use-mailbox';
import { can } from '@/lib/roles';

/** Admin, demo mode: what the local mail catcher received. */
export function MailboxPage() {
  const me = useMeQuery();
  const [to, setTo] = useState('');
  const messages = useMailboxQuery(to, can(me.data?.role, 'mailbox'));
  return (
    <>
      <Head>
        <title>Mailbox · Crestwatch</title>
      </Head>
      <GatedPage title="Mailbox (demo)" me={me} need="mailbox" what="the demo mailbox">
        {() => <MailboxScreen to={to} onTo={setTo} messages={messages} />}
      </GatedPage>
    </>
  );
}
