import { Pressable, StyleSheet, Text, View } from 'react-native';

import { colors, layout, radius, space, type } from '@/components/theme';
import { textSize } from '@/lib/text-size';
import { focusOutline, type InteractionState } from '@/components/ui/interaction';

export type Choice<T extends string> = { value: T; label: string; hint?: string };

export type ChoiceGroupProps<T extends string> = {
  label: string;
  choices: readonly Choice<T>[];
  value: T | null;
  onChange: (value: T) => void;
  /** Hint under the group. */
  hint?: string;
  disabled?: boolean;
  testID?: string;
};

/**
 * Pick one of a few options (a radio group drawn as joined tiles that wrap on a phone).
 * Each tile is a radio for screen readers; the chosen one is filled.
 */
export function ChoiceGroup<T extends string>({
  label,
  choices,
  value,
  onChange,
  hint,
  disabled = false,
  testID,
}: ChoiceGroupProps<T>) {
  return (
    <View style={styles.group} testID={testID}>
      <Text style={styles.label} nativeID={testID ? `${testID}-label` : undefined}>
        {label}
      </Text>
      <View role="radiogroup" aria-label={label} style={styles.tiles}>
        {choices.map((c) => {
          const selected = c.value === value;
          return (
            <Pressable
              key={c.value}
              role="radio"
              aria-checked={selected}
              aria-disabled={disabled}
              accessibilityLabel={c.hint ? `${c.label}: ${c.hint}` : c.label}
              disabled={disabled}
              onPress={() => onChange(c.value)}
              testID={testID ? `${testID}-${c.value}` : undefined}
              style={(state: InteractionState) => [
                styles.tile,
                selected && styles.selected,
                state.hovered && !selected && !disabled && styles.hover,
                disabled && styles.disabled,
                focusOutline(state),
              ]}
            >
              <Text style={[styles.tileLabel, selected && styles.selectedLabel]}>{c.label}</Text>
              {c.hint ? <Text style={[styles.tileHint, selected && styles.selectedHint]}>{c.hint}</Text> : null}
            </Pressable>
          );
        })}
      </View>
      {hint ? <Text style={styles.hint}>{hint}</Text> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  group: { gap: space.xs },
  label: { ...type.label, color: colors.text },
  tiles: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xs },
  tile: {
    minHeight: layout.touchTarget,
    paddingHorizontal: space.md,
    paddingVertical: space.xs,
    borderRadius: radius.md,
    borderWidth: 1,
    borderColor: colors.border,
    backgroundColor: colors.surface,
    justifyContent: 'center',
    // A tile with a long hint wraps inside the row instead of running past a phone's edge.
    maxWidth: '100%',
  },
  selected: { backgroundColor: colors.action, borderColor: colors.action },
  hover: { backgroundColor: colors.selected },
  disabled: { opacity: 0.6 },
  tileLabel: { ...type.bodyStrong, fontSize: textSize(14), color: colors.text },
  selectedLabel: { color: colors.onAction },
  tileHint: { ...type.caption, color: colors.textMuted, flexShrink: 1 },
  selectedHint: { color: colors.onAction },
  hint: { ...type.caption, color: colors.textMuted },
});
