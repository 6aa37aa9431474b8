import { Link } from '@/lib/router';
import { FlatList, StyleSheet, Text, View } from 'react-native';

import { QueryErrorPanel } from '@/components/state/query-error-panel';
import type { QueryState } from '@/components/state/query-state';
import { Skeleton } from '@/components/state/skeleton';
import { StatePanel } from '@/components/state/state-panel';
import { colors, space, type } from '@/components/theme';
import { focusOutline, type InteractionState } from '@/components/ui/interaction';
import { LinkTarget } from '@/components/ui/link-target';
import { alertDetail, alertTitle, formatDay } from '@/lib/alert-text';
import type { AlertFeedResponse, FeedAlert } from '@/contracts/alerts';

export type AlertsFeedColumnProps = {
  feed: QueryState<AlertFeedResponse>;
  onRead: (id: number) => void;
};

/** The caller's alerts (what their subscriptions cover), newest first; opening one marks it read. */
export function AlertsFeedColumn({ feed, onRead }: AlertsFeedColumnProps) {
  const unread = feed.data?.unread ?? 0;
  return (
    <View style={styles.column} testID="alerts-feed">
      <View style={styles.top}>
        <Text role="heading" aria-level={2} style={styles.title}>
          Your alerts
        </Text>
        {feed.data ? (
          <Text style={styles.count} accessibilityLiveRegion="polite">
            {unread === 0 ? 'All read' : `${unread} unread`}
          </Text>
        ) : null}
      </View>
      {feed.status === 'pending' ? (
        <View role="progressbar" style={styles.pad} accessible accessibilityLabel="Loading your alerts">
          {[0, 1, 2, 3].map((i) => (
            <View key={i} style={styles.item}>
              <Skeleton width={150} height={16} />
              <Skeleton width={220} height={14} />
            </View>
          ))}
        </View>
      ) : feed.status === 'error' && !feed.data ? (
        <View style={styles.pad}>
          <QueryErrorPanel
            what="your alerts"
            error={feed.error}
            retrying={feed.isFetching}
            onRetry={() => void feed.refetch()}
            testID="alerts-feed-error"
          />
        </View>
      ) : (feed.data?.alerts.length ?? 0) === 0 ? (
        <View style={styles.pad}>
          <StatePanel
            testID="alerts-feed-empty"
            title="No alerts yet"
            message="Turn on alerts on a district’s card; what a published run changes for it then arrives here and by e-mail."
          />
        </View>
      ) : (
        <FlatList
          data={feed.data!.alerts}
          keyExtractor={(a) => String(a.id)}
          renderItem={({ item }) => <FeedItem alert={item} onRead={onRead} />}
        />
      )}
    </View>
  );
}

function FeedItem({ alert, onRead }: { alert: FeedAlert; onRead: (id: number) => void }) {
  const detail = alertDetail(alert.kind, alert.details);
  return (
    <Link href={{ pathname: '/district/[code]', params: { code: alert.districtCode, track: alert.track } }} asChild>
      <LinkTarget
        testID={`feed-alert-${alert.id}`}
        accessibilityRole="link"
        accessibilityLabel={`${alert.read ? '' : 'Unread. '}${alertTitle(alert.kind)}, ${alert.trackName}: ${alert.districtName}. ${detail}`}
        onPress={() => (alert.read ? undefined : onRead(alert.id))}
        stateStyle={(state: InteractionState) => [
          styles.item,
          !alert.read && styles.unread,
          state.hovered && styles.hover,
          focusOutline(state, 'inside'),
        ]}
      >
        <Text style={styles.itemTitle}>
          {alert.read ? '' : '● '}
          {alertTitle(alert.kind)} · {alert.districtName}
        </Text>
        <Text style={styles.itemLine}>{detail}</Text>
        <Text style={styles.itemWhen}>
          {alert.trackName} · {formatDay(alert.createdAt)} · run #{alert.runId}
        </Text>
      </LinkTarget>
    </Link>
  );
}

const styles = StyleSheet.create({
  column: { flex: 1, backgroundColor: colors.background },
  top: { flexDirection: 'row', alignItems: 'baseline', justifyContent: 'space-between', padding: space.lg },
  title: { ...type.title, color: colors.text },
  count: { ...type.caption, color: colors.textMuted },
  pad: { paddingHorizontal: space.lg, gap: space.sm },
  item: {
    paddingHorizontal: space.lg,
    paddingVertical: space.md,
    gap: space.xxs,
    borderBottomWidth: 1,
    borderBottomColor: colors.border,
    backgroundColor: colors.surface,
  },
  unread: { borderLeftWidth: 4, borderLeftColor: colors.selectedRule },
  hover: { backgroundColor: colors.selected },
  itemTitle: { ...type.label, color: colors.text },
  itemLine: { ...type.caption, color: colors.text },
  itemWhen: { ...type.caption, color: colors.textMuted },
});
