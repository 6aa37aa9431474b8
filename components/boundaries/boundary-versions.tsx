import { useState } from 'react';
import { StyleSheet, Text, useWindowDimensions, View } from 'react-native';

import { MutationNotice } from '@/components/form/mutation-notice';
import { QueryErrorPanel } from '@/components/state/query-error-panel';
import type { QueryState } from '@/components/state/query-state';
import { Skeleton } from '@/components/state/skeleton';
import { StatePanel } from '@/components/state/state-panel';
import { cellText, DataTable, type Column } from '@/components/table/data-table';
import { colors, space, type } from '@/components/theme';
import { ConfirmAction } from '@/components/ui/confirm-action';
import { Pill } from '@/components/ui/pill';
import { formatDateTime } from '@/lib/format-time';
import type { BoundaryRevertAnswer, BoundaryVersion, BoundaryVersions as Versions } from '@/contracts/boundaries';

import { revertedWords } from './boundary-words';
import { formatCount } from '@/lib/format';

export type BoundaryVersionsProps = {
  versions: QueryState<Versions>;
  onRevert: (id: number) => Promise<BoundaryRevertAnswer>;
};

function status(v: BoundaryVersion): { label: string; tone: 'success' | 'neutral' | 'warning' } {
  if (v.current) return { label: 'In force', tone: 'success' };
  if (v.status === 'reverted') return { label: 'Reverted', tone: 'neutral' };
  return { label: 'Replaced', tone: 'neutral' };
}

/** Every boundary version, newest first: who loaded it, when, its counts, which is in force, and Revert. */
export function BoundaryVersions({ versions, onRevert }: BoundaryVersionsProps) {
  const narrow = useWindowDimensions().width < NARROW;
  const [reverting, setReverting] = useState<number | null>(null);
  const [outcome, setOutcome] = useState<{ error?: unknown; success?: string } | null>(null);

  if (versions.status === 'pending') {
    return (
      <View role="progressbar" style={styles.skeleton} accessible accessibilityLabel="Loading the boundary versions">
        {[0, 1].map((i) => (
          <Skeleton key={i} width="100%" height={44} />
        ))}
      </View>
    );
  }
  if (versions.status === 'error' || !versions.data) {
    return (
      <QueryErrorPanel
        what="the boundary versions"
        error={versions.error}
        retrying={versions.isFetching}
        onRetry={() => void versions.refetch()}
        testID="boundary-versions-error"
      />
    );
  }
  const rows = versions.data.versions;

  const revert = async (id: number) => {
    setReverting(id);
    setOutcome(null);
    try {
      setOutcome({ success: revertedWords(id, await onRevert(id)) });
    } catch (error) {
      setOutcome({ error });
    } finally {
      setReverting(null);
    }
  };

  const revertButton = (v: BoundaryVersion) =>
    v.status === 'committed' ? (
      <ConfirmAction
        label="Revert"
        question={`Revert boundary version ${v.id}? ${v.current ? 'The version before it is in force again.' : 'It no longer counts as loaded.'}`}
        confirmLabel="Revert"
        variant="danger"
        busy={reverting === v.id}
        busyLabel="Reverting…"
        disabled={reverting !== null && reverting !== v.id}
        onConfirm={() => void revert(v.id)}
        testID={`boundary-revert-${v.id}`}
      />
    ) : null;

  const columns: Column<BoundaryVersion>[] = [
    {
      key: 'id',
      header: 'Version',
      width: 96,
      render: (v, { folded }) => (
        <View style={styles.stack}>
          <Text style={folded ? styles.title : cellText.strong}>{folded ? `Version ${v.id}` : v.id}</Text>
          <Text style={cellText.muted}>upload #{v.uploadId}</Text>
        </View>
      ),
      sortValue: (v) => v.id,
    },
    {
      key: 'file',
      header: 'File',
      flex: 2,
      render: (v) => (
        <View style={styles.stack}>
          <Text style={cellText.strong} numberOfLines={2}>
            {v.fileName ?? 'File without a name'}
          </Text>
          <Text style={cellText.muted} numberOfLines={2}>
            {formatDateTime(v.createdAt)} · {v.userEmail ?? 'demo set-up'} · code in &quot;{v.codeProperty}&quot;
          </Text>
        </View>
      ),
      sortValue: (v) => v.createdAt,
    },
    {
      key: 'status',
      header: 'Status',
      width: 110,
      render: (v) => <Pill label={status(v).label} tone={status(v).tone} testID={`boundary-version-status-${v.id}`} />,
      sortValue: (v) => (v.current ? 0 : v.status === 'committed' ? 1 : 2),
    },
    {
      key: 'counts',
      header: 'Districts',
      subheader: 'mapped · without',
      width: 130,
      align: 'right',
      render: (v) => `${v.features} · ${v.missing}`,
      sortValue: (v) => v.features,
    },
    {
      key: 'vertices',
      header: 'Vertices',
      width: 130,
      align: 'right',
      render: (v) => `${formatCount(v.vertices)}${v.repaired ? ` · ${v.repaired} repaired` : ''}`,
      sortValue: (v) => v.vertices,
    },
    {
      key: 'data',
      header: 'Data version',
      width: 96,
      align: 'right',
      render: (v) => (v.dataVersion === null ? '—' : String(v.dataVersion)),
      sortValue: (v) => v.dataVersion,
    },
    {
      key: 'revert',
      header: '',
      width: 200,
      render: (v) => revertButton(v),
    },
  ];

  return (
    <View style={styles.wrap}>
      {outcome ? <MutationNotice error={outcome.error} success={outcome.success} testID="boundary-revert" /> : null}
      {rows.length === 0 ? (
        <StatePanel
          testID="boundary-versions-empty"
          title="No boundaries loaded yet"
          message="The region is shown as a list until district boundaries are loaded. Files you load appear here, newest first."
        />
      ) : (
        <DataTable
          label="Boundary versions"
          columns={columns}
          rows={rows}
          rowKey={(v) => String(v.id)}
          minWidth={900}
          rowTestID={(v) => `boundary-version-${v.id}`}
          cardTitle={(v) => `Version ${v.id}`}
          folded={narrow || undefined}
          testID="boundary-versions"
        />
      )}
    </View>
  );
}

/** Below this window width the versions are cards (the table needs 900 px for Revert to be in view). */
const NARROW = 760;

const styles = StyleSheet.create({
  wrap: { gap: space.md },
  title: { ...type.bodyStrong, color: colors.text },
  skeleton: { gap: space.sm },
  stack: { gap: space.xxs, minWidth: 0 },
});
