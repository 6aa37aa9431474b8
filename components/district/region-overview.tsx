import { StyleSheet, Text, View } from 'react-native';

import { CautionNote } from '@/components/district/caution-note';
import type { QueryState } from '@/components/state/query-state';
import { Skeleton } from '@/components/state/skeleton';
import { colors, layout, radius, space, type } from '@/components/theme';
import type { DistrictSummary } from '@/lib/api-types';
import { formatYearSpan } from '@/lib/format';

/**
 * The right-hand side of the wide home screen, before a district is chosen: what the
 * region holds and how to start. (Counts per standing join it once runs exist.)
 */
export function RegionOverview({ districts }: { districts: QueryState<DistrictSummary[]> }) {
  const all = districts.data;
  return (
    <View style={styles.wrap} testID="region-overview">
      <View style={styles.card}>
        <Text role="heading" aria-level={1} style={styles.title}>
          The region at a glance
        </Text>
        {districts.status === 'pending' ? (
          <Skeleton width={280} height={22} />
        ) : all ? (
          <Text style={styles.facts}>{regionFacts(all)}</Text>
        ) : (
          <Text style={styles.facts}>The district list could not be loaded.</Text>
        )}
        <Text style={styles.hint}>
          Choose a district on the left to see its yearly emissions and income, gaps included.
        </Text>
      </View>
      <CautionNote />
    </View>
  );
}

function regionFacts(all: DistrictSummary[]): string {
  if (all.length === 0) return 'No districts are loaded yet.';
  const firsts = all.map((d) => d.firstYear).filter((y): y is number => y !== null);
  const lasts = all.map((d) => d.lastYear).filter((y): y is number => y !== null);
  const span = firsts.length ? formatYearSpan(Math.min(...firsts), Math.max(...lasts)) : null;
  const count = `${all.length} ${all.length === 1 ? 'district' : 'districts'}`;
  return span ? `${count} with yearly series from ${span}.` : `${count}, none with data yet.`;
}

const styles = StyleSheet.create({
  wrap: { padding: space.xl, gap: space.xl, maxWidth: layout.detailMaxWidth },
  card: {
    backgroundColor: colors.surface,
    borderColor: colors.border,
    borderWidth: 1,
    borderRadius: radius.lg,
    padding: space.xl,
    gap: space.md,
  },
  title: { ...type.heading, color: colors.text },
  facts: { ...type.bodyStrong, color: colors.text },
  hint: { ...type.body, color: colors.textMuted },
});
