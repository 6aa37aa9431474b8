import { StyleSheet, Text, View } from 'react-native';

import { StandingBadge } from '@/components/region/standing-mark';
import { QueryErrorPanel } from '@/components/state/query-error-panel';
import type { QueryState } from '@/components/state/query-state';
import { Skeleton } from '@/components/state/skeleton';
import { StatePanel } from '@/components/state/state-panel';
import { colors, radius, space, type } from '@/components/theme';
import { formatDay } from '@/lib/alert-text';
import type { DistrictHistoryResponse } from '@/contracts/estimates';
import { formatLevel, gapShort, intervalText, notBoundedText } from '@/lib/estimate-words';

/** The district's estimate in each published run, newest first. */
export function HistoryList({
  history,
  level,
}: {
  history: QueryState<DistrictHistoryResponse>;
  level: number | null;
}) {
  if (history.status === 'pending') {
    return (
      <View role="progressbar" style={styles.list} accessible accessibilityLabel="Loading the history">
        {[0, 1, 2].map((i) => (
          <View key={i} style={styles.item}>
            <Skeleton width={160} height={16} />
            <Skeleton width={240} height={14} />
          </View>
        ))}
      </View>
    );
  }
  if (history.status === 'error' && !history.data) {
    return (
      <QueryErrorPanel
        what="the history"
        error={history.error}
        retrying={history.isFetching}
        onRetry={() => void history.refetch()}
        testID="history-error"
      />
    );
  }
  const rows = history.data?.history ?? [];
  if (rows.length === 0)
    return (
      <StatePanel
        testID="history-empty"
        title="No published estimates yet"
        message="Each published run adds a line here."
      />
    );
  return (
    <View style={styles.list} testID="history-list">
      {rows.map((h) => (
        <View key={h.runId} style={styles.item} testID={`history-${h.runId}`}>
          <View style={styles.head}>
            <Text style={styles.when}>
              Run #{h.runId} · {formatDay(h.publishedAt)} · data v{h.dataVersion}
            </Text>
            <StandingBadge standing={h.standing} compact />
          </View>
          <Text style={styles.line}>
            {h.threshold !== null && h.threshold > 0
              ? `Threshold ${formatLevel(h.threshold)}; ${h.intervalBounded ? intervalText('bounded', h.thresholdLo, h.thresholdHi) : `${notBoundedText(level)}`}; gap ${gapShort(h.gapPercent)}`
              : 'No threshold in this run'}
          </Text>
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
  head: { flexDirection: 'row', flexWrap: 'wrap', justifyContent: 'space-between', gap: space.sm },
  when: { ...type.label, color: colors.text },
  line: { ...type.caption, color: colors.text },
});
