import { useLocalSearchParams } from '@/lib/router';
import Head from 'expo-router/head';

import { GatedPage } from '@/components/layout/role-gate';
import { UploadDetail } from '@/components/uploads/upload-detail';
import { useMeQuery } from '@/hooks/use-auth';
import { useCommitUploadMutation, useRevertUploadMutation, useUploadQuery } from '@/hooks/use-uploads';
import { can } from '@/lib/roles';

/** One upload with its preview and problems; commit a kept preview or revert a loaded file. */
export function UploadPage() {
  const params = useLocalSearchParams<{ id: string }>();
  const id = Number(typeof params.id === 'string' ? params.id : NaN);
  const me = useMeQuery();
  const allowed = can(me.data?.role, 'upload');
  // A malformed id is asked for anyway: the server's 4xx becomes the screen's "no such upload".
  const detail = useUploadQuery(allowed ? (Number.isInteger(id) && id > 0 ? id : -1) : null);
  const commit = useCommitUploadMutation();
  const revert = useRevertUploadMutation();
  return (
    <>
      <Head>
        <title>{`Upload #${Number.isInteger(id) ? id : '?'} · Crestwatch`}</title>
      </Head>
      <GatedPage title="Upload" me={me} need="upload" what="the upload screen">
        {() => (
          <UploadDetail
            id={id}
            detail={detail}
            onCommit={(i) => commit.mutateAsync({ id: i })}
            onRevert={(i) => revert.mutateAsync(i)}
          />
        )}
      </GatedPage>
    </>
  );
}
