import Head from 'expo-router/head';

import { BriefScreen } from '@/components/brief/brief-screen';
import { RegionBriefView } from '@/components/brief/region-brief-view';
import { TextLink } from '@/components/ui/text-link';
import { briefPdfPath, useRegionBriefQuery } from '@/hooks/use-briefs';

/** The region brief as a print-friendly page (the same content as its PDF). */
export default function RegionBriefScreen() {
  const brief = useRegionBriefQuery();
  return (
    <>
      <Head>
        <title>Region brief · Crestwatch</title>
      </Head>
      <BriefScreen
        query={brief}
        what="region brief"
        pdfPath={briefPdfPath.region()}
        back={<TextLink href="/" label="Region" leading="← " />}
      >
        {(content) => <RegionBriefView content={content} />}
      </BriefScreen>
    </>
  );
}
