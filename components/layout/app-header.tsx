import { Link } from '@/lib/router';
import type { ReactNode } from 'react';
import { StyleSheet, Text, View } from 'react-native';

import { colors, space, type } from '@/components/theme';
import { focusOutline, type InteractionState } from '@/components/ui/interaction';
import { LinkTarget } from '@/components/ui/link-target';

import { CrestMark } from './crest-mark';

export type AppHeaderProps = {
  /** Who is signed in, at the right end. */
  account?: ReactNode;
  /** Phone: the menu button after the account. */
  menu?: ReactNode;
  /** Phone width: the tagline would only squeeze the mark and the account, so it goes. */
  compact?: boolean;
};

/** The bar across the top: the product's mark (a link home), a tagline, the account, the menu. */
export function AppHeader({ account, menu, compact = false }: AppHeaderProps) {
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
      {compact ? null : <Text style={styles.tagline}>District emissions and income</Text>}
      <View style={styles.end}>
        {account}
        {menu}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  bar: {
    flexDirection: 'row',
    // With a large text size the account and the menu move to a line of their own.
    flexWrap: 'wrap',
    alignItems: 'center',
    columnGap: space.md,
    paddingHorizontal: space.lg,
    minHeight: 52,
    backgroundColor: colors.headerBackground,
  },
  home: { flexDirection: 'row', alignItems: 'center', gap: space.sm, minHeight: 44, paddingHorizontal: space.xs },
  word: { ...type.title, color: colors.headerText },
  tagline: { ...type.caption, color: colors.headerTextMuted, flexShrink: 1 },
  end: { marginLeft: 'auto', flexShrink: 1, flexDirection: 'row', alignItems: 'center', gap: space.sm },
});
