import type { ReactNode } from 'react';
import { Pressable, StyleSheet, Text } from 'react-native';

import { colors, layout, space, type } from '@/components/theme';
import { focusOutline, type InteractionState } from '@/components/ui/interaction';

export type ChipProps = {
  label: string;
  /** On: the filter or option is in force. */
  on: boolean;
  onPress: () => void;
  /** Drawn before the label (a standing mark). */
  leading?: ReactNode;
  /** Screen-reader label when the visible one is short. */
  accessibilityLabel?: string;
  /** 'checkbox' for filters that combine, 'radio' for one-of options. */
  kind?: 'checkbox' | 'radio';
  testID?: string;
};

/** A pill-shaped toggle for filters and sort options; "on" has a filled look and a tick. */
export function Chip({ label, on, onPress, leading, accessibilityLabel, kind = 'checkbox', testID }: ChipProps) {
  return (
    <Pressable
      testID={testID}
      accessibilityRole={kind}
      accessibilityState={{ checked: on }}
      aria-checked={on}
      accessibilityLabel={accessibilityLabel ?? label}
      onPress={onPress}
      style={(state: InteractionState) => [
        styles.chip,
        on && styles.on,
        state.hovered && !on && styles.hover,
        focusOutline(state),
      ]}
    >
      {leading}
      <Text style={[styles.label, on && styles.onLabel]}>
        {on ? '✓ ' : ''}
        {label}
      </Text>
    </Pressable>
  );
}

const styles = StyleSheet.create({
  chip: {
    // 32 px: above the 24 px WCAG 2.5.8 minimum, small enough for five counts in two rows on a phone.
    minHeight: layout.touchTarget - 12,
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.xs,
    paddingHorizontal: space.sm + space.xxs,
    // Half the one-line height: a pill on one line, rounded corners when a long label wraps.
    borderRadius: (layout.touchTarget - 12) / 2,
    borderWidth: 1,
    borderColor: colors.border,
    backgroundColor: colors.surface,
    // A long label (a track's name at a large text size) wraps inside the chip.
    maxWidth: '100%',
  },
  on: { borderColor: colors.selectedRule, backgroundColor: colors.selected, borderWidth: 2 },
  hover: { backgroundColor: colors.background },
  label: { ...type.label, color: colors.text, flexShrink: 1 },
  onLabel: { color: colors.text },
});
