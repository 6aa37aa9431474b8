import { useLocalSearchParams } from 'expo-router';
import Head from 'expo-router/head';

import { DistrictDetailView } from '@/components/district/district-detail-view';
import { useDistrictQuery } from '@/hooks/use-districts';
import { useLayoutMode } from '@/hooks/use-layout-mode';

/** One district's header, yearly series and cautions. */
export default function DistrictScreen() {
  const params = useLocalSearchParams<{ code: string }>();
  const code = typeof params.code === 'string' ? params.code : '';
  const mode = useLayoutMode();
  const detail = useDistrictQuery(code);
  const name = detail.data?.district.name;
  return (
    <>
      <Head>
        <title>{name ? `${name} (${code}) · Crestwatch` : 'District · Crestwatch'}</title>
      </Head>
      <DistrictDetailView code={code} detail={detail} showBackLink={mode === 'phone'} />
    </>
  );
}
