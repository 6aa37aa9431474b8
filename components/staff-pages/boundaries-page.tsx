import Head from 'expo-router/head';

import { BoundariesScreen } from '@/components/boundaries/boundaries-screen';
import { GatedPage } from '@/components/layout/role-gate';
import { useMeQuery } from '@/hooks/use-auth';
import {
  useBoundaryUploadMutation,
  useBoundaryVersionsQuery,
  useRevertBoundaryMutation,
} from '@/hooks/use-boundary-uploads';
import { pickGeoJsonFile } from '@/lib/pick-file';
import { can } from '@/lib/roles';

/** Load district boundaries (GeoJSON: check, then load) and the boundary versions with Revert. */
export function BoundariesPage() {
  const me = useMeQuery();
  const allowed = can(me.data?.role, 'upload');
  const versions = useBoundaryVersionsQuery(allowed);
  const send = useBoundaryUploadMutation();
  const revert = useRevertBoundaryMutation();
  return (
    <>
      <Head>
        <title>District boundaries · Crestwatch</title>
      </Head>
      <GatedPage title="District boundaries" me={me} need="upload" what="the boundary upload screen">
        {() => (
          <BoundariesScreen
            versions={versions}
            pickFile={pickGeoJsonFile}
            onSend={(file, options) => send.mutateAsync({ file, options })}
            onRevert={(id) => revert.mutateAsync(id)}
          />
        )}
      </GatedPage>
    </>
  );
}
