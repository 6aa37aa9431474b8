import { StyleSheet, Text, View } from 'react-native';

import { QueryErrorPanel } from '@/components/state/query-error-panel';
import type { QueryState } from '@/components/state/query-state';
import { Skeleton } from '@/components/state/skeleton';
import { StatePanel } from '@/components/state/state-panel';
import { colors, radius, space, type } from '@/components/theme';
import { alertDetail, alertTitle, formatDay } from '@/lib/alert-text';
import type { DistrictAlertsResponse } from '@/contracts/alerts';

/** Every alert published for one district (what each published run changed). */
export function DistrictAlertsList({ alerts }: { alerts: QueryState<DistrictAlertsResponse> }) {
  if (alerts.status === 'pending') {
    return (
      <View role="progressbar" style={styles.list} accessible accessibilityLabel="Loading the alerts">
        {[0, 1].map((i) => (
          <View key={i} style={styles.item}>
            <Skeleton width={140} height={16} />
            <Skeleton width={220} height={14} />
          </View>
        ))}
      </View>
    );
  }
  if (alerts.status === 'error' && !alerts.data) {
    return (
      <QueryErrorPanel
        what="the alerts"
        error={alerts.error}
        retrying={alerts.isFetching}
        onRetry={() => void alerts.refetch()}
        testID="district-alerts-error"
      />
    );
  }
  const rows = alerts.data?.alerts ?? [];
  if (rows.length === 0) {
    return (
      <StatePanel
        testID="district-alerts-empty"
        title="No alerts for this district"
        message="An alert is raised when a published run moves its standing, shifts its threshold, changes its shape or flips the turn test."
      />
    );
  }
  return (
    <View style={styles.list} testID="district-alerts">
      {rows.map((a) => (
        <View key={a.id} style={styles.item}>
          <Text style={styles.title}>
            {alertTitle(a.kind)} · {a.trackName} · run #{a.runId} · {formatDay(a.createdAt)}
          </Text>
          <Text style={styles.line}>{alertDetail(a.kind, a.details)}</Text>
        </View>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  list: { gap: space.sm },
  item: {
    backgroundColor: colors.surface,
    borderColor: colors.border,
    borderWidth: 1,
    borderRadius: radius.md,
    padding: space.md,
    gap: space.xs,
  },
  title: { ...type.label, color: colors.text },
  line: { ...type.caption, color: colors.text },
});
