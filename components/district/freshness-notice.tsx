import { StyleSheet, Text, View } from 'react-native';

import { colors, radius, space, type } from '@/components/theme';
import { Button } from '@/components/ui/button';
import { useOnline } from '@/hooks/use-online';
import { formatDayTime } from '@/lib/format-time';
import { offlineCopySavedAt } from '@/lib/offline-copies';

/** The parts of a react-query result that tell whether shown data may be out of date. */
export type Freshness = {
  data: unknown;
  isError: boolean;
  dataUpdatedAt: number;
  fetchStatus: 'fetching' | 'paused' | 'idle';
  isFetching: boolean;
  refetch: () => unknown;
};

/**
 * True when data is shown but may be out of date: the last refresh failed, one waits for a
 * network, or the device is offline (kept data cannot be refreshed, even while "fresh").
 */
export function isStale(f: Freshness, online = true): boolean {
  return (
    f.data !== undefined && (f.isError || f.fetchStatus === 'paused' || !online || offlineCopySavedAt(f.data) !== null)
  );
}

/**
 * Offline or unreachable while react-query still holds the last answer: the figures stay,
 * and this says how old they are and offers to try again.
 */
export function FreshnessNotice({ freshness, what }: { freshness: Freshness; what: string }) {
  const online = useOnline();
  if (!isStale(freshness, online)) return null;
  // Read from the service worker's copy (the page may have been opened without a network).
  const savedAt = offlineCopySavedAt(freshness.data);
  if (savedAt !== null) {
    return (
      <View style={styles.notice} role="status" testID="offline-copy-notice">
        <Text style={styles.text}>
          <Text style={styles.strong}>Offline — figures from {formatDayTime(savedAt)}. </Text>
          Showing {what} as saved on this device; they will refresh when the connection returns.
        </Text>
      </View>
    );
  }
  const offline = !online || freshness.fetchStatus === 'paused';
  return (
    <View style={styles.notice} role="status" testID="stale-notice">
      <Text style={styles.text}>
        <Text style={styles.strong}>{offline ? 'Offline. ' : 'Could not refresh. '}</Text>
        Showing {what} as loaded at {formatDayTime(freshness.dataUpdatedAt)};{' '}
        {offline ? 'they will refresh when the connection returns' : 'they may be out of date'}.
      </Text>
      {offline ? null : (
        <Button
          label="Try again"
          variant="outline"
          busy={freshness.isFetching}
          busyLabel="Trying…"
          onPress={() => void freshness.refetch()}
        />
      )}
    </View>
  );
}

const styles = StyleSheet.create({
  notice: {
    borderWidth: 1,
    borderColor: colors.danger,
    backgroundColor: colors.dangerFill,
    borderRadius: radius.md,
    padding: space.md,
    gap: space.sm,
  },
  text: { ...type.body, color: colors.text },
  strong: { fontFamily: type.bodyStrong.fontFamily, color: colors.danger },
});
