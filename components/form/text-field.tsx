import { useState } from 'react';
import { StyleSheet, Text, TextInput, View, type KeyboardTypeOptions } from 'react-native';

import { colors, focusRing, layout, radius, space, type } from '@/components/theme';

export type TextFieldProps = {
  label: string;
  value: string;
  onChangeText: (text: string) => void;
  hint?: string;
  /** A problem with the value, shown under the field and announced. */
  error?: string | null;
  placeholder?: string;
  keyboardType?: KeyboardTypeOptions;
  autoCapitalize?: 'none' | 'sentences' | 'words';
  multiline?: boolean;
  maxLength?: number;
  editable?: boolean;
  onSubmitEditing?: () => void;
  testID?: string;
};

/** A labelled text input with its hint and error; the label names the input for screen readers. */
export function TextField({
  label,
  value,
  onChangeText,
  hint,
  error,
  placeholder,
  keyboardType,
  autoCapitalize = 'none',
  multiline = false,
  maxLength,
  editable = true,
  onSubmitEditing,
  testID,
}: TextFieldProps) {
  const [focused, setFocused] = useState(false);
  return (
    <View style={styles.field}>
      <Text style={styles.label}>{label}</Text>
      <TextInput
        accessibilityLabel={label}
        accessibilityHint={hint}
        value={value}
        onChangeText={onChangeText}
        placeholder={placeholder}
        placeholderTextColor={colors.placeholder}
        keyboardType={keyboardType}
        autoCapitalize={autoCapitalize}
        autoCorrect={false}
        multiline={multiline}
        maxLength={maxLength}
        editable={editable}
        onSubmitEditing={onSubmitEditing}
        onFocus={() => setFocused(true)}
        onBlur={() => setFocused(false)}
        testID={testID}
        style={[
          styles.input,
          multiline && styles.multiline,
          !!error && styles.inputError,
          !editable && styles.readOnly,
          focused && focusRing,
        ]}
      />
      {error ? (
        <Text style={styles.error} accessibilityRole="alert">
          {error}
        </Text>
      ) : hint ? (
        <Text style={styles.hint}>{hint}</Text>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  field: { gap: space.xs, minWidth: 0 },
  label: { ...type.label, color: colors.text },
  input: {
    ...type.body,
    color: colors.text,
    backgroundColor: colors.surface,
    borderColor: colors.controlBorder,
    borderWidth: 1,
    borderRadius: radius.md,
    minHeight: layout.touchTarget,
    paddingHorizontal: space.md,
    paddingVertical: space.sm,
  },
  multiline: { minHeight: 88, textAlignVertical: 'top' },
  inputError: { borderColor: colors.danger, borderWidth: 2 },
  readOnly: { backgroundColor: colors.surfaceSunken },
  hint: { ...type.caption, color: colors.textMuted },
  error: { ...type.caption, fontFamily: type.label.fontFamily, color: colors.danger },
});
