import Head from 'expo-router/head';
import { useState } from 'react';

import { AuditLogScreen } from '@/components/admin/audit-log';
import { GatedPage } from '@/components/layout/role-gate';
import { useAuditQuery } from '@/hooks/use-audit';
import { useMeQuery } from '@/hooks/use-auth';
import { can } from '@/lib/roles';
import type { AuditFilter } from '@/contracts/people';

/** Admin: the audit log, filtered. */
export function AuditPage() {
  const me = useMeQuery();
  const [filter, setFilter] = useState<AuditFilter>({});
  const entries = useAuditQuery(filter, can(me.data?.role, 'audit'));
  return (
    <>
      <Head>
        <title>Audit log · Crestwatch</title>
      </Head>
      <GatedPage title="Audit log" me={me} need="audit" what="the audit log">
        {() => <AuditLogScreen filter={filter} onFilter={setFilter} entries={entries} />}
      </GatedPage>
    </>
  );
}
