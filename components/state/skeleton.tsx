import { StyleSheet, View, type DimensionValue } from 'react-native';

import { colors, radius } from '@/components/theme';

export type SkeletonProps = { width: DimensionValue; height: number; rounded?: boolean };

/** A placeholder block the size of the content it stands for. Hidden from screen readers. */
export function Skeleton({ width, height, rounded = false }: SkeletonProps) {
  return (
    <View
      aria-hidden
      importantForAccessibility="no-hide-descendants"
      style={[styles.block, { width, height }, rounded && styles.rounded]}
    />
  );
}

const styles = StyleSheet.create({
  block: { backgroundColor: colors.skeleton, borderRadius: radius.sm },
  rounded: { borderRadius: radius.pill },
});
