import { useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';

import { MutationNotice } from '@/components/form/mutation-notice';
import { Page, Section } from '@/components/layout/page';
import { QueryErrorPanel } from '@/components/state/query-error-panel';
import type { QueryState } from '@/components/state/query-state';
import { Skeleton } from '@/components/state/skeleton';
import { StatePanel } from '@/components/state/state-panel';
import { colors, radius, space, type } from '@/components/theme';
import { textSize } from '@/lib/text-size';
import { Button } from '@/components/ui/button';
import { ConfirmAction } from '@/components/ui/confirm-action';
import { Pill } from '@/components/ui/pill';
import { TextLink } from '@/components/ui/text-link';
import { ApiError } from '@/lib/api-client';
import { formatBytes, formatDateTime } from '@/lib/format-time';
import type { RevertAnswer, UploadAnswer, UploadDetailResponse } from '@/contracts/uploads';

import { PreviewSummary } from './preview-summary';
import { ProblemsTable } from './problems-table';
import { noopSummary, uploadStatus, uploadTitle } from './upload-words';

export type UploadDetailProps = {
  id: number;
  detail: QueryState<UploadDetailResponse>;
  onCommit: (id: number) => Promise<UploadAnswer>;
  onRevert: (id: number) => Promise<RevertAnswer>;
};

/** One upload: who loaded what and when, what it changed, its problems; commit or revert it. */
export function UploadDetail({ id, detail, onCommit, onRevert }: UploadDetailProps) {
  const [busy, setBusy] = useState<'commit' | 'revert' | null>(null);
  const [outcome, setOutcome] = useState<{ error?: unknown; success?: string } | null>(null);
  const act = async (which: 'commit' | 'revert') => {
    setBusy(which);
    setOutcome(null);
    try {
      if (which === 'commit') {
        const a = await onCommit(id);
        setOutcome({ success: a.noop ? noopSummary(a.upload) : `Loaded. Data version ${a.upload.version ?? '—'}.` });
      } else {
        const r = await onRevert(id);
        setOutcome({
          success: `Reverted by upload #${r.revert.id}: ${r.restored.changedBack} values put back, ${r.restored.removed} removed.`,
        });
      }
    } catch (error) {
      setOutcome({ error });
    } finally {
      setBusy(null);
    }
  };

  let body;
  if (detail.status === 'pending') {
    body = <Skeleton width="100%" height={200} />;
  } else if (detail.status === 'error' || !detail.data) {
    body =
      detail.error instanceof ApiError && detail.error.code === 'not_found' ? (
        <StatePanel
          testID="upload-not-found"
          title={`No upload #${id}`}
          message="It may have been mistyped. The history lists every upload."
        >
          <TextLink href="/uploads" label="Go to the upload history" />
        </StatePanel>
      ) : (
        <QueryErrorPanel
          what={`upload #${id}`}
          error={detail.error}
          retrying={detail.isFetching}
          onRetry={() => void detail.refetch()}
        />
      );
  } else {
    const { upload: u, preview, problems } = detail.data;
    const status = uploadStatus(u);
    body = (
      <>
        <View style={styles.facts}>
          <Pill label={status.label} tone={status.tone} testID="upload-detail-status" />
          <Fact label="Checked" value={formatDateTime(u.createdAt)} />
          <Fact label="Loaded" value={formatDateTime(u.committedAt)} />
          <Fact label="By" value={u.by?.email ?? 'system'} />
          <Fact label="Size" value={formatBytes(u.byteSize)} />
          <Fact label="Data version" value={u.version === null ? '—' : String(u.version)} />
          {u.checksum ? <Fact label="Checksum (SHA-256)" value={`${u.checksum.slice(0, 16)}…`} /> : null}
          {u.revertedByUploadId ? (
            <TextLink
              href={{ pathname: '/uploads/[id]', params: { id: String(u.revertedByUploadId) } }}
              label={`Reverted by #${u.revertedByUploadId}`}
            />
          ) : null}
          {u.revertsUploadId ? (
            <TextLink
              href={{ pathname: '/uploads/[id]', params: { id: String(u.revertsUploadId) } }}
              label={`Reverts #${u.revertsUploadId}`}
            />
          ) : null}
        </View>
        {u.canCommit || u.canRevert ? (
          <View style={styles.actions}>
            {u.canCommit ? (
              <Button
                label="Load these values"
                busy={busy === 'commit'}
                busyLabel="Loading…"
                onPress={() => void act('commit')}
                testID="upload-detail-commit"
              />
            ) : null}
            {u.canRevert ? (
              <ConfirmAction
                label="Revert this upload"
                question="Put back every value this upload replaced, and remove those it added?"
                confirmLabel="Revert"
                variant="danger"
                busy={busy === 'revert'}
                busyLabel="Reverting…"
                onConfirm={() => void act('revert')}
                testID="upload-detail-revert"
              />
            ) : null}
          </View>
        ) : null}
        {outcome ? <MutationNotice error={outcome.error} success={outcome.success} testID="upload-detail" /> : null}
        {problems.length ? (
          <Section title="Problems">
            <ProblemsTable problems={problems} errorCount={u.counts.errors} warningCount={u.counts.warnings} />
          </Section>
        ) : null}
        {preview ? (
          <Section title="What it changes">
            <PreviewSummary preview={preview} />
          </Section>
        ) : (
          <Text style={styles.muted}>No preview was kept for this upload.</Text>
        )}
      </>
    );
  }
  const title = detail.data ? `Upload #${id}: ${uploadTitle(detail.data.upload)}` : `Upload #${id}`;
  return (
    <Page title={title} actions={<TextLink href="/uploads" label="All uploads" leading="← " />} testID="upload-detail">
      {body}
    </Page>
  );
}

function Fact({ label, value }: { label: string; value: string }) {
  return (
    <View style={styles.fact}>
      <Text style={styles.factLabel}>{label}</Text>
      <Text style={styles.factValue}>{value}</Text>
    </View>
  );
}

const styles = StyleSheet.create({
  facts: {
    flexDirection: 'row',
    flexWrap: 'wrap',
    alignItems: 'center',
    gap: space.lg,
    backgroundColor: colors.surface,
    borderColor: colors.border,
    borderWidth: 1,
    borderRadius: radius.lg,
    padding: space.lg,
  },
  fact: { gap: space.xxs },
  factLabel: { ...type.caption, color: colors.textMuted },
  factValue: { ...type.bodyStrong, fontSize: textSize(14), color: colors.text },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md, alignItems: 'flex-start' },
  muted: { ...type.body, color: colors.textMuted },
});
