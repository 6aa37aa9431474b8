import { Link } from 'expo-router';
import { memo } from 'react';
import { StyleSheet, Text, View } from 'react-native';

import { colors, layout, space, type } from '@/components/theme';
import { focusOutline, type InteractionState } from '@/components/ui/interaction';
import { LinkTarget } from '@/components/ui/link-target';
import type { DistrictSummary } from '@/lib/api-types';

import { coverageText, districtRowLabel, latestValues } from './district-summary-text';

export type DistrictRowProps = {
  district: DistrictSummary;
  /** The district open beside the list (wide layout). */
  selected?: boolean;
};

/** One district in the region list: a link to its detail, always `districtRowHeight` tall. */
export const DistrictRow = memo(function DistrictRow({ district, selected = false }: DistrictRowProps) {
  const values = latestValues(district);
  return (
    <Link href={{ pathname: '/district/[code]', params: { code: district.code } }} asChild>
      <LinkTarget
        testID={`district-row-${district.code}`}
        accessibilityRole="link"
        accessibilityLabel={districtRowLabel(district)}
        accessibilityState={{ selected }}
        stateStyle={(state: InteractionState) => [
          styles.row,
          state.hovered && styles.hovered,
          selected && styles.selected,
          focusOutline(state, 'inside'),
        ]}
      >
        <View style={styles.main}>
          <View style={styles.titleLine}>
            <Text style={styles.name} numberOfLines={1}>
              {district.name}
            </Text>
            <Text style={styles.code}>{district.code}</Text>
          </View>
          <Text style={styles.coverage} numberOfLines={1}>
            {coverageText(district, 'compact')}
          </Text>
        </View>
        <View style={styles.values}>
          <Text style={styles.year}>{district.latest ? `Latest ${district.latest.year}` : 'No values yet'}</Text>
          {district.latest === null
            ? null
            : values.map((v) => (
                <View key={v.label} style={styles.value}>
                  {v.value === null ? (
                    <Text style={styles.noValue}>no data</Text>
                  ) : (
                    <Text style={styles.number} numberOfLines={1}>
                      {v.value}
                    </Text>
                  )}
                  <Text style={styles.unit} numberOfLines={1}>
                    {v.unit}
                  </Text>
                </View>
              ))}
        </View>
      </LinkTarget>
    </Link>
  );
});

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
  hovered: { backgroundColor: colors.background },
  selected: { backgroundColor: colors.selected, borderLeftColor: colors.selectedRule },
  main: { flex: 1, minWidth: 0, gap: space.xxs },
  titleLine: { flexDirection: 'row', alignItems: 'baseline', gap: space.sm },
  name: { ...type.bodyStrong, color: colors.text, flexShrink: 1 },
  code: { ...type.label, color: colors.textMuted },
  coverage: { ...type.caption, color: colors.textMuted },
  values: { alignItems: 'flex-end', gap: space.xxs, maxWidth: '48%' },
  value: { flexDirection: 'row', alignItems: 'baseline', gap: space.xs },
  number: { ...type.numeric, color: colors.text },
  noValue: { ...type.caption, color: colors.gapText, backgroundColor: colors.gapFill, paddingHorizontal: space.xs },
  unit: { ...type.caption, color: colors.textMuted },
  year: { ...type.caption, color: colors.textMuted },
});
