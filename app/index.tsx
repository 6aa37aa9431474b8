import Head from 'expo-router/head';

import { DistrictListPanel } from '@/components/district/district-list-panel';
import { RegionOverview } from '@/components/district/region-overview';
import { useDistrictsQuery } from '@/hooks/use-districts';
import { useLayoutMode } from '@/hooks/use-layout-mode';

/** Home: the region's districts. Wide windows already show the list beside this route. */
export default function RegionScreen() {
  const mode = useLayoutMode();
  const districts = useDistrictsQuery();
  return (
    <>
      <Head>
        <title>Districts · Crestwatch</title>
      </Head>
      {mode === 'wide' ? <RegionOverview districts={districts} /> : <DistrictListPanel districts={districts} />}
    </>
  );
}
