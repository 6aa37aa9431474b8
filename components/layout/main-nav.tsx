import { Link } from '@/lib/router';
import { forwardRef } from 'react';
import { Pressable, StyleSheet, Text, View } from 'react-native';

import { colors, layout, radius, space, type } from '@/components/theme';
import { textSize } from '@/lib/text-size';
import { focusOutline, type InteractionState } from '@/components/ui/interaction';
import { LinkTarget } from '@/components/ui/link-target';

import type { NavItem } from './nav-items';

export type NavProps = {
  items: readonly NavItem[];
  activeKey: string | null;
  /** Small counts beside a section's name (unread alerts). */
  counts?: Partial<Record<string, number>>;
};

function countText(n: number | undefined): string | null {
  if (!n) return null;
  return n > 99 ? '99+' : String(n);
}

/** Wide layout: the sections as one row of tabs under the header bar. */
export function NavStrip({ items, activeKey, counts = {} }: NavProps) {
  return (
    <View role="navigation" aria-label="Sections" style={styles.strip} testID="nav-strip">
      {items.map((item) => {
        const active = item.key === activeKey;
        const count = countText(counts[item.key]);
        return (
          <Link key={item.key} href={item.href} asChild>
            <LinkTarget
              accessibilityRole="link"
              aria-current={active ? 'page' : undefined}
              accessibilityLabel={count ? `${item.label}, ${count} unread` : item.label}
              testID={`nav-${item.key}`}
              stateStyle={(state: InteractionState) => [
                styles.tab,
                active && styles.tabActive,
                state.hovered && !active && styles.tabHover,
                focusOutline(state, 'inside'),
              ]}
            >
              <Text style={[styles.tabText, active && styles.tabTextActive]}>{item.label}</Text>
              {count ? <CountBadge text={count} /> : null}
            </LinkTarget>
          </Link>
        );
      })}
    </View>
  );
}

function CountBadge({ text }: { text: string }) {
  return (
    <View style={styles.badge} aria-hidden>
      <Text style={styles.badgeText}>{text}</Text>
    </View>
  );
}

export type MenuButtonProps = { open: boolean; onPress: () => void; unread?: number };

/** Phone: the button at the right of the header that opens and closes the section menu. */
export const MenuButton = forwardRef<View, MenuButtonProps>(function MenuButton({ open, onPress, unread }, ref) {
  const count = countText(unread);
  return (
    <Pressable
      ref={ref}
      // A primary action: at least 44×44 px (layout.touchTarget; the browser tests measure it).
      {...({ dataSet: { action: 'primary' } } as object)}
      accessibilityRole="button"
      aria-expanded={open}
      aria-controls="section-menu"
      accessibilityLabel={open ? 'Close the menu' : count ? `Menu, ${count} unread alerts` : 'Menu'}
      onPress={onPress}
      testID="menu-button"
      style={(state: InteractionState) => [
        styles.menuButton,
        state.hovered && styles.menuButtonHover,
        focusOutline(state),
      ]}
    >
      <View aria-hidden style={styles.burger}>
        {open ? (
          <Text style={styles.close}>×</Text>
        ) : (
          <>
            <View style={styles.burgerLine} />
            <View style={styles.burgerLine} />
            <View style={styles.burgerLine} />
          </>
        )}
      </View>
      <Text style={styles.menuText}>{open ? 'Close' : 'Menu'}</Text>
      {count && !open ? <CountBadge text={count} /> : null}
    </Pressable>
  );
});

export type NavMenuProps = NavProps & {
  /** Who is signed in and the sign-out button, under the sections. */
  account: React.ReactNode;
  onNavigate: () => void;
};

/** Phone: the sections as full-width rows, opened from the header, then the account. */
export function NavMenu({ items, activeKey, counts = {}, account, onNavigate }: NavMenuProps) {
  return (
    <View style={styles.menu} nativeID="section-menu" testID="nav-menu">
      <View role="navigation" aria-label="Sections">
        {items.map((item) => {
          const active = item.key === activeKey;
          const count = countText(counts[item.key]);
          return (
            <Link key={item.key} href={item.href} asChild onPress={onNavigate}>
              <LinkTarget
                accessibilityRole="link"
                aria-current={active ? 'page' : undefined}
                accessibilityLabel={count ? `${item.label}, ${count} unread` : item.label}
                testID={`menu-${item.key}`}
                stateStyle={(state: InteractionState) => [
                  styles.menuRow,
                  active && styles.menuRowActive,
                  state.hovered && !active && styles.tabHover,
                  focusOutline(state, 'inside'),
                ]}
              >
                <Text style={[styles.menuRowText, active && styles.tabTextActive]}>{item.label}</Text>
                {count ? <CountBadge text={count} /> : null}
              </LinkTarget>
            </Link>
          );
        })}
      </View>
      <View style={styles.menuAccount}>{account}</View>
    </View>
  );
}

const styles = StyleSheet.create({
  strip: {
    flexDirection: 'row',
    flexWrap: 'wrap',
    paddingHorizontal: space.md,
    backgroundColor: colors.surface,
    borderBottomWidth: 1,
    borderBottomColor: colors.border,
  },
  tab: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.xs,
    minHeight: layout.touchTarget,
    paddingHorizontal: space.md,
    borderBottomWidth: 3,
    borderBottomColor: colors.transparent,
  },
  tabActive: { borderBottomColor: colors.selectedRule },
  tabHover: { backgroundColor: colors.selected },
  tabText: { ...type.body, fontSize: textSize(14), color: colors.textMuted },
  tabTextActive: { fontFamily: type.bodyStrong.fontFamily, color: colors.text },
  badge: {
    minWidth: 20,
    paddingHorizontal: space.xs,
    borderRadius: radius.pill,
    backgroundColor: colors.danger,
    alignItems: 'center',
  },
  badgeText: { ...type.caption, fontFamily: type.label.fontFamily, color: colors.onAction },
  menuButton: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.sm,
    minHeight: layout.touchTarget,
    paddingHorizontal: space.sm,
    borderRadius: radius.md,
    borderWidth: 1,
    borderColor: colors.headerTextMuted,
  },
  menuButtonHover: { backgroundColor: colors.text },
  burger: { width: 18, height: 14, justifyContent: 'space-between', alignItems: 'center' },
  burgerLine: { width: 18, height: 2, backgroundColor: colors.headerText, borderRadius: 1 },
  close: { ...type.title, lineHeight: textSize(16), color: colors.headerText },
  menuText: { ...type.label, color: colors.headerText },
  menu: {
    backgroundColor: colors.surface,
    borderBottomWidth: 1,
    borderBottomColor: colors.border,
    paddingBottom: space.md,
  },
  menuRow: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.sm,
    minHeight: 48,
    paddingHorizontal: space.lg,
    borderLeftWidth: 4,
    borderLeftColor: colors.transparent,
  },
  menuRowActive: { borderLeftColor: colors.selectedRule, backgroundColor: colors.selected },
  menuRowText: { ...type.body, color: colors.text },
  menuAccount: {
    marginTop: space.sm,
    paddingTop: space.md,
    paddingHorizontal: space.lg,
    borderTopWidth: 1,
    borderTopColor: colors.border,
    gap: space.sm,
  },
});
