import { useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';

import { MutationNotice } from '@/components/form/mutation-notice';
import { QueryErrorPanel } from '@/components/state/query-error-panel';
import type { QueryState } from '@/components/state/query-state';
import { Skeleton } from '@/components/state/skeleton';
import { StatePanel } from '@/components/state/state-panel';
import { cellText, DataTable, type Column } from '@/components/table/data-table';
import { space } from '@/components/theme';
import { ConfirmAction } from '@/components/ui/confirm-action';
import { Pill } from '@/components/ui/pill';
import { TextLink } from '@/components/ui/text-link';
import { formatDateTime } from '@/lib/format-time';
import type { RevertAnswer, UploadListResponse, UploadSummary } from '@/contracts/uploads';

import { uploadStatus, uploadTitle } from './upload-words';

export type UploadHistoryProps = {
  uploads: QueryState<UploadListResponse>;
  /** Null when the role may not revert (the column is left out). */
  onRevert: ((id: number) => Promise<RevertAnswer>) | null;
};

/** Every upload, newest first: who, when, what it changed, its data version, and Revert. */
export function UploadHistory({ uploads, onRevert }: UploadHistoryProps) {
  const [reverting, setReverting] = useState<number | null>(null);
  const [outcome, setOutcome] = useState<{ error?: unknown; success?: string } | null>(null);

  if (uploads.status === 'pending') {
    return (
      <View role="progressbar" style={styles.skeleton} accessible accessibilityLabel="Loading the upload history">
        {[0, 1, 2].map((i) => (
          <Skeleton key={i} width="100%" height={44} />
        ))}
      </View>
    );
  }
  if (uploads.status === 'error' || !uploads.data) {
    return (
      <QueryErrorPanel
        what="the upload history"
        error={uploads.error}
        retrying={uploads.isFetching}
        onRetry={() => void uploads.refetch()}
        testID="upload-history-error"
      />
    );
  }
  const rows = uploads.data.uploads;
  if (rows.length === 0) {
    return (
      <StatePanel
        testID="upload-history-empty"
        title="No uploads yet"
        message="Files you check or load appear here, newest first."
      />
    );
  }

  const revert = async (id: number) => {
    if (!onRevert) return;
    setReverting(id);
    setOutcome(null);
    try {
      const answer = await onRevert(id);
      const r = answer.restored;
      setOutcome({
        success: `Upload #${id} reverted: ${r.changedBack} values put back, ${r.removed} removed, ${r.reinserted} restored. Data version ${answer.revert.version ?? '—'}.`,
      });
    } catch (error) {
      setOutcome({ error });
    } finally {
      setReverting(null);
    }
  };

  const columns: Column<UploadSummary>[] = [
    {
      key: 'id',
      header: 'Upload',
      width: 92,
      render: (u, { folded }) => (
        <TextLink
          href={{ pathname: '/uploads/[id]', params: { id: String(u.id) } }}
          label={folded ? `Upload #${u.id}` : `#${u.id}`}
          accessibilityLabel={`Upload ${u.id}`}
        />
      ),
      sortValue: (u) => u.id,
    },
    {
      key: 'what',
      header: 'File',
      flex: 2.2,
      render: (u) => (
        <View style={styles.stack}>
          <Text style={cellText.strong}>{uploadTitle(u)}</Text>
          <Text style={cellText.muted}>
            {formatDateTime(u.committedAt ?? u.createdAt)} · {u.by?.email ?? 'system'}
          </Text>
        </View>
      ),
      sortValue: (u) => uploadTitle(u),
    },
    {
      key: 'status',
      header: 'Status',
      width: 150,
      render: (u) => (
        <Pill label={uploadStatus(u).label} tone={uploadStatus(u).tone} testID={`upload-status-${u.id}`} />
      ),
      sortValue: (u) => u.status,
    },
    {
      key: 'changes',
      header: 'Values',
      subheader: 'new · changed',
      width: 120,
      align: 'right',
      render: (u) => `${u.counts.insert} · ${u.counts.change}`,
      sortValue: (u) => u.counts.insert + u.counts.change,
    },
    {
      key: 'version',
      header: 'Version',
      width: 80,
      align: 'right',
      render: (u) => (u.version === null ? '—' : String(u.version)),
      sortValue: (u) => u.version,
    },
  ];
  if (onRevert) {
    columns.push({
      key: 'revert',
      header: '',
      width: 200,
      render: (u) =>
        u.canRevert ? (
          <ConfirmAction
            label="Revert"
            question={`Put back what upload #${u.id} replaced?`}
            confirmLabel="Revert"
            variant="danger"
            busy={reverting === u.id}
            busyLabel="Reverting…"
            disabled={reverting !== null && reverting !== u.id}
            onConfirm={() => void revert(u.id)}
            testID={`upload-revert-${u.id}`}
          />
        ) : u.revertedByUploadId ? (
          <Text style={cellText.muted}>by #{u.revertedByUploadId}</Text>
        ) : null,
    });
  }
  return (
    <View style={styles.wrap}>
      {outcome ? <MutationNotice error={outcome.error} success={outcome.success} testID="upload-revert" /> : null}
      <DataTable
        label="Upload history"
        columns={columns}
        rows={rows}
        rowKey={(u) => String(u.id)}
        minWidth={onRevert ? 820 : 620}
        rowTestID={(u) => `upload-row-${u.id}`}
        cardTitle={(u) => `Upload #${u.id}`}
        testID="upload-history"
      />
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.md },
  skeleton: { gap: space.sm },
  stack: { gap: space.xxs, minWidth: 0 },
});
