import { Link } from 'expo-router';
import { StyleSheet, Text, View } from 'react-native';

import { colors, space, type } from '@/components/theme';
import { focusOutline, type InteractionState } from '@/components/ui/interaction';
import { LinkTarget } from '@/components/ui/link-target';

import { CrestMark } from './crest-mark';

/** The bar across the top: the product's mark, a link home. */
export function AppHeader() {
  return (
    <View style={styles.bar} role="banner">
      <Link href="/" asChild>
        <LinkTarget
          accessibilityRole="link"
          accessibilityLabel="Crestwatch, region list"
          stateStyle={(state: InteractionState) => [styles.home, focusOutline(state)]}
        >
          <CrestMark size={22} />
          <Text style={styles.word}>Crestwatch</Text>
        </LinkTarget>
      </Link>
      <Text style={styles.tagline} numberOfLines={1}>
        District emissions and income
      </Text>
    </View>
  );
}

const styles = StyleSheet.create({
  bar: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.md,
    paddingHorizontal: space.lg,
    minHeight: 52,
    backgroundColor: colors.text,
  },
  home: { flexDirection: 'row', alignItems: 'center', gap: space.sm, minHeight: 44, paddingHorizontal: space.xs },
  word: { ...type.title, color: colors.surface },
  tagline: { ...type.caption, color: colors.border, flexShrink: 1 },
});
