import { StyleSheet, Text, View } from 'react-native';

import type { QueryState } from '@/components/state/query-state';
import { colors, space, type } from '@/components/theme';
import type { HealthResponse } from '@/contracts/districts';

/**
 * A thin notice under the header when the server or its database is down, so stale or
 * missing numbers are never shown without a word. Renders nothing while all is well.
 */
export function ServerNotice({ health }: { health: QueryState<HealthResponse> }) {
  let text: string | null = null;
  if (health.status === 'error') {
    text = 'The Crestwatch server is not answering. What you see may be out of date.';
  } else if (health.data?.database === 'down') {
    text = 'The database is offline. Figures cannot be loaded until it is back.';
  }
  if (text === null) return null;
  return (
    <View style={styles.bar} accessibilityRole="alert" testID="server-notice">
      <Text style={styles.text}>{text}</Text>
    </View>
  );
}

const styles = StyleSheet.create({
  bar: { backgroundColor: colors.dangerFill, paddingHorizontal: space.lg, paddingVertical: space.sm },
  text: { ...type.caption, fontFamily: type.label.fontFamily, color: colors.danger },
});
