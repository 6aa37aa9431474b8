import { StyleSheet, Text, View } from 'react-native';

import { colors, space, type } from '@/components/theme';
import { TextLink } from '@/components/ui/text-link';
import { CAUTIONS } from '@/lib/cautions';

/** The first caution, kept as one text for places that quote it whole. */
export const CAUTION_TEXT = CAUTIONS[0].short;

/** The cautions every district view carries (docs/method.md), short, with the method page link. */
export function CautionNote({ withMethodLink = true }: { withMethodLink?: boolean }) {
  return (
    <View style={styles.note} role="note" testID="caution-note">
      <Text style={styles.title}>Read with care</Text>
      {CAUTIONS.map((c) => (
        <View key={c.key} style={styles.item}>
          <Text aria-hidden style={styles.bullet}>
            –
          </Text>
          <Text style={styles.text}>{c.short}</Text>
        </View>
      ))}
      {withMethodLink ? <TextLink href="/method" label="How Crestwatch estimates" leading="→ " /> : null}
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
  item: { flexDirection: 'row', gap: space.sm },
  bullet: { ...type.caption, color: colors.textMuted },
  text: { ...type.caption, color: colors.textMuted, flex: 1 },
});
