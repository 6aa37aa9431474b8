import { StyleSheet, Text, View } from 'react-native';

import { chartColors, colors, space, type } from '@/components/theme';

export type LegendItem = {
  key: string;
  label: string;
  /** How the swatch looks: a dot, a solid line, a dashed line, a filled band, a ringed dot. */
  swatch: 'dot' | 'line' | 'dash' | 'band' | 'ring';
  color: string;
};

/** The key to a chart's marks, as text with small drawn swatches (never colour alone). */
export function ChartLegend({ items }: { items: LegendItem[] }) {
  return (
    <View style={styles.legend}>
      {items.map((i) => (
        <View key={i.key} style={styles.item} testID={`legend-${i.key}`}>
          <Swatch kind={i.swatch} color={i.color} />
          <Text style={styles.label}>{i.label}</Text>
        </View>
      ))}
    </View>
  );
}

function Swatch({ kind, color }: { kind: LegendItem['swatch']; color: string }) {
  switch (kind) {
    case 'dot':
      return <View aria-hidden style={[styles.dot, { backgroundColor: color }]} />;
    case 'ring':
      return <View aria-hidden style={[styles.ring, { borderColor: color }]} />;
    case 'line':
      return <View aria-hidden style={[styles.line, { backgroundColor: color }]} />;
    case 'dash':
      return (
        <View aria-hidden style={styles.dashes}>
          {[0, 1, 2].map((k) => (
            <View key={k} style={[styles.dash, { backgroundColor: color }]} />
          ))}
        </View>
      );
    default:
      return <View aria-hidden style={[styles.band, { backgroundColor: color, borderColor: chartColors.threshold }]} />;
  }
}

const styles = StyleSheet.create({
  legend: { flexDirection: 'row', flexWrap: 'wrap', columnGap: space.lg, rowGap: space.xs },
  item: { flexDirection: 'row', alignItems: 'center', gap: space.xs, flexShrink: 1, maxWidth: '100%' },
  label: { ...type.caption, color: colors.text, flexShrink: 1 },
  dot: { width: 8, height: 8, borderRadius: 4 },
  ring: { width: 12, height: 12, borderRadius: 6, borderWidth: 3 },
  line: { width: 20, height: 3, borderRadius: 1 },
  dashes: { flexDirection: 'row', gap: 2, width: 20 },
  dash: { width: 5, height: 2 },
  band: { width: 16, height: 12, borderLeftWidth: 1, borderRightWidth: 1 },
});
