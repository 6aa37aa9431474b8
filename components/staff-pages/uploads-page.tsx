import Head from 'expo-router/head';

import { GatedPage } from '@/components/layout/role-gate';
import { UploadsScreen } from '@/components/uploads/uploads-screen';
import { useMeQuery } from '@/hooks/use-auth';
import { useSettingsQuery } from '@/hooks/use-settings';
import {
  useCommitUploadMutation,
  useRevertUploadMutation,
  useUploadPreviewMutation,
  useUploadProgress,
  useUploadsQuery,
  type UploadWatch,
} from '@/hooks/use-uploads';
import { pickCsvFile } from '@/lib/pick-file';
import { can } from '@/lib/roles';

/** Load a CSV (check, then load) and the upload history with Revert. */
export function UploadsPage() {
  const me = useMeQuery();
  const allowed = can(me.data?.role, 'upload');
  const uploads = useUploadsQuery(allowed);
  const settings = useSettingsQuery(allowed);
  const preview = useUploadPreviewMutation();
  const commit = useCommitUploadMutation();
  const revert = useRevertUploadMutation();
  const watch = useUploadProgress();
  // One upload at a time is followed: its bytes sent, then the server's phases.
  const followed = async <T,>(work: (w: UploadWatch) => Promise<T>): Promise<T> => {
    try {
      return await work(watch.begin());
    } finally {
      watch.end();
    }
  };
  return (
    <>
      <Head>
        <title>Uploads · Crestwatch</title>
      </Head>
      <GatedPage title="Uploads" me={me} need="upload" what="the upload screen">
        {() => (
          <UploadsScreen
            uploads={uploads}
            changeFactor={settings.data?.settings.uploadChangeFactor ?? null}
            pickFile={pickCsvFile}
            onPreview={(file, options) => followed((w) => preview.mutateAsync({ file, options, watch: w }))}
            onCommit={(id) => followed((w) => commit.mutateAsync({ id, watch: w }))}
            progress={watch.progress}
            onRevert={(id) => revert.mutateAsync(id)}
          />
        )}
      </GatedPage>
    </>
  );
}
