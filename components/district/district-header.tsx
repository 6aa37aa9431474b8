import { StyleSheet, Text, View } from 'react-native';

import { colors, radius, space, type } from '@/components/theme';
import type { DistrictDetailResponse } from '@/lib/api-types';

import { coverageText } from './district-summary-text';

export type DistrictHeaderProps = { district: DistrictDetailResponse['district'] };

/** Name, code and the years the series covers. */
export function DistrictHeader({ district }: DistrictHeaderProps) {
  return (
    <View style={styles.header}>
      <View style={styles.titleLine}>
        <Text role="heading" aria-level={1} style={styles.name} testID="district-name">
          {district.name}
        </Text>
        <View style={styles.codeBadge}>
          <Text style={styles.code} accessibilityLabel={`code ${district.code}`}>
            {district.code}
          </Text>
        </View>
      </View>
      <Text style={styles.coverage}>{coverageText(district)}</Text>
    </View>
  );
}

const styles = StyleSheet.create({
  header: { gap: space.xs },
  titleLine: { flexDirection: 'row', alignItems: 'center', flexWrap: 'wrap', gap: space.md },
  name: { ...type.display, color: colors.text },
  codeBadge: {
    borderColor: colors.action,
    borderWidth: 1,
    borderRadius: radius.pill,
    paddingHorizontal: space.sm,
    paddingVertical: space.xxs,
  },
  code: { ...type.label, color: colors.action },
  coverage: { ...type.body, color: colors.textMuted },
});
