import { StyleSheet, View } from 'react-native';

import { Skeleton } from '@/components/state/skeleton';
import { colors, layout, radius, space } from '@/components/theme';

/** The card's placeholders at the loaded card's sizes: header, headline, figures, both charts. */
export function DistrictCardSkeleton() {
  return (
    <View
      role="progressbar"
      style={styles.wrap}
      testID="district-detail-loading"
      accessible
      accessibilityLabel="Loading the district"
    >
      <View style={styles.header}>
        <Skeleton width={220} height={34} />
        <Skeleton width={260} height={22} />
      </View>
      <View style={[styles.panel, { minHeight: 196 }]}>
        <Skeleton width={150} height={22} />
        <Skeleton width="92%" height={24} />
        <Skeleton width="70%" height={24} />
        <Skeleton width="80%" height={22} />
        <Skeleton width={200} height={44} />
      </View>
      <View style={styles.grid}>
        {[0, 1, 2, 3].map((i) => (
          <View key={i} style={[styles.figure]}>
            <Skeleton width={90} height={18} />
            <Skeleton width={160} height={24} />
            <Skeleton width="85%" height={16} />
            <Skeleton width="70%" height={16} />
          </View>
        ))}
      </View>
      <View style={styles.chart}>
        <Skeleton width={180} height={22} />
        <View style={[styles.box, { height: layout.curveChartHeight }]} />
      </View>
      <View style={styles.chart}>
        <Skeleton width={180} height={22} />
        <View style={[styles.box, { height: layout.pathChartHeight }]} />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  // Same gaps as DistrictCardView's column and its parts.
  wrap: { gap: space.xl },
  header: { gap: space.xs },
  panel: {
    backgroundColor: colors.surface,
    borderColor: colors.border,
    borderWidth: 1,
    borderLeftWidth: 6,
    borderRadius: radius.lg,
    padding: space.lg,
    gap: space.sm,
  },
  grid: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md },
  figure: {
    flexGrow: 1,
    flexBasis: 300,
    minHeight: 104,
    backgroundColor: colors.surface,
    borderColor: colors.border,
    borderWidth: 1,
    borderRadius: radius.md,
    padding: space.md,
    gap: space.xs,
  },
  chart: { gap: space.sm },
  box: { backgroundColor: colors.surface, borderColor: colors.border, borderWidth: 1, borderRadius: radius.md },
});
