import { Pressable, StyleSheet, Text } from 'react-native';

import { colors, layout, radius, space, type } from '@/components/theme';

import { focusOutline, type InteractionState } from './interaction';

export type ButtonProps = {
  label: string;
  onPress: () => void;
  /** 'solid' for the one main action of a panel, 'outline' for the others. */
  variant?: 'solid' | 'outline';
  /** Shows a busy label and ignores presses (e.g. while a retry is in flight). */
  busy?: boolean;
  busyLabel?: string;
  accessibilityHint?: string;
  testID?: string;
};

export function Button({
  label,
  onPress,
  variant = 'solid',
  busy = false,
  busyLabel,
  accessibilityHint,
  testID,
}: ButtonProps) {
  const solid = variant === 'solid';
  return (
    <Pressable
      accessibilityRole="button"
      accessibilityState={{ busy, disabled: busy }}
      accessibilityHint={accessibilityHint}
      disabled={busy}
      onPress={onPress}
      testID={testID}
      style={(state: InteractionState) => [
        styles.base,
        solid ? styles.solid : styles.outline,
        state.hovered && (solid ? styles.solidHover : styles.outlineHover),
        state.pressed && styles.pressed,
        busy && styles.busy,
        focusOutline(state),
      ]}
    >
      <Text style={[styles.label, solid ? styles.solidLabel : styles.outlineLabel]}>
        {busy ? (busyLabel ?? label) : label}
      </Text>
    </Pressable>
  );
}

const styles = StyleSheet.create({
  base: {
    minHeight: layout.touchTarget,
    minWidth: layout.touchTarget * 2,
    paddingHorizontal: space.lg,
    borderRadius: radius.md,
    borderWidth: 2,
    alignItems: 'center',
    justifyContent: 'center',
    alignSelf: 'flex-start',
  },
  solid: { backgroundColor: colors.action, borderColor: colors.action },
  solidHover: { backgroundColor: colors.text, borderColor: colors.text },
  outline: { backgroundColor: colors.surface, borderColor: colors.action },
  outlineHover: { backgroundColor: colors.selected },
  pressed: { opacity: 0.85 },
  busy: { opacity: 0.7 },
  label: { ...type.bodyStrong },
  solidLabel: { color: colors.onAction },
  outlineLabel: { color: colors.action },
});
