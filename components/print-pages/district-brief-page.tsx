import { useLocalSearchParams } from '@/lib/router';
import Head from 'expo-router/head';

import { BriefScreen } from '@/components/brief/brief-screen';
import { DistrictBriefView } from '@/components/brief/district-brief-view';
import { TextLink } from '@/components/ui/text-link';
import { briefPdfPath, useDistrictBriefQuery } from '@/hooks/use-briefs';
import { useTrackChoice } from '@/hooks/use-tracks';

/** A district's brief as a print-friendly page (the same content as its PDF). */
export function DistrictBriefPage() {
  const params = useLocalSearchParams<{ code: string }>();
  const code = typeof params.code === 'string' ? params.code : '';
  // The brief is of one track: ?track=, else the device's, else the headline track.
  const track = useTrackChoice().request;
  const brief = useDistrictBriefQuery(code, track);
  const name = brief.data?.name;
  return (
    <>
      <Head>
        <title>{name ? `Brief: ${name} (${code}) · Crestwatch` : `Brief ${code} · Crestwatch`}</title>
      </Head>
      <BriefScreen
        query={brief}
        what={`district brief of ${name ?? code}`}
        pdfPath={briefPdfPath.district(code, track)}
        back={
          <TextLink
            href={{ pathname: '/district/[code]', params: track ? { code, track } : { code } }}
            label="District card"
            leading="← "
          />
        }
      >
        {(content) => <DistrictBriefView content={content} />}
      </BriefScreen>
    </>
  );
}
