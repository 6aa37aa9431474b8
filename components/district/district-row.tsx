import { Link } from '@/lib/router';
import { memo } from 'react';
import { StyleSheet, Text, View } from 'react-native';

import { StandingBadge } from '@/components/region/standing-mark';
import { colors, layout, space, type } from '@/components/theme';
import { focusOutline, type InteractionState } from '@/components/ui/interaction';
import { LinkTarget } from '@/components/ui/link-target';
import { ScreenReaderText } from '@/components/ui/screen-reader-text';
import { WORD_BREAK } from '@/components/ui/word-break';
import type { RegionRow } from '@/lib/region-list';
import { standingOf } from '@/lib/region-list';

import { coverageText, crossingShort, gapColumn, standingSentence } from './district-summary-text';

export type DistrictRowProps = {
  district: RegionRow;
  /** The district open beside the list (wide layout). */
  selected?: boolean;
  /** The published run's confidence level, for "interval not bounded at 95%". */
  level?: number | null;
  /** Least row height: `districtRowHeight` times the reader's text scale; a long name wraps and the row grows. */
  height?: number;
  /** The chosen track (the card opens on it); null: the headline track. */
  track?: string | null;
};

/**
 * One district in the region list, at least `districtRowHeight` tall: name and code, its
 * standing (mark and word), the gap to its threshold, the projected crossing and the years
 * of data. A link to its card.
 */
export const DistrictRow = memo(function DistrictRow({
  district,
  selected = false,
  level = null,
  height = layout.districtRowHeight,
  track = null,
}: DistrictRowProps) {
  const e = district.estimate ?? null;
  const gap = gapColumn(e);
  const crossing = crossingShort(e);
  const unbounded = e?.intervalBounded === false && e.threshold !== null;
  const shownCoverage = district.lastYear === null ? 'No data yet' : `Data to ${district.lastYear}`;
  return (
    <Link
      href={{ pathname: '/district/[code]', params: track ? { code: district.code, track } : { code: district.code } }}
      asChild
    >
      <LinkTarget
        testID={`district-row-${district.code}`}
        accessibilityRole="link"
        accessibilityState={{ selected }}
        stateStyle={(state: InteractionState) => [
          styles.row,
          { minHeight: height },
          state.hovered && styles.hovered,
          selected && styles.selected,
          focusOutline(state, 'inside'),
        ]}
      >
        <View style={styles.main}>
          <View style={styles.titleLine}>
            <Text style={styles.name}>
              {district.name}
              {WORD_BREAK}
            </Text>
            <Text style={styles.code}>
              {district.code}
              {WORD_BREAK}
            </Text>
          </View>
          <View style={styles.standingLine}>
            <StandingBadge standing={standingOf(district)} compact />
            {e?.status === 'substitute' ? (
              <Text style={styles.tag} numberOfLines={1}>
                regional{WORD_BREAK}
              </Text>
            ) : null}
            {unbounded ? (
              <Text style={styles.tag} numberOfLines={1}>
                unbounded{WORD_BREAK}
              </Text>
            ) : null}
          </View>
          <Text style={styles.coverage}>
            {shownCoverage}
            {WORD_BREAK}
          </Text>
        </View>
        <View style={styles.values}>
          <Text style={styles.number} testID={`district-gap-${district.code}`}>
            {gap ?? '—'}
            {WORD_BREAK}
          </Text>
          <Text style={styles.unit}>gap{WORD_BREAK}</Text>
          <Text style={styles.crossing}>{crossing ?? 'no crossing'}</Text>
        </View>
        {/* The link's name is its words as shown (WCAG 2.2 SC 2.5.3 Label in Name), then the same in a sentence. */}
        <ScreenReaderText>{`. ${standingSentence(e, level)} Data ${coverageText(district)}.`}</ScreenReaderText>
      </LinkTarget>
    </Link>
  );
});

const styles = StyleSheet.create({
  row: {
    minHeight: layout.districtRowHeight,
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.md,
    paddingHorizontal: space.lg,
    paddingVertical: space.sm,
    borderBottomWidth: 1,
    borderBottomColor: colors.border,
    borderLeftWidth: 4,
    borderLeftColor: colors.transparent,
    backgroundColor: colors.surface,
  },
  hovered: { backgroundColor: colors.background },
  selected: { backgroundColor: colors.selected, borderLeftColor: colors.selectedRule },
  main: { flex: 1, minWidth: 0, gap: space.xxs },
  titleLine: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'baseline', columnGap: space.sm },
  name: { ...type.bodyStrong, color: colors.text, flexShrink: 1 },
  code: { ...type.label, color: colors.textMuted },
  standingLine: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.sm },
  tag: {
    ...type.caption,
    color: colors.textMuted,
    borderWidth: 1,
    borderColor: colors.border,
    paddingHorizontal: space.xs,
    borderRadius: 4,
  },
  coverage: { ...type.caption, color: colors.textMuted },
  values: { alignItems: 'flex-end', minWidth: 76, maxWidth: '45%' },
  number: { ...type.numeric, fontFamily: type.bodyStrong.fontFamily, color: colors.text },
  unit: { ...type.caption, color: colors.textMuted },
  crossing: { ...type.caption, color: colors.text, textAlign: 'right' },
});
