import Head from 'expo-router/head';

import { DistrictListPanel } from '@/components/district/district-list-panel';
import { MapListChoice, useRegionView } from '@/components/region/map-list-choice';
import { MapPhoneView } from '@/components/region/map-phone-view';
import { RegionMap } from '@/components/region/region-map';
import { RegionOverview } from '@/components/region/region-overview';
import { RegionStrip } from '@/components/region/region-strip';
import { TrackSwitcher } from '@/components/region/track-switcher';
import { RefreshButton } from '@/components/ui/refresh-button';
import { useLayoutMode } from '@/hooks/use-layout-mode';
import { REGION_PATH, usePublishedRunQuery, useRegionDistrictsQuery, useRegionQuery } from '@/hooks/use-region';
import { useTrackChoice } from '@/hooks/use-tracks';
import { earlyFetchScript } from '@/lib/early-fetch';

// Starts the region's request (with the URL's or the device's track) while the page's HTML is still parsing.
const EARLY = earlyFetchScript(/^\/$/, () => REGION_PATH);

/** Home: the region. Phone: the list with the run line; wide: the list is beside, this shows the overview. */
export default function RegionScreen() {
  const mode = useLayoutMode();
  const choice = useTrackChoice();
  const track = choice.request;
  // One answer serves the list, the map, the run line and (wide) the overview's pooled curve.
  const districts = useRegionDistrictsQuery({ track });
  const region = useRegionQuery({ track });
  const run = usePublishedRunQuery({ track });
  const level = run.data?.model.level ?? null;
  const [view, setView] = useRegionView();
  const shownTrack = choice.chosen ?? region.data?.track ?? null;
  const switcher = (
    <TrackSwitcher
      tracks={choice.tracks}
      status={choice.status}
      chosen={shownTrack?.code ?? null}
      onChoose={choice.choose}
    />
  );
  const refresh = (
    <RefreshButton
      queries={mode === 'wide' ? [districts, region, run] : [districts, run]}
      what="the districts"
      testID="region-refresh"
    />
  );
  const header = (
    <>
      <RegionStrip run={run} track={track} />
      {refresh}
      {switcher}
      <MapListChoice value={view} onChange={setView} />
    </>
  );
  return (
    <>
      <Head>
        <title>Districts · Crestwatch</title>
        <script>{EARLY}</script>
      </Head>
      {mode === 'wide' ? (
        <RegionOverview
          region={region}
          districts={districts}
          map={<RegionMap districts={districts} track={shownTrack} />}
          refresh={refresh}
        />
      ) : view === 'map' ? (
        <MapPhoneView header={header} districts={districts} track={shownTrack} />
      ) : (
        <DistrictListPanel districts={districts} level={level} header={header} track={track} />
      )}
    </>
  );
}
