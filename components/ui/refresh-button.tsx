// A visible Refresh control for the screens officials keep open (react-native-web's
// RefreshControl does nothing on the web, and a phone browser's own pull-to-refresh reloads
// the whole app). Pressing it refetches the screen's queries; while they are in flight it
// says so, then tells when the figures were last fetched.
import { useState } from 'react';
import { Pressable, StyleSheet, Text, View } from 'react-native';

import { colors, layout, radius, space, type } from '@/components/theme';
import { formatClock } from '@/lib/format-time';

import { focusOutline, type InteractionState } from './interaction';

/** The part of a react-query result the button needs (UseQueryResult fits). */
export type RefreshableQuery = {
  refetch: () => unknown;
  isFetching: boolean;
  /** When the answer shown was fetched (ms since the epoch; 0 before the first answer). */
  dataUpdatedAt?: number;
};

export type RefreshButtonProps = {
  /** The queries whose answers the screen shows; all are fetched again on a press. */
  queries: readonly RefreshableQuery[];
  /** What is refreshed, for the accessible name ("the districts", "this district"). */
  what: string;
  testID?: string;
};

export function RefreshButton({ queries, what, testID = 'refresh' }: RefreshButtonProps) {
  const [pressed, setPressed] = useState(false);
  const busy = pressed || queries.some((q) => q.isFetching);
  const updatedAt = Math.max(0, ...queries.map((q) => q.dataUpdatedAt ?? 0));
  const updated = updatedAt > 0 ? `Updated ${formatClock(updatedAt)}` : null;
  const onPress = () => {
    if (busy) return;
    setPressed(true);
    void Promise.allSettled(queries.map((q) => Promise.resolve(q.refetch()))).finally(() => setPressed(false));
  };
  return (
    <View style={styles.row}>
      <Pressable
        accessibilityRole="button"
        // Starts with the word it shows (WCAG 2.2 SC 2.5.3 Label in Name).
        accessibilityLabel={busy ? `Refreshing ${what}` : `Refresh ${what}`}
        accessibilityState={{ busy }}
        onPress={onPress}
        testID={testID}
        // A primary action: at least 44×44 px (components/theme layout.touchTarget).
        {...({ dataSet: { action: 'primary' } } as object)}
        style={(state: InteractionState) => [
          styles.button,
          state.hovered && !busy && styles.hover,
          busy && styles.busy,
          focusOutline(state),
        ]}
      >
        <Text aria-hidden style={styles.icon}>
          ↻
        </Text>
        <Text style={styles.label}>{busy ? 'Refreshing…' : 'Refresh'}</Text>
      </Pressable>
      <Text style={styles.when} aria-live="polite" testID={`${testID}-status`}>
        {busy ? '' : (updated ?? '')}
      </Text>
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', alignItems: 'center', gap: space.sm, flexWrap: 'wrap' },
  button: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.xs,
    minHeight: layout.touchTarget,
    minWidth: layout.touchTarget,
    paddingHorizontal: space.md,
    borderRadius: radius.md,
    borderWidth: 2,
    borderColor: colors.action,
    backgroundColor: colors.surface,
  },
  hover: { backgroundColor: colors.selected },
  busy: { opacity: 0.7 },
  icon: { ...type.bodyStrong, color: colors.action },
  label: { ...type.bodyStrong, color: colors.action },
  when: { ...type.caption, color: colors.textMuted },
});
