import { Pressable, StyleSheet, Text, View } from 'react-native';

import type { QueryState } from '@/components/state/query-state';
import { colors, layout, radius, space, type } from '@/components/theme';
import { focusOutline, type InteractionState } from '@/components/ui/interaction';
import { ApiError } from '@/lib/api-client';
import type { Subscription } from '@/contracts/alerts';

export type SubscribeToggleProps = {
  code: string;
  name: string;
  subscriptions: QueryState<Subscription[]>;
  /** Subscribe (true) or stop this district's own subscriptions. */
  onChange: (action: { subscribe: true } | { subscribe: false; ids: number[] }) => void;
  pending: boolean;
  error: unknown;
};

/** "Alert me about this district": a switch, with what else already covers it. */
export function SubscribeToggle({ code, name, subscriptions, onChange, pending, error }: SubscribeToggleProps) {
  const list = subscriptions.data ?? [];
  const own = list.filter((s) => s.scope === 'district' && s.districtCodes.includes(code));
  const viaRegion = list.some((s) => s.scope === 'region');
  const viaSet = list.some((s) => s.scope === 'districts' && s.districtCodes.includes(code));
  const on = own.length > 0;
  const loading = subscriptions.status === 'pending';
  const disabled = loading || pending || subscriptions.status === 'error';
  return (
    <View style={styles.wrap}>
      <Pressable
        testID="subscribe-toggle"
        role="switch"
        accessibilityRole="switch"
        aria-checked={on}
        accessibilityState={{ checked: on, disabled, busy: pending }}
        accessibilityLabel={`Alerts for ${name}`}
        accessibilityHint={
          on
            ? 'Stops the alerts for this district'
            : 'Sends you an alert, in the app and by e-mail, when a published run changes this district'
        }
        disabled={disabled}
        onPress={() => onChange(on ? { subscribe: false, ids: own.map((s) => s.id) } : { subscribe: true })}
        style={(state: InteractionState) => [styles.row, disabled && styles.disabled, focusOutline(state)]}
      >
        <View style={[styles.track, on && styles.trackOn]} aria-hidden>
          <View style={[styles.knob, on && styles.knobOn]} />
        </View>
        <Text style={styles.label}>
          {pending ? 'Saving…' : on ? 'Alerts on for this district' : 'Alert me about this district'}
        </Text>
      </Pressable>
      {viaRegion ? (
        <Text style={styles.note}>Your region-wide subscription covers it as well.</Text>
      ) : viaSet ? (
        <Text style={styles.note}>One of your district sets covers it as well.</Text>
      ) : null}
      {error ? (
        <Text style={styles.error} role="alert">
          Could not save: {error instanceof ApiError ? error.message : 'something went wrong'}.
        </Text>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.xxs, flexShrink: 1, maxWidth: '100%' },
  row: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.sm,
    minHeight: layout.touchTarget,
    paddingHorizontal: space.xs,
    borderRadius: radius.md,
    flexShrink: 1,
    maxWidth: '100%',
  },
  disabled: { opacity: 0.6 },
  track: {
    width: 40,
    height: 24,
    borderRadius: 12,
    backgroundColor: colors.surfaceSunken,
    borderWidth: 2,
    borderColor: colors.textMuted,
    justifyContent: 'center',
    paddingHorizontal: 2,
  },
  trackOn: { backgroundColor: colors.action, borderColor: colors.action },
  knob: { width: 16, height: 16, borderRadius: 8, backgroundColor: colors.textMuted },
  knobOn: { backgroundColor: colors.onAction, transform: [{ translateX: 16 }] },
  label: { ...type.bodyStrong, color: colors.text, flexShrink: 1 },
  note: { ...type.caption, color: colors.textMuted },
  error: { ...type.caption, color: colors.danger },
});
