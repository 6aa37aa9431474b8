import type { ReactNode } from 'react';
import { StyleSheet, Text, View } from 'react-native';

import { StandingBadge } from '@/components/region/standing-mark';
import { colors, radius, space, standingColors, type } from '@/components/theme';
import type { EstimateRecord } from '@/contracts/estimates';
import { SHAPE_LABEL, SHAPE_TECHNICAL, shapeWords, STANDING_MEANING } from '@/lib/estimate-words';
import { headline, headlineInputFromRecord } from '@/lib/headline';

export type HeadlinePanelProps = {
  record: EstimateRecord;
  /** The brief link and the subscribe toggle. */
  actions?: ReactNode;
  /** The driver's unit from the catalogue (the run meta's units). */
  incomeUnit?: string;
  /** The track's indicator as the catalogue names it (the run meta's units); omitted: "emissions". */
  pressure?: string;
};

/** The card's top: standing (mark and word), the headline sentence, its notes, actions. */
export function HeadlinePanel({ record, actions, incomeUnit, pressure }: HeadlinePanelProps) {
  const h = headline({ ...headlineInputFromRecord(record), incomeUnit, pressure });
  const standing = record.standing.standing;
  const shape = record.shape?.shape ?? null;
  return (
    <View
      style={[styles.panel, { borderLeftColor: standingColors[standing] }, h.tone === 'caution' && styles.caution]}
      testID="headline-panel"
    >
      <View style={styles.badges}>
        <StandingBadge standing={standing} size={16} />
        {shape ? (
          <Text style={styles.shape} testID="card-shape">
            {shape === 'flat'
              ? shapeWords(shape, record.model.alpha)
              : `${SHAPE_LABEL[shape]} (${SHAPE_TECHNICAL[shape]})`}
          </Text>
        ) : null}
        {record.status === 'substitute' ? (
          <Text style={styles.substitute} testID="substitute-label">
            Regional substitute
          </Text>
        ) : null}
      </View>
      <Text style={styles.sentence} testID="card-headline" role="heading" aria-level={2}>
        {h.sentence}
      </Text>
      {h.notes.map((n) => (
        <Text key={n} style={styles.note}>
          {n}
        </Text>
      ))}
      <Text style={styles.meaning}>{STANDING_MEANING[standing]}</Text>
      {actions ? <View style={styles.actions}>{actions}</View> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  panel: {
    backgroundColor: colors.surface,
    borderColor: colors.border,
    borderWidth: 1,
    borderLeftWidth: 6,
    borderRadius: radius.lg,
    padding: space.lg,
    gap: space.sm,
  },
  caution: { borderStyle: 'solid' },
  badges: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.md },
  shape: { ...type.label, color: colors.textMuted },
  substitute: {
    ...type.label,
    color: colors.danger,
    borderColor: colors.danger,
    borderWidth: 1,
    borderRadius: radius.pill,
    paddingHorizontal: space.sm,
  },
  sentence: { ...type.title, color: colors.text },
  note: { ...type.body, color: colors.text },
  meaning: { ...type.caption, color: colors.textMuted },
  actions: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.md, marginTop: space.xs },
});
