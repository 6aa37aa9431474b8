import { Link, type Href } from '@/lib/router';
import { StyleSheet, Text } from 'react-native';

import { colors, layout, radius, space, type } from '@/components/theme';

import { focusOutline, type InteractionState } from './interaction';
import { LinkTarget } from './link-target';

export type TextLinkProps = {
  href: Href;
  label: string;
  /** Drawn before the label, e.g. an arrow; hidden from screen readers. */
  leading?: string;
  accessibilityLabel?: string;
  /** 'inverse' on the dark header bar. */
  tone?: 'default' | 'inverse';
};

/** An in-app link that reads as text: underlined, ridge colour, a full-size touch target. */
export function TextLink({ href, label, leading, accessibilityLabel, tone = 'default' }: TextLinkProps) {
  return (
    <Link href={href} asChild>
      <LinkTarget
        accessibilityRole="link"
        accessibilityLabel={accessibilityLabel ?? label}
        stateStyle={(state: InteractionState) => [styles.target, focusOutline(state)]}
      >
        {(state: InteractionState) => (
          <Text
            style={[
              styles.text,
              tone === 'inverse' && styles.inverse,
              state.hovered && (tone === 'inverse' ? styles.inverseHover : styles.hover),
            ]}
          >
            {leading ? (
              <Text aria-hidden style={styles.leading}>
                {leading}
              </Text>
            ) : null}
            {label}
          </Text>
        )}
      </LinkTarget>
    </Link>
  );
}

const styles = StyleSheet.create({
  target: {
    minHeight: layout.touchTarget,
    justifyContent: 'center',
    alignSelf: 'flex-start',
    paddingHorizontal: space.xs,
    borderRadius: radius.sm,
  },
  text: { ...type.bodyStrong, color: colors.link, textDecorationLine: 'underline' },
  hover: { color: colors.text },
  inverse: { color: colors.headerTextMuted },
  inverseHover: { color: colors.headerText },
  leading: { textDecorationLine: 'none' },
});
