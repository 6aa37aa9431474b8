import { Suspense, useState, type ReactNode } from 'react';
import { StyleSheet, Text, View, type LayoutChangeEvent } from 'react-native';

import { chartColors, colors, radius, space, type } from '@/components/theme';
import { useHydrated } from '@/hooks/use-hydrated';

export type ChartFrameProps = {
  title: string;
  /** The chart in words: the drawing's accessible name and the visible caption. */
  summary: string;
  height: number;
  /** Axis titles as text around the drawing (a large text setting; otherwise the drawing has them). */
  axisTitles?: { x: string; y: string };
  testID: string;
  /** Drawn below the chart: the key to its marks. */
  legend?: ReactNode;
  /** The drawing for a measured width; rendered only after mount. */
  children: (width: number) => ReactNode;
};

/**
 * A chart's frame: heading, a box of fixed height that shows a quiet placeholder until the
 * page has mounted and measured it (charts do not pre-render identically, and the SVG code
 * loads on its own), the legend, and the chart in words.
 */
export function ChartFrame({ title, summary, height, axisTitles, testID, legend, children }: ChartFrameProps) {
  const [width, setWidth] = useState(0);
  const mounted = useHydrated();
  const onLayout = (e: LayoutChangeEvent) => {
    const w = Math.round(e.nativeEvent.layout.width);
    if (w !== width) setWidth(w);
  };
  const placeholder = <View style={[styles.placeholder, { height }]} testID={`${testID}-placeholder`} aria-hidden />;
  return (
    <View style={styles.wrap} testID={testID}>
      <Text role="heading" aria-level={3} style={styles.title}>
        {title}
      </Text>
      {axisTitles ? (
        <Text style={styles.axisTitle} testID={`${testID}-y-title`}>
          <Text aria-hidden>↑ </Text>
          {axisTitles.y}
        </Text>
      ) : null}
      <View
        style={[styles.box, { height }]}
        onLayout={onLayout}
        role="img"
        aria-label={summary}
        testID={`${testID}-box`}
      >
        {/* The box is the image and carries its words; the drawing inside is hidden from
            assistive technology (else its own svg role="img" would be an image with no name). */}
        <View aria-hidden style={styles.drawing}>
          {mounted && width > 0 ? <Suspense fallback={placeholder}>{children(width)}</Suspense> : placeholder}
        </View>
      </View>
      {axisTitles ? (
        <Text style={[styles.axisTitle, styles.xTitle]} testID={`${testID}-x-title`}>
          {axisTitles.x}
          <Text aria-hidden> →</Text>
        </Text>
      ) : null}
      {legend}
      <Text style={styles.summary} testID={`${testID}-summary`}>
        <Text style={styles.summaryTerm}>In words: </Text>
        {summary}
      </Text>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.sm },
  title: { ...type.bodyStrong, color: colors.text },
  box: {
    backgroundColor: chartColors.surface,
    borderColor: colors.border,
    borderWidth: 1,
    borderRadius: radius.md,
    overflow: 'hidden',
  },
  drawing: { flex: 1 },
  placeholder: { backgroundColor: colors.surface },
  axisTitle: { ...type.label, color: chartColors.axis },
  xTitle: { textAlign: 'right' },
  summary: { ...type.caption, color: colors.textMuted },
  summaryTerm: { fontFamily: type.label.fontFamily, color: colors.text },
});
