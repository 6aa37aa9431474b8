import { StyleSheet, Text, View } from 'react-native';

import { colors, space, standingColors, type } from '@/components/theme';
import type { DistrictBriefContent } from '@/contracts/briefs';

import { BriefChart } from './brief-chart';
import { BriefHeading, BriefTop, Cautions, FigureGrid, keepTogether, ModelLine, TraceFooter } from './brief-sections';

/** The district brief as a page: the same content, words and figures as its PDF. */
export function DistrictBriefView({ content: c }: { content: DistrictBriefContent }) {
  const tone = standingColors[c.standing.key as keyof typeof standingColors] ?? colors.action;
  return (
    <View style={styles.page} testID="district-brief">
      <BriefTop subtitle={c.subtitle} />
      <Text role="heading" aria-level={1} style={styles.name}>
        {c.name}
      </Text>
      <View style={styles.standingRow}>
        <Text style={[styles.chip, { backgroundColor: tone }]} testID="brief-standing">
          {c.standing.label}
        </Text>
        {c.standing.note ? <Text style={styles.note}>{c.standing.note}</Text> : null}
      </View>
      <Text style={styles.headline}>{c.headline}</Text>
      <FigureGrid figures={c.figures} testID="brief-figures" />
      {c.locator ? (
        <View style={styles.locator}>
          <BriefChart scene={c.locator} testID="brief-locator" />
        </View>
      ) : null}
      <View style={styles.charts} {...keepTogether}>
        <BriefChart scene={c.charts.curve} testID="brief-curve-chart" />
        <BriefChart scene={c.charts.path} testID="brief-path-chart" />
      </View>
      {c.substitute ? <Text style={styles.substitute}>{c.substitute}</Text> : null}
      <View style={styles.block} {...keepTogether}>
        <BriefHeading>Reading</BriefHeading>
        {c.reading.map((line) => (
          <Text key={line} style={styles.reading}>
            • {line}
          </Text>
        ))}
      </View>
      {c.correctionNotice ? (
        <View style={styles.block} {...keepTogether} testID="brief-correction">
          <BriefHeading>Correction</BriefHeading>
          <Text style={styles.reading}>{c.correctionNotice}</Text>
        </View>
      ) : null}
      {c.analystNote ? (
        <View style={styles.block} {...keepTogether}>
          <BriefHeading>Analyst’s note for this run</BriefHeading>
          <Text style={styles.reading}>{c.analystNote}</Text>
        </View>
      ) : null}
      <ModelLine text={c.modelLine} />
      <Cautions cautions={c.cautions} />
      <TraceFooter trace={c.trace} />
    </View>
  );
}

const styles = StyleSheet.create({
  locator: { width: 180, maxWidth: '100%' },
  page: { gap: space.md },
  name: { ...type.heading, color: colors.text },
  standingRow: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.sm },
  chip: {
    ...type.caption,
    fontFamily: type.label.fontFamily,
    color: colors.onAction,
    textTransform: 'uppercase',
    paddingHorizontal: space.sm,
    paddingVertical: space.xxs,
    borderRadius: 4,
    overflow: 'hidden',
  },
  note: { ...type.caption, fontFamily: type.label.fontFamily, color: colors.danger },
  headline: { ...type.body, color: colors.text },
  charts: { flexDirection: 'row', flexWrap: 'wrap', gap: space.lg },
  substitute: { ...type.caption, fontFamily: type.label.fontFamily, color: colors.danger },
  block: { gap: space.xs },
  reading: { ...type.body, color: colors.text },
});
