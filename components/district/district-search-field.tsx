import { useState } from 'react';
import { Pressable, StyleSheet, Text, TextInput, View } from 'react-native';

import { colors, focusRing, layout, radius, space, type } from '@/components/theme';
import { focusOutline, type InteractionState } from '@/components/ui/interaction';

export type DistrictSearchFieldProps = {
  value: string;
  onChange: (text: string) => void;
};

export const SEARCH_FIELD_ID = 'district-search';

/** Filters the district list by name or code as the user types. */
export function DistrictSearchField({ value, onChange }: DistrictSearchFieldProps) {
  const [focused, setFocused] = useState(false);
  return (
    <View style={styles.wrap}>
      <Text style={styles.label}>Find a district</Text>
      <View style={[styles.field, focused && styles.fieldFocused]}>
        <TextInput
          testID={SEARCH_FIELD_ID}
          role="searchbox"
          accessibilityLabel="Find a district by name or code"
          value={value}
          onChangeText={onChange}
          onFocus={() => setFocused(true)}
          onBlur={() => setFocused(false)}
          placeholder="Name or code"
          placeholderTextColor={colors.placeholder}
          autoCapitalize="none"
          autoCorrect={false}
          autoComplete="off"
          inputMode="search"
          enterKeyHint="search"
          style={styles.input}
        />
        {value !== '' ? (
          <Pressable
            accessibilityRole="button"
            accessibilityLabel="Clear the search"
            onPress={() => onChange('')}
            style={(state: InteractionState) => [styles.clear, focusOutline(state)]}
          >
            <Text aria-hidden style={styles.clearMark}>
              ×
            </Text>
          </Pressable>
        ) : null}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.xs },
  label: { ...type.label, color: colors.textMuted },
  field: {
    flexDirection: 'row',
    alignItems: 'center',
    minHeight: layout.touchTarget,
    backgroundColor: colors.surface,
    borderColor: colors.controlBorder,
    borderWidth: 1,
    borderRadius: radius.md,
  },
  fieldFocused: { ...focusRing, borderColor: colors.action },
  input: {
    ...type.body,
    flex: 1,
    // An input's own width is about 20 characters; at a large text size that is wider than a
    // phone, so it must be allowed to shrink with the row.
    minWidth: 0,
    color: colors.text,
    paddingHorizontal: space.md,
    paddingVertical: space.sm,
    // The wrapper draws the focus ring; the browser's own would double it.
    outlineStyle: 'solid',
    outlineWidth: 0,
  },
  clear: {
    width: layout.touchTarget,
    height: layout.touchTarget,
    alignItems: 'center',
    justifyContent: 'center',
    borderRadius: radius.md,
  },
  clearMark: { ...type.title, color: colors.textMuted },
});
