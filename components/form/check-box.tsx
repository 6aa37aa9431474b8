import { Pressable, StyleSheet, Text, View } from 'react-native';

import { colors, layout, radius, space, type } from '@/components/theme';
import { textSize } from '@/lib/text-size';
import { focusOutline, type InteractionState } from '@/components/ui/interaction';

export type CheckBoxProps = {
  label: string;
  checked: boolean;
  onChange: (checked: boolean) => void;
  hint?: string;
  disabled?: boolean;
  testID?: string;
};

/** A labelled tick box; the whole row is the touch target. */
export function CheckBox({ label, checked, onChange, hint, disabled = false, testID }: CheckBoxProps) {
  return (
    <Pressable
      role="checkbox"
      aria-checked={checked}
      aria-disabled={disabled}
      accessibilityLabel={label}
      accessibilityHint={hint}
      disabled={disabled}
      onPress={() => onChange(!checked)}
      testID={testID}
      style={(state: InteractionState) => [styles.row, disabled && styles.disabled, focusOutline(state)]}
    >
      <View style={[styles.box, checked && styles.boxChecked]}>
        {checked ? <Text style={styles.tick}>✓</Text> : null}
      </View>
      <View style={styles.words}>
        <Text style={styles.label}>{label}</Text>
        {hint ? <Text style={styles.hint}>{hint}</Text> : null}
      </View>
    </Pressable>
  );
}

const styles = StyleSheet.create({
  row: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.sm,
    minHeight: layout.touchTarget,
    borderRadius: radius.sm,
    alignSelf: 'flex-start',
    paddingRight: space.xs,
  },
  disabled: { opacity: 0.6 },
  box: {
    // Grows with the tick at a large text size.
    minWidth: 22,
    minHeight: 22,
    borderRadius: radius.sm,
    borderWidth: 2,
    borderColor: colors.action,
    backgroundColor: colors.surface,
    alignItems: 'center',
    justifyContent: 'center',
  },
  boxChecked: { backgroundColor: colors.action },
  tick: { ...type.label, color: colors.onAction, lineHeight: textSize(16) },
  words: { flexShrink: 1 },
  label: { ...type.body, color: colors.text },
  hint: { ...type.caption, color: colors.textMuted },
});
