import { StyleSheet, View } from 'react-native';

import { Skeleton } from '@/components/state/skeleton';
import { colors, layout, space } from '@/components/theme';

/** Stands in for a DistrictRow while the list loads: same height, same blocks. */
export function DistrictRowSkeleton({ index, height = layout.districtRowHeight }: { index: number; height?: number }) {
  // Vary the name width a little so the placeholder does not read as a pattern.
  const nameWidth = 96 + ((index * 37) % 80);
  return (
    <View style={[styles.row, { height }]}>
      <View style={styles.main}>
        <Skeleton width={nameWidth} height={18} />
        <Skeleton width={112} height={14} />
        <Skeleton width={84} height={12} />
      </View>
      <View style={styles.values}>
        <Skeleton width={48} height={16} />
        <Skeleton width={28} height={12} />
        <Skeleton width={64} height={12} />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  row: {
    height: layout.districtRowHeight,
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.md,
    paddingHorizontal: space.lg,
    borderBottomWidth: 1,
    borderBottomColor: colors.border,
    borderLeftWidth: 4,
    borderLeftColor: colors.transparent,
    backgroundColor: colors.surface,
  },
  main: { flex: 1, gap: space.xs },
  values: { alignItems: 'flex-end', gap: space.xxs, minWidth: 76 },
});
