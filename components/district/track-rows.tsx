// The compact rows at the top of a district card: one per open track (mark, standing word,
// gap), the chosen one marked; pressing a row shows that track's full card below.
import { Pressable, StyleSheet, Text, View } from 'react-native';

import { StandingMark } from '@/components/region/standing-mark';
import { colors, layout, radius, space, standingColors, type } from '@/components/theme';
import { focusOutline, type InteractionState } from '@/components/ui/interaction';
import { WORD_BREAK } from '@/components/ui/word-break';
import type { TrackStanding } from '@/contracts/estimates';
import { gapShort, gapWords, STANDING_LABEL } from '@/lib/estimate-words';

export type TrackRowsProps = {
  rows: TrackStanding[];
  /** the track whose full card is shown below */
  chosen: string;
  onChoose: (code: string) => void;
};

function statusWords(row: TrackStanding): string {
  if (row.runId === null) return 'No published run yet';
  if (row.standing === null) return 'Not in its published run';
  return STANDING_LABEL[row.standing];
}

function shownGap(row: TrackStanding): string {
  return row.gapPercent !== null && row.standing !== null ? `gap ${gapShort(row.gapPercent)}` : '';
}

/** Starts with the words the row shows, in order (WCAG 2.2 SC 2.5.3 Label in Name), then the gap in words. */
function rowLabel(row: TrackStanding, chosen: boolean): string {
  const gap =
    row.gapPercent !== null && row.standing !== null && row.standing !== 'not_estimable'
      ? `: income ${gapWords(row.gapPercent)} the threshold`
      : '';
  const shown = [row.name, row.indicator.unit, statusWords(row), shownGap(row)].filter(Boolean).join(', ');
  return `${shown}${gap}${chosen ? ', shown below' : ''}`;
}

/** "Every watched indicator here": a row per track, the headline first (the server's order). */
export function TrackRows({ rows, chosen, onChoose }: TrackRowsProps) {
  if (rows.length === 0) return null;
  return (
    <View style={styles.box} testID="track-rows">
      <Text role="heading" aria-level={2} style={styles.title}>
        Every watched indicator here
      </Text>
      {rows.map((row) => {
        const on = row.code === chosen;
        return (
          <Pressable
            key={row.code}
            testID={`track-row-${row.code}`}
            accessibilityRole="button"
            accessibilityState={{ selected: on }}
            aria-current={on ? 'true' : undefined}
            accessibilityLabel={rowLabel(row, on)}
            onPress={() => onChoose(row.code)}
            style={(state: InteractionState) => [
              styles.row,
              on && styles.on,
              state.hovered && !on && styles.hover,
              focusOutline(state, 'inside'),
            ]}
          >
            <View style={styles.mark}>
              {row.standing ? (
                <StandingMark standing={row.standing} size={12} decorative />
              ) : (
                <Text style={styles.none}>–</Text>
              )}
            </View>
            <View style={styles.name}>
              <Text style={styles.trackName}>
                {row.name}
                {WORD_BREAK}
              </Text>
              <Text style={styles.unit}>
                {row.indicator.unit}
                {WORD_BREAK}
              </Text>
            </View>
            <Text
              style={[styles.standing, row.standing ? { color: standingColors[row.standing] } : styles.muted]}
              testID={`track-row-${row.code}-standing`}
            >
              {statusWords(row)}
              {WORD_BREAK}
            </Text>
            <Text style={styles.gap} testID={`track-row-${row.code}-gap`}>
              {shownGap(row)}
            </Text>
          </Pressable>
        );
      })}
    </View>
  );
}

const styles = StyleSheet.create({
  box: {
    borderWidth: 1,
    borderColor: colors.border,
    borderRadius: radius.lg,
    backgroundColor: colors.surface,
    overflow: 'hidden',
  },
  title: {
    ...type.label,
    color: colors.textMuted,
    paddingHorizontal: space.md,
    paddingTop: space.sm,
    paddingBottom: space.xs,
  },
  row: {
    minHeight: layout.touchTarget,
    flexDirection: 'row',
    // With a large text size the standing and the gap move under the name.
    flexWrap: 'wrap',
    alignItems: 'center',
    gap: space.sm,
    paddingHorizontal: space.md,
    paddingVertical: space.xs,
    borderTopWidth: 1,
    borderTopColor: colors.border,
    borderLeftWidth: 4,
    borderLeftColor: colors.transparent,
  },
  on: { backgroundColor: colors.selected, borderLeftColor: colors.selectedRule },
  hover: { backgroundColor: colors.background },
  mark: { width: 16, alignItems: 'center' },
  none: { ...type.label, color: colors.textMuted },
  name: { flexGrow: 1, flexShrink: 1, flexBasis: 120, minWidth: 0 },
  trackName: { ...type.bodyStrong, color: colors.text },
  unit: { ...type.caption, color: colors.textMuted },
  standing: { ...type.label, flexShrink: 1, textAlign: 'right' },
  muted: { color: colors.textMuted },
  gap: { ...type.numeric, color: colors.text, minWidth: 64, textAlign: 'right' },
});
