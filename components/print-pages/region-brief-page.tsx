import Head from 'expo-router/head';

import { BriefScreen } from '@/components/brief/brief-screen';
import { RegionBriefView } from '@/components/brief/region-brief-view';
import { TextLink } from '@/components/ui/text-link';
import { briefPdfPath, useRegionBriefQuery } from '@/hooks/use-briefs';
import { useTrackChoice } from '@/hooks/use-tracks';

/** The region brief as a print-friendly page (the same content as its PDF). */
export function RegionBriefPage() {
  // The region brief is of one track: ?track=, else the device's, else the headline track.
  const track = useTrackChoice().request;
  const brief = useRegionBriefQuery(track);
  return (
    <>
      <Head>
        <title>Region brief · Crestwatch</title>
      </Head>
      <BriefScreen
        query={brief}
        what="region brief"
        pdfPath={briefPdfPath.region(track)}
        back={<TextLink href={track ? { pathname: '/', params: { track } } : '/'} label="Region" leading="← " />}
      >
        {(content) => <RegionBriefView content={content} />}
      </BriefScreen>
    </>
  );
}
