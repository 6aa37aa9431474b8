import { StyleSheet, Text, View } from 'react-native';

import { colors, space, type } from '@/components/theme';

/** The short form of the cautions every district view carries (DOMAIN.md, "Cautions"). */
export const CAUTION_TEXT =
  'These figures describe statistical associations in past data, not causal laws or forecasts. ' +
  'Crestwatch does not replace statutory air-quality standards, the agency’s official methodology, ' +
  'or the judgement of qualified staff; local rules prevail.';

export function CautionNote() {
  return (
    <View style={styles.note} role="note" testID="caution-note">
      <Text style={styles.title}>Read with care</Text>
      <Text style={styles.text}>{CAUTION_TEXT}</Text>
    </View>
  );
}

const styles = StyleSheet.create({
  note: {
    borderTopWidth: 1,
    borderTopColor: colors.border,
    paddingTop: space.lg,
    gap: space.xs,
  },
  title: { ...type.label, color: colors.text },
  text: { ...type.caption, color: colors.textMuted },
});
