import Head from 'expo-router/head';

import { IndicatorSources } from '@/components/method/indicator-sources';
import { MethodView } from '@/components/method/method-view';
import { useIndicatorsQuery } from '@/hooks/use-indicators';
import { useLayoutMode } from '@/hooks/use-layout-mode';
import { useTracksQuery } from '@/hooks/use-tracks';

/** How Crestwatch estimates: formulas, references, cautions, the demo region. */
export default function MethodScreen() {
  const mode = useLayoutMode();
  const indicators = useIndicatorsQuery();
  const tracks = useTracksQuery();
  return (
    <>
      <Head>
        <title>Method · Crestwatch</title>
      </Head>
      <MethodView
        showBackLink={mode === 'phone'}
        sources={<IndicatorSources indicators={indicators} tracks={tracks.data ?? []} />}
      />
    </>
  );
}
