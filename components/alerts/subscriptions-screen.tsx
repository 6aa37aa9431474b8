import { useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';

import { MutationNotice } from '@/components/form/mutation-notice';
import { Page, Section } from '@/components/layout/page';
import { QueryErrorPanel } from '@/components/state/query-error-panel';
import type { QueryState } from '@/components/state/query-state';
import { Skeleton } from '@/components/state/skeleton';
import { StatePanel } from '@/components/state/state-panel';
import { colors, radius, space, type } from '@/components/theme';
import { ConfirmAction } from '@/components/ui/confirm-action';
import { Pill } from '@/components/ui/pill';
import { TextLink } from '@/components/ui/text-link';
import type { Subscription, SubscriptionInput } from '@/contracts/alerts';
import type { TrackRef } from '@/contracts/tracks';
import { ALERT_KIND_LABEL } from '@/lib/estimate-words';
import { formatDate } from '@/lib/format-time';

import { SubscriptionForm } from './subscription-form';

export type SubscriptionsScreenProps = {
  subscriptions: QueryState<Subscription[]>;
  districts: QueryState<{ code: string; name: string }[]>;
  /** open tracks (the headline first) */
  tracks?: TrackRef[];
  onSubscribe: (input: SubscriptionInput) => Promise<unknown>;
  onRemove: (id: number) => Promise<unknown>;
};

function scopeWords(s: Subscription, names: Map<string, string>): string {
  if (s.scope === 'region') return 'The whole region';
  const list = s.districtCodes.map((c) => (names.get(c) ? `${names.get(c)} (${c})` : c));
  return s.scope === 'district' ? (list[0] ?? '—') : `${list.length} districts: ${list.join(', ')}`;
}

function trackWords(s: Subscription, tracks: TrackRef[]): string {
  if (s.tracks === 'all') return 'Every watched indicator';
  const names = new Map(tracks.map((t) => [t.code, t.name]));
  return s.tracks.map((c) => names.get(c) ?? c).join(' · ');
}

/** What the signed-in person follows, and a form to follow more. */
export function SubscriptionsScreen({
  subscriptions,
  districts,
  tracks = [],
  onSubscribe,
  onRemove,
}: SubscriptionsScreenProps) {
  const [removing, setRemoving] = useState<number | null>(null);
  const [outcome, setOutcome] = useState<{ error?: unknown; success?: string } | null>(null);
  const names = new Map((districts.data ?? []).map((d) => [d.code, d.name]));
  const remove = async (id: number) => {
    setRemoving(id);
    setOutcome(null);
    try {
      await onRemove(id);
      setOutcome({ success: 'Subscription removed.' });
    } catch (error) {
      setOutcome({ error });
    } finally {
      setRemoving(null);
    }
  };
  return (
    <Page
      title="Subscriptions"
      intro="Choose what you hear about. Each alert reaches you once, in the app and by e-mail; every e-mail has a link to stop it."
      actions={<TextLink href="/alerts" label="Your alerts" leading="← " />}
      testID="subscriptions-screen"
    >
      <Section title="You follow">
        {outcome ? <MutationNotice error={outcome.error} success={outcome.success} testID="sub-remove" /> : null}
        {subscriptions.status === 'pending' ? (
          <Skeleton width="100%" height={120} />
        ) : subscriptions.status === 'error' || !subscriptions.data ? (
          <QueryErrorPanel
            what="your subscriptions"
            error={subscriptions.error}
            retrying={subscriptions.isFetching}
            onRetry={() => void subscriptions.refetch()}
            testID="subs-error"
          />
        ) : subscriptions.data.length === 0 ? (
          <StatePanel
            testID="subs-empty"
            title="Nothing yet"
            message="You get no alerts until you follow a district, a set of districts or the region."
          />
        ) : (
          <View style={styles.list} testID="subs-list">
            {subscriptions.data.map((s) => (
              <View key={s.id} style={styles.item} testID={`sub-${s.id}`}>
                <View style={styles.words}>
                  <Text style={styles.scope}>{scopeWords(s, names)}</Text>
                  <Text style={styles.meta} testID={`sub-${s.id}-tracks`}>
                    {trackWords(s, tracks)}
                  </Text>
                  <Text style={styles.meta}>{s.kinds.map((k) => ALERT_KIND_LABEL[k] ?? k).join(' · ')}</Text>
                  <View style={styles.pills}>
                    <Pill label={s.delivery === 'digest' ? 'Digest per publish' : 'E-mail per alert'} tone="info" />
                    {s.attachBrief ? <Pill label="Brief attached" tone="neutral" /> : null}
                    <Text style={styles.meta}>since {formatDate(s.createdAt)}</Text>
                  </View>
                </View>
                <ConfirmAction
                  label="Remove"
                  question="Stop these alerts?"
                  confirmLabel="Remove"
                  variant="danger"
                  busy={removing === s.id}
                  busyLabel="Removing…"
                  onConfirm={() => void remove(s.id)}
                  testID={`sub-remove-${s.id}`}
                />
              </View>
            ))}
          </View>
        )}
      </Section>
      <Section title="Follow more">
        {districts.status === 'error' ? (
          <QueryErrorPanel
            what="the district list"
            error={districts.error}
            retrying={districts.isFetching}
            onRetry={() => void districts.refetch()}
          />
        ) : (
          <SubscriptionForm districts={districts.data ?? []} tracks={tracks} onSubscribe={onSubscribe} />
        )}
      </Section>
    </Page>
  );
}

const styles = StyleSheet.create({
  list: { gap: space.sm },
  item: {
    flexDirection: 'row',
    flexWrap: 'wrap',
    alignItems: 'center',
    justifyContent: 'space-between',
    gap: space.md,
    backgroundColor: colors.surface,
    borderColor: colors.border,
    borderWidth: 1,
    borderRadius: radius.md,
    padding: space.md,
  },
  words: { flexShrink: 1, flexBasis: 260, flexGrow: 1, gap: space.xs },
  scope: { ...type.bodyStrong, color: colors.text },
  meta: { ...type.caption, color: colors.textMuted },
  pills: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.sm },
});
