import { Pressable, StyleSheet, Text, View } from 'react-native';

import type { QueryState } from '@/components/state/query-state';
import { colors, layout, radius, space, type } from '@/components/theme';
import { Button } from '@/components/ui/button';
import { focusOutline, type InteractionState } from '@/components/ui/interaction';
import { Pill } from '@/components/ui/pill';
import { TextLink } from '@/components/ui/text-link';
import { ApiError } from '@/lib/api-client';
import type { MeResponse } from '@/contracts/districts';
import { roleLabel } from '@/lib/roles';

export type AccountStatusProps = {
  me: QueryState<MeResponse>;
  /** Phone: only the role in the bar (the name and sign-out live in the menu). */
  compact?: boolean;
  onSignOut?: () => void;
  signingOut?: boolean;
};

/** The bar's right end: who is signed in, their role and Sign out; or a sign-in link. */
export function AccountStatus({ me, compact = false, onSignOut, signingOut = false }: AccountStatusProps) {
  if (me.status === 'success' && me.data) {
    const role = roleLabel(me.data.role);
    return (
      <View style={styles.row}>
        {compact ? null : (
          <Text style={styles.who} testID="account-name">
            {me.data.name || me.data.email}
          </Text>
        )}
        <View style={styles.pill}>
          <Pill label={role} tone="info" testID="account-role" accessibilityLabel={`Role: ${role}`} />
        </View>
        {!compact && onSignOut ? (
          <Pressable
            accessibilityRole="button"
            accessibilityLabel="Sign out"
            disabled={signingOut}
            onPress={onSignOut}
            testID="sign-out"
            style={(state: InteractionState) => [
              styles.signOut,
              state.hovered && styles.signOutHover,
              focusOutline(state),
            ]}
          >
            <Text style={styles.signOutText}>{signingOut ? 'Signing out…' : 'Sign out'}</Text>
          </Pressable>
        ) : null}
      </View>
    );
  }
  if (me.status === 'error' && me.error instanceof ApiError && me.error.status === 401) {
    return <TextLink href="/sign-in" label="Sign in" tone="inverse" />;
  }
  return null;
}

/** Phone menu: the signed-in person in full, and Sign out. */
export function AccountPanel({ me, onSignOut, signingOut = false }: Omit<AccountStatusProps, 'compact'>) {
  if (!me.data) return null;
  return (
    <View style={styles.panel}>
      <Text style={styles.panelName} testID="account-name">
        {me.data.name || me.data.email}
      </Text>
      {me.data.name ? <Text style={styles.panelEmail}>{me.data.email}</Text> : null}
      <Text style={styles.panelEmail}>Signed in as {roleLabel(me.data.role).toLowerCase()}</Text>
      {onSignOut ? (
        <Button
          label="Sign out"
          variant="outline"
          busy={signingOut}
          busyLabel="Signing out…"
          onPress={onSignOut}
          testID="sign-out"
        />
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', flexWrap: 'wrap', flexShrink: 1, alignItems: 'center', gap: space.sm },
  pill: { justifyContent: 'center' },
  who: { ...type.caption, color: colors.headerTextMuted, flexShrink: 1 },
  signOut: {
    minHeight: layout.touchTarget,
    justifyContent: 'center',
    paddingHorizontal: space.sm,
    borderRadius: radius.sm,
  },
  signOutHover: { backgroundColor: colors.text },
  signOutText: { ...type.label, color: colors.headerText, textDecorationLine: 'underline' },
  panel: { gap: space.xs },
  panelName: { ...type.bodyStrong, color: colors.text },
  panelEmail: { ...type.caption, color: colors.textMuted },
});
