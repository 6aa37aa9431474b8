import { StyleSheet, View } from 'react-native';

import { Skeleton } from '@/components/state/skeleton';
import { colors, radius, space } from '@/components/theme';

const TABLE_ROWS = 10;

/** Header and table placeholders at the size of the loaded screen. */
export function DistrictDetailSkeleton() {
  return (
    <View
      style={styles.wrap}
      testID="district-detail-loading"
      accessible
      accessibilityLabel="Loading the district"
    >
      <View style={styles.header}>
        <Skeleton width={220} height={34} />
        <Skeleton width={260} height={18} />
      </View>
      <View style={styles.section}>
        <Skeleton width={140} height={24} />
        <View style={styles.table}>
          <View style={[styles.row, styles.headRow]} />
          {Array.from({ length: TABLE_ROWS }, (_, i) => (
            <View key={i} style={styles.row}>
              <Skeleton width={40} height={14} />
              <Skeleton width="18%" height={14} />
              <Skeleton width="18%" height={14} />
              <Skeleton width="18%" height={14} />
              <Skeleton width="18%" height={14} />
            </View>
          ))}
        </View>
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.xl },
  header: { gap: space.sm },
  // Same gaps and row heights as DistrictDetailView's section and SeriesTable.
  section: { gap: space.md },
  table: {
    backgroundColor: colors.surface,
    borderColor: colors.border,
    borderWidth: 1,
    borderRadius: radius.md,
    overflow: 'hidden',
  },
  headRow: { height: 50, backgroundColor: colors.surfaceSunken },
  row: {
    minHeight: 36,
    flexDirection: 'row',
    alignItems: 'center',
    justifyContent: 'space-between',
    paddingHorizontal: space.sm,
  },
});
