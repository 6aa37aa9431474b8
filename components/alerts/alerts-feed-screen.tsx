import { Link } from '@/lib/router';
import { useMemo, useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';

import { ChoiceGroup } from '@/components/form/choice-group';
import { Page } from '@/components/layout/page';
import { QueryErrorPanel } from '@/components/state/query-error-panel';
import type { QueryState } from '@/components/state/query-state';
import { Skeleton } from '@/components/state/skeleton';
import { StatePanel } from '@/components/state/state-panel';
import { colors, radius, space, type } from '@/components/theme';
import { textSize } from '@/lib/text-size';
import { Button } from '@/components/ui/button';
import { focusOutline, type InteractionState } from '@/components/ui/interaction';
import { LinkTarget } from '@/components/ui/link-target';
import { Pill } from '@/components/ui/pill';
import { TextLink } from '@/components/ui/text-link';
import { alertDetail, alertTitle } from '@/lib/alert-text';
import type { AlertFeedResponse, FeedAlert } from '@/contracts/alerts';
import { formatDateTime } from '@/lib/format-time';

export type AlertsFeedScreenProps = {
  feed: QueryState<AlertFeedResponse>;
  onRead: (id: number) => void;
  /** Marks every unread alert in view read. */
  onReadAll: (ids: number[]) => void;
};

type Show = 'all' | 'unread';

/**
 * The signed-in person's alerts, newest first: what each published run changed for the
 * districts their subscriptions cover. Unread ones are marked; each opens its district card.
 */
export function AlertsFeedScreen({ feed, onRead, onReadAll }: AlertsFeedScreenProps) {
  const [show, setShow] = useState<Show>('all');
  const alerts = useMemo(() => (feed.data?.alerts ?? []).filter((a) => show === 'all' || !a.read), [feed.data, show]);
  const unread = feed.data?.unread ?? 0;
  return (
    <Page
      title="Alerts"
      intro="Raised when a published run moves a district’s standing, shifts its threshold, changes its shape or flips the turn test."
      actions={<TextLink href="/subscriptions" label="Manage subscriptions" />}
      testID="alerts-screen"
    >
      <View style={styles.controls}>
        <ChoiceGroup
          label="Show"
          choices={[
            { value: 'all', label: 'All alerts' },
            { value: 'unread', label: unread ? `Unread (${unread})` : 'Unread' },
          ]}
          value={show}
          onChange={setShow}
          testID="alerts-show"
        />
        {unread > 0 ? (
          <Button
            label="Mark all as read"
            variant="outline"
            onPress={() => onReadAll((feed.data?.alerts ?? []).filter((a) => !a.read).map((a) => a.id))}
            testID="alerts-read-all"
          />
        ) : null}
      </View>
      {feed.status === 'pending' ? (
        <View role="progressbar" style={styles.list} accessible accessibilityLabel="Loading your alerts">
          {[0, 1, 2].map((i) => (
            <Skeleton key={i} width="100%" height={72} />
          ))}
        </View>
      ) : feed.status === 'error' && !feed.data ? (
        <QueryErrorPanel
          what="your alerts"
          error={feed.error}
          retrying={feed.isFetching}
          onRetry={() => void feed.refetch()}
          testID="alerts-error"
        />
      ) : (feed.data?.alerts.length ?? 0) === 0 ? (
        <StatePanel
          testID="alerts-empty"
          title="No alerts yet"
          message="Subscribe to a district, a set of districts or the whole region; what a published run changes for them then arrives here and by e-mail."
        >
          <TextLink href="/subscriptions" label="Choose what to follow" />
        </StatePanel>
      ) : alerts.length === 0 ? (
        <StatePanel
          testID="alerts-all-read"
          title="All read"
          message="Every alert has been read. Choose “All alerts” to see them again."
        />
      ) : (
        <View style={styles.list} testID="alerts-list">
          {alerts.map((a) => (
            <AlertItem key={a.id} alert={a} onRead={onRead} />
          ))}
        </View>
      )}
    </Page>
  );
}

function AlertItem({ alert, onRead }: { alert: FeedAlert; onRead: (id: number) => void }) {
  const detail = alertDetail(alert.kind, alert.details);
  return (
    <View style={[styles.item, !alert.read && styles.unread]} testID={`alert-${alert.id}`}>
      <Link href={{ pathname: '/district/[code]', params: { code: alert.districtCode, track: alert.track } }} asChild>
        <LinkTarget
          accessibilityRole="link"
          accessibilityLabel={`${alert.read ? '' : 'Unread. '}${alertTitle(alert.kind)}, ${alert.trackName}: ${alert.districtName}. ${detail} Opens the district card.`}
          onPress={() => (alert.read ? undefined : onRead(alert.id))}
          stateStyle={(s: InteractionState) => [styles.link, s.hovered && styles.hover, focusOutline(s, 'inside')]}
          testID={`alert-link-${alert.id}`}
        >
          <View style={styles.head}>
            {!alert.read ? <Pill label="New" tone="danger" testID={`alert-new-${alert.id}`} /> : null}
            <Text style={[styles.title, !alert.read && styles.titleUnread]}>
              {alertTitle(alert.kind)} · {alert.districtName} ({alert.districtCode}) · {alert.trackName}
            </Text>
          </View>
          <Text style={styles.detail}>{detail}</Text>
          <Text style={styles.when}>
            {formatDateTime(alert.createdAt)} · run #{alert.runId}
          </Text>
        </LinkTarget>
      </Link>
      {!alert.read ? (
        <View style={styles.readButton}>
          <Button
            label="Mark read"
            variant="outline"
            onPress={() => onRead(alert.id)}
            testID={`alert-read-${alert.id}`}
          />
        </View>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  controls: {
    flexDirection: 'row',
    flexWrap: 'wrap',
    alignItems: 'flex-end',
    justifyContent: 'space-between',
    gap: space.md,
  },
  list: { gap: space.sm },
  item: {
    flexDirection: 'row',
    flexWrap: 'wrap',
    alignItems: 'center',
    backgroundColor: colors.surface,
    borderColor: colors.border,
    borderWidth: 1,
    borderRadius: radius.md,
    overflow: 'hidden',
  },
  unread: { borderLeftWidth: 5, borderLeftColor: colors.danger },
  link: { flexGrow: 1, flexBasis: 260, padding: space.md, gap: space.xxs },
  hover: { backgroundColor: colors.selected },
  head: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.sm },
  title: { ...type.body, color: colors.text },
  titleUnread: { fontFamily: type.bodyStrong.fontFamily },
  detail: { ...type.body, fontSize: textSize(14), color: colors.text },
  when: { ...type.caption, color: colors.textMuted },
  readButton: { paddingHorizontal: space.md, paddingBottom: space.sm },
});
