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
import type { RunListItem } from '@/contracts/runs';
import type { SettingsResponse, SpecsResponse } from '@/contracts/settings';

import { RUN_STATE, TRIGGER_LABEL } from './run-words';

export type RunsScreenProps = {
  runs: QueryState<RunListItem[]>;
  specs: QueryState<SpecsResponse>;
  settings: QueryState<SettingsResponse>;
  /** Queues a run and resolves with its id (the screen then opens it). */
  onStart: (specId: number | undefined) => Promise<{ id: number }>;
  onOpen: (id: number) => void;
};

const columns: Column<RunListItem>[] = [
  {
    key: 'id',
    header: 'Run',
    width: 88,
    render: (r) => (
      <TextLink
        href={{ pathname: '/runs/[id]', params: { id: String(r.id) } }}
        label={`#${r.id}`}
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
export function RunsScreen({ runs, specs, settings, onStart, onOpen }: RunsScreenProps) {
  const [specId, setSpecId] = useState<string | null>(null);
  const [start, setStart] = useState<{ busy: boolean; error?: unknown }>({ busy: false });
  const available = (specs.data?.specs ?? []).filter((s) => !s.archived);
  const chosen = specId ?? (specs.data ? String(specs.data.defaultSpecId) : null);
  const schedule = settings.data?.schedule;

  const go = async () => {
    setStart({ busy: true });
    try {
      const { id } = await onStart(chosen ? Number(chosen) : undefined);
      setStart({ busy: false });
      onOpen(id);
    } catch (error) {
      setStart({ busy: false, error });
    }
  };

  return (
    <Page
      title="Runs"
      intro="A run re-estimates every district with one spec on one data version. Its estimates stay in review until an analyst publishes them."
      testID="runs-screen"
    >
      <Section title="Re-estimate now">
        <View style={styles.startBox}>
          {specs.status === 'pending' ? (
            <Skeleton width="100%" height={44} />
          ) : specs.status === 'error' ? (
            <QueryErrorPanel
              what="the specs"
              error={specs.error}
              retrying={specs.isFetching}
              onRetry={() => void specs.refetch()}
            />
          ) : available.length > 1 ? (
            <ChoiceGroup
              label="Spec"
              choices={available.map((s) => ({
                value: String(s.id),
                label: s.name,
                hint: s.isDefault ? 'the region’s default' : undefined,
              }))}
              value={chosen}
              onChange={setSpecId}
              testID="run-spec"
            />
          ) : available.length === 1 ? (
            <Text style={styles.lead}>Spec: {available[0].name}</Text>
          ) : null}
          <Button
            label="Re-estimate now"
            onPress={() => void go()}
            busy={start.busy}
            busyLabel="Queuing…"
            testID="run-start"
          />
          <MutationNotice error={start.error} testID="run-start" />
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
