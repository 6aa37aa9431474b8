import { useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';

import { ChoiceGroup } from '@/components/form/choice-group';
import { MutationNotice } from '@/components/form/mutation-notice';
import { Page, Section } from '@/components/layout/page';
import { QueryErrorPanel } from '@/components/state/query-error-panel';
import type { QueryState } from '@/components/state/query-state';
import { Skeleton } from '@/components/state/skeleton';
import { StatePanel } from '@/components/state/state-panel';
import { cellText, DataTable, type Column } from '@/components/table/data-table';
import { colors, radius, space, type } from '@/components/theme';
import { Button } from '@/components/ui/button';
import { Pill } from '@/components/ui/pill';
import { TextLink } from '@/components/ui/text-link';
import { formatDateTime, formatRelative } from '@/lib/format-time';
import { shownTracks } from '@/lib/track-choice';
import type { RunListItem, RunStarted } from '@/contracts/runs';
import type { SettingsResponse } from '@/contracts/settings';
import type { Track } from '@/contracts/tracks';

import { RUN_STATE, TRIGGER_LABEL } from './run-words';

export type RunsScreenProps = {
  runs: QueryState<RunListItem[]>;
  tracks: QueryState<Track[]>;
  settings: QueryState<SettingsResponse>;
  /** Queues one track's run ('all': one per active track) and resolves with the runs started. */
  onStart: (track: string | undefined) => Promise<RunStarted>;
  onOpen: (id: number) => void;
  /** Which track's runs the list shows ('all': every track's). */
  listTrack?: string;
  onListTrack?: (code: string) => void;
};

const columns: Column<RunListItem>[] = [
  {
    key: 'id',
    header: 'Run',
    width: 88,
    render: (r, { folded }) => (
      <TextLink
        href={{ pathname: '/runs/[id]', params: { id: String(r.id) } }}
        label={folded ? `Run #${r.id}` : `#${r.id}`}
        accessibilityLabel={`Run ${r.id}`}
      />
    ),
    sortValue: (r) => r.id,
  },
  {
    key: 'state',
    header: 'State',
    width: 120,
    render: (r) => (
      <Pill label={RUN_STATE[r.state].label} tone={RUN_STATE[r.state].tone} testID={`run-row-state-${r.id}`} />
    ),
    sortValue: (r) => r.state,
  },
  {
    key: 'track',
    header: 'Track',
    flex: 1.4,
    render: (r) => <Text style={cellText.strong}>{r.trackName}</Text>,
    sortValue: (r) => r.trackName,
  },
  {
    key: 'spec',
    header: 'Spec',
    flex: 2,
    render: (r) => (
      <View style={styles.stack}>
        <Text style={cellText.strong}>{r.specName}</Text>
        <Text style={cellText.muted}>{TRIGGER_LABEL[r.trigger] ?? r.trigger}</Text>
      </View>
    ),
    sortValue: (r) => r.specName,
  },
  {
    key: 'created',
    header: 'Queued',
    flex: 1.4,
    render: (r) => formatDateTime(r.createdAt),
    sortValue: (r) => r.createdAt,
  },
  {
    key: 'done',
    header: 'Finished / published',
    flex: 1.6,
    render: (r) =>
      r.publishedAt
        ? `Published ${formatDateTime(r.publishedAt)}`
        : r.finishedAt
          ? formatDateTime(r.finishedAt)
          : (r.error ?? '—'),
    sortValue: (r) => r.publishedAt ?? r.finishedAt,
  },
  {
    key: 'districts',
    header: 'Districts',
    width: 90,
    align: 'right',
    render: (r) => (r.districts === null ? '—' : String(r.districts)),
  },
];

/** "Re-estimate now", the schedule's next start, and the recent runs. */
export function RunsScreen({
  runs,
  tracks,
  settings,
  onStart,
  onOpen,
  listTrack = 'all',
  onListTrack,
}: RunsScreenProps) {
  const [picked, setPicked] = useState<string | null>(null);
  const [start, setStart] = useState<{ busy: boolean; error?: unknown; success?: string }>({ busy: false });
  // Paused tracks get no scheduled runs but can still be re-estimated by hand; archived ones cannot.
  const open = shownTracks(tracks.data ?? []);
  const active = open.filter((t) => t.state === 'active');
  const headline = open.find((t) => t.headline) ?? open[0];
  const chosen = picked ?? headline?.code ?? null;
  const schedule = settings.data?.schedule;
  const names = new Map(open.map((t) => [t.code, t.name]));

  const go = async () => {
    setStart({ busy: true });
    try {
      const started = await onStart(chosen ?? undefined);
      if (started.runs.length <= 1) {
        setStart({ busy: false });
        onOpen(started.id);
        return;
      }
      setStart({
        busy: false,
        success: `Queued ${started.runs.length} runs: ${started.runs
          .map((r) => `#${r.id} ${names.get(r.track) ?? r.track}`)
          .join(', ')}.`,
      });
    } catch (error) {
      setStart({ busy: false, error });
    }
  };

  return (
    <Page
      title="Runs"
      intro="A run re-estimates every district for one track (a watched indicator and its spec) on one data version. Its estimates stay in review until an analyst publishes them."
      testID="runs-screen"
    >
      <Section title="Re-estimate now">
        <View style={styles.startBox}>
          {tracks.status === 'pending' ? (
            <Skeleton width="100%" height={44} />
          ) : tracks.status === 'error' ? (
            <QueryErrorPanel
              what="the tracks"
              error={tracks.error}
              retrying={tracks.isFetching}
              onRetry={() => void tracks.refetch()}
            />
          ) : open.length > 1 ? (
            <ChoiceGroup
              label="Track"
              choices={[
                ...open.map((t) => ({
                  value: t.code,
                  label: t.name,
                  hint: `${t.indicator.unit} · spec “${t.specName}”${t.headline ? ' · headline' : ''}${
                    t.state === 'paused' ? ' · paused' : ''
                  }`,
                })),
                ...(active.length > 1
                  ? [{ value: 'all', label: 'All active tracks', hint: `${active.length} runs, one per track` }]
                  : []),
              ]}
              value={chosen}
              onChange={setPicked}
              testID="run-track"
            />
          ) : open.length === 1 ? (
            <Text style={styles.lead}>
              Track: {open[0].name} (spec “{open[0].specName}”)
            </Text>
          ) : (
            <Text style={styles.lead}>No open track: an admin creates one under Settings.</Text>
          )}
          <Button
            label="Re-estimate now"
            onPress={() => void go()}
            busy={start.busy}
            busyLabel="Queuing…"
            testID="run-start"
          />
          <MutationNotice error={start.error} success={start.success} testID="run-start" />
          <Text style={styles.note} testID="runs-schedule">
            {schedule
              ? schedule.enabled && schedule.nextRunAt
                ? `Next scheduled run: ${formatDateTime(schedule.nextRunAt, schedule.timeZone)} (${formatRelative(schedule.nextRunAt)}).`
                : 'Scheduled runs are switched off.'
              : ''}
          </Text>
        </View>
      </Section>
      <Section title="Recent runs">
        {onListTrack && open.length > 1 ? (
          <ChoiceGroup
            label="Show runs of"
            choices={[{ value: 'all', label: 'Every track' }, ...open.map((t) => ({ value: t.code, label: t.name }))]}
            value={listTrack}
            onChange={onListTrack}
            testID="runs-track"
          />
        ) : null}
        {runs.status === 'pending' ? (
          <Skeleton width="100%" height={200} />
        ) : runs.status === 'error' || !runs.data ? (
          <QueryErrorPanel
            what="the runs"
            error={runs.error}
            retrying={runs.isFetching}
            onRetry={() => void runs.refetch()}
            testID="runs-error"
          />
        ) : runs.data.length === 0 ? (
          <StatePanel
            testID="runs-empty"
            title="No runs yet"
            message="Start one with “Re-estimate now”, or wait for the scheduled run."
          />
        ) : (
          <DataTable
            label="Recent runs"
            columns={columns}
            rows={runs.data}
            rowKey={(r) => String(r.id)}
            minWidth={760}
            rowTestID={(r) => `run-row-${r.id}`}
            cardTitle={(r) => `Run #${r.id}`}
            testID="runs-table"
          />
        )}
      </Section>
    </Page>
  );
}

const styles = StyleSheet.create({
  startBox: {
    gap: space.md,
    backgroundColor: colors.surface,
    borderColor: colors.border,
    borderWidth: 1,
    borderRadius: radius.lg,
    padding: space.lg,
  },
  lead: { ...type.body, color: colors.text },
  note: { ...type.caption, color: colors.textMuted },
  stack: { gap: space.xxs },
});
