import { Pressable, StyleSheet, Text, View } from 'react-native';

import { colors, layout, space, type } from '@/components/theme';
import { focusOutline, type InteractionState } from '@/components/ui/interaction';

export type CardTab = 'data' | 'history' | 'alerts';

const TABS: { key: CardTab; label: string }[] = [
  { key: 'data', label: 'Data' },
  { key: 'history', label: 'History' },
  { key: 'alerts', label: 'Alerts' },
];

/** Tabs for the card's lower sections; arrow keys are not needed: each tab is a button in order. */
export function CardTabs({
  current,
  onChange,
  counts,
}: {
  current: CardTab;
  onChange: (t: CardTab) => void;
  counts?: Partial<Record<CardTab, number>>;
}) {
  return (
    <View style={styles.bar} role="tablist" aria-label="District sections">
      {TABS.map((t) => {
        const on = t.key === current;
        const n = counts?.[t.key];
        return (
          <Pressable
            key={t.key}
            testID={`tab-${t.key}`}
            role="tab"
            aria-selected={on}
            accessibilityState={{ selected: on }}
            onPress={() => onChange(t.key)}
            style={(state: InteractionState) => [
              styles.tab,
              on && styles.on,
              state.hovered && !on && styles.hover,
              focusOutline(state, 'inside'),
            ]}
          >
            <Text style={[styles.label, on && styles.onLabel]}>
              {t.label}
              {n !== undefined ? ` (${n})` : ''}
            </Text>
          </Pressable>
        );
      })}
    </View>
  );
}

const styles = StyleSheet.create({
  bar: { flexDirection: 'row', flexWrap: 'wrap', borderBottomWidth: 1, borderBottomColor: colors.border },
  tab: {
    minHeight: layout.touchTarget,
    paddingHorizontal: space.lg,
    justifyContent: 'center',
    borderBottomWidth: 3,
    borderBottomColor: colors.transparent,
  },
  on: { borderBottomColor: colors.selectedRule },
  hover: { backgroundColor: colors.surface },
  label: { ...type.bodyStrong, color: colors.textMuted },
  onLabel: { color: colors.text },
});
