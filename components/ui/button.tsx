import { Pressable, StyleSheet, Text } from 'react-native';

import { colors, layout, radius, space, type } from '@/components/theme';

import { focusOutline, type InteractionState } from './interaction';

export type ButtonProps = {
  label: string;
  onPress: () => void;
  /** 'solid' for the one main action of a panel, 'outline' for the others, 'danger' for undoing or removing. */
  variant?: 'solid' | 'outline' | 'danger';
  /** Shows a busy label and ignores presses (e.g. while a retry is in flight). */
  busy?: boolean;
  busyLabel?: string;
  /** Not available now (e.g. a form with a problem); drawn faded and ignores presses. */
  disabled?: boolean;
  accessibilityHint?: string;
  testID?: string;
};

export function Button({
  label,
  onPress,
  variant = 'solid',
  busy = false,
  busyLabel,
  disabled = false,
  accessibilityHint,
  testID,
}: ButtonProps) {
  const solid = variant === 'solid';
  const danger = variant === 'danger';
  const inactive = busy || disabled;
  return (
    <Pressable
      accessibilityRole="button"
      accessibilityState={{ busy, disabled: inactive }}
      accessibilityHint={accessibilityHint}
      disabled={inactive}
      onPress={onPress}
      testID={testID}
      // The main action of a panel: at least 44×44 px (layout.touchTarget; the browser tests measure it).
      {...(solid ? ({ dataSet: { action: 'primary' } } as object) : null)}
      style={(state: InteractionState) => [
        styles.base,
        solid ? styles.solid : danger ? styles.danger : styles.outline,
        state.hovered && !inactive && (solid ? styles.solidHover : danger ? styles.dangerHover : styles.outlineHover),
        state.pressed && styles.pressed,
        inactive && styles.busy,
        focusOutline(state),
      ]}
    >
      <Text style={[styles.label, solid ? styles.solidLabel : danger ? styles.dangerLabel : styles.outlineLabel]}>
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
  danger: { backgroundColor: colors.surface, borderColor: colors.danger },
  dangerHover: { backgroundColor: colors.dangerFill },
  pressed: { opacity: 0.85 },
  busy: { opacity: 0.7 },
  label: { ...type.bodyStrong },
  solidLabel: { color: colors.onAction },
  outlineLabel: { color: colors.action },
  dangerLabel: { color: colors.danger },
});
