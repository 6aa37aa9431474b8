import { StyleSheet, Text } from 'react-native';

import type { QueryState } from '@/components/state/query-state';
import { colors, type } from '@/components/theme';
import { TextLink } from '@/components/ui/text-link';
import { ApiError } from '@/lib/api-client';
import type { MeResponse } from '@/lib/api-types';

/** Who is signed in, or a sign-in link; nothing while that is still unknown. */
export function AccountStatus({ me }: { me: QueryState<MeResponse> }) {
  if (me.status === 'success' && me.data) {
    return (
      <Text style={styles.who} numberOfLines={1} testID="account-name">
        {me.data.name ?? me.data.email}
      </Text>
    );
  }
  if (me.status === 'error' && me.error instanceof ApiError && me.error.status === 401) {
    return <TextLink href="/sign-in" label="Sign in" tone="inverse" />;
  }
  return null;
}

const styles = StyleSheet.create({
  who: { ...type.caption, color: colors.headerTextMuted, maxWidth: 180 },
});
