import { StyleSheet, View } from 'react-native';

import { colors } from '@/components/theme';

/**
 * Crestwatch's mark: three rising bars and a falling one — a ridge seen side-on, the shape
 * the product looks for in a district's series. Drawn with views so it needs no image.
 */
export function CrestMark({ size }: { size: number }) {
  const bar = Math.max(2, Math.round(size / 6));
  const heights = [0.45, 0.75, 1, 0.6];
  return (
    <View aria-hidden style={[styles.mark, { width: size, height: size, gap: bar / 2 }]}>
      {heights.map((h, i) => (
        <View key={i} style={[styles.bar, { width: bar, height: Math.round(size * h) }, i === 2 && styles.peak]} />
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  mark: { flexDirection: 'row', alignItems: 'flex-end', justifyContent: 'center' },
  bar: { backgroundColor: colors.selected, borderTopLeftRadius: 1, borderTopRightRadius: 1 },
  peak: { backgroundColor: colors.focus },
});
