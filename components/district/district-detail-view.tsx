import type { ReactNode } from 'react';
import { ScrollView, StyleSheet, Text, View } from 'react-native';

import { QueryErrorPanel } from '@/components/state/query-error-panel';
import type { QueryState } from '@/components/state/query-state';
import { StatePanel } from '@/components/state/state-panel';
import { colors, layout, space, type } from '@/components/theme';
import { TextLink } from '@/components/ui/text-link';
import { ApiError } from '@/lib/api-client';
import type { DistrictDetailResponse } from '@/lib/api-types';

import { CautionNote } from './caution-note';
import { DistrictDetailSkeleton } from './district-detail-skeleton';
import { DistrictHeader } from './district-header';
import { SeriesTable } from './series-table';

export type DistrictDetailViewProps = {
  code: string;
  detail: QueryState<DistrictDetailResponse>;
  /** Phone layout: a link back to the region list above the content. */
  showBackLink: boolean;
};

/**
 * One district: header, the yearly series, the cautions. Sections stack in a scroll view;
 * the district card's headline, charts and sensitivity strip go between header and table.
 */
export function DistrictDetailView({ code, detail, showBackLink }: DistrictDetailViewProps) {
  return (
    <ScrollView style={styles.scroll} contentContainerStyle={styles.content} testID="district-detail-scroll">
      <View style={styles.column}>
        {showBackLink ? <TextLink href="/" label="All districts" leading="← " /> : null}
        <DetailBody code={code} detail={detail} showBackLink={showBackLink} />
      </View>
    </ScrollView>
  );
}

function DetailBody({ code, detail, showBackLink }: DistrictDetailViewProps): ReactNode {
  if (detail.status === 'pending') return <DistrictDetailSkeleton />;
  if (detail.status === 'error') {
    if (detail.error instanceof ApiError && detail.error.code === 'not_found') {
      return (
        <StatePanel
          testID="district-not-found"
          title={`No district with code ${code}`}
          message={
            showBackLink
              ? 'The code may be mistyped, or the district was renamed. Find it in the region list.'
              : 'The code may be mistyped, or the district was renamed. Pick one from the list.'
          }
        >
          {showBackLink ? <TextLink href="/" label="Go to the region list" /> : null}
        </StatePanel>
      );
    }
    return (
      <QueryErrorPanel
        testID="district-detail-error"
        what={`district ${code}`}
        error={detail.error}
        retrying={detail.isFetching}
        onRetry={() => void detail.refetch()}
      />
    );
  }
  const data = detail.data;
  if (!data) return null;
  return (
    <>
      <DistrictHeader district={data.district} />
      <Section title="Yearly values">
        {data.series.length === 0 ? (
          <StatePanel
            testID="district-series-empty"
            title="No yearly values yet"
            message="This district is registered but has no observations. They appear once an upload with its series is applied."
          />
        ) : (
          <SeriesTable districtName={data.district.name} series={data.series} indicators={data.indicators} />
        )}
      </Section>
      <CautionNote />
    </>
  );
}

function Section({ title, children }: { title: string; children: ReactNode }) {
  return (
    <View style={styles.section}>
      <Text role="heading" aria-level={2} style={styles.sectionTitle}>
        {title}
      </Text>
      {children}
    </View>
  );
}

const styles = StyleSheet.create({
  scroll: { flex: 1, backgroundColor: colors.background },
  content: { padding: space.lg, paddingBottom: space.xxxl },
  column: { width: '100%', maxWidth: layout.detailMaxWidth, gap: space.xl },
  section: { gap: space.md },
  sectionTitle: { ...type.title, color: colors.text },
});
