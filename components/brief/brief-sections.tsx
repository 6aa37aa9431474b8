// The pieces every brief view shares: the top line, the figures, the cautions, the model
// line and the trace. They show the brief content as the server worded and rounded it.
import { StyleSheet, Text, View } from 'react-native';

import { colors, radius, space, type } from '@/components/theme';
import type { BriefFigure, BriefTrace } from '@/contracts/briefs';

/** Marks a block the printed page should not split (see brief-frame.web.tsx). */
export const keepTogether = { dataSet: { briefBlock: 'keep' } } as object;

export function BriefTop({ subtitle }: { subtitle: string }) {
  return (
    <View style={styles.top}>
      <Text style={styles.brand}>Crestwatch</Text>
      <Text style={styles.subtitle}>{subtitle}</Text>
    </View>
  );
}

export function FigureGrid({ figures, testID }: { figures: BriefFigure[]; testID?: string }) {
  return (
    <View style={styles.grid} testID={testID} {...keepTogether}>
      {figures.map((f) => (
        <View key={f.key} style={styles.cell} testID={`brief-figure-${f.key}`}>
          <Text style={styles.label}>{f.label}</Text>
          <Text style={styles.value}>{f.value}</Text>
          {f.detail ? <Text style={styles.detail}>{f.detail}</Text> : null}
        </View>
      ))}
    </View>
  );
}

export function BriefHeading({ children }: { children: string }) {
  return (
    <Text role="heading" aria-level={2} style={styles.heading}>
      {children}
    </Text>
  );
}

export function Cautions({ cautions }: { cautions: string[] }) {
  return (
    <View style={styles.cautions} role="note" testID="brief-cautions" {...keepTogether}>
      <Text style={styles.cautionsTitle}>Read with care</Text>
      {cautions.map((c) => (
        <Text key={c} style={styles.caution}>
          • {c}
        </Text>
      ))}
    </View>
  );
}

export function ModelLine({ text }: { text: string }) {
  return (
    <Text style={styles.model}>
      <Text style={styles.modelTerm}>Model. </Text>
      {text}
    </Text>
  );
}

export function TraceFooter({ trace }: { trace: BriefTrace }) {
  return (
    <View style={styles.trace} testID="brief-trace">
      <Text style={styles.traceText}>{trace.line}</Text>
      <Text style={styles.traceText}>
        Generated on {trace.generatedAt} from this published run only; figures rounded for reading, intervals outward.
      </Text>
    </View>
  );
}

const styles = StyleSheet.create({
  top: {
    flexDirection: 'row',
    flexWrap: 'wrap',
    justifyContent: 'space-between',
    alignItems: 'baseline',
    gap: space.sm,
    borderBottomWidth: 2,
    borderBottomColor: colors.action,
    paddingBottom: space.xs,
  },
  brand: { ...type.label, color: colors.action },
  subtitle: { ...type.caption, color: colors.textMuted },
  grid: { flexDirection: 'row', flexWrap: 'wrap', columnGap: space.lg, rowGap: space.md },
  cell: { flexGrow: 1, flexBasis: 200, gap: space.xxs },
  label: {
    ...type.caption,
    fontFamily: type.label.fontFamily,
    color: colors.textMuted,
    textTransform: 'uppercase',
    letterSpacing: 0.4,
  },
  value: { ...type.title, color: colors.text },
  detail: { ...type.caption, color: colors.textMuted },
  heading: { ...type.bodyStrong, color: colors.text },
  cautions: {
    backgroundColor: colors.surfaceSunken,
    borderLeftWidth: 3,
    borderLeftColor: colors.danger,
    borderRadius: radius.sm,
    padding: space.md,
    gap: space.xs,
  },
  cautionsTitle: { ...type.label, color: colors.danger },
  caution: { ...type.caption, color: colors.text },
  model: { ...type.caption, color: colors.textMuted },
  modelTerm: { fontFamily: type.label.fontFamily, color: colors.text },
  trace: { borderTopWidth: 1, borderTopColor: colors.border, paddingTop: space.xs, gap: space.xxs },
  traceText: { ...type.caption, color: colors.textMuted },
});
