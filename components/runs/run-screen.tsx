import { StyleSheet, Text, View } from 'react-native';

import { Page, Section, SplitColumns } from '@/components/layout/page';
import { QueryErrorPanel } from '@/components/state/query-error-panel';
import type { QueryState } from '@/components/state/query-state';
import { Skeleton } from '@/components/state/skeleton';
import { StatePanel } from '@/components/state/state-panel';
import { colors, radius, space, type } from '@/components/theme';
import { TextLink } from '@/components/ui/text-link';
import { ApiError } from '@/lib/api-client';
import type { DistrictReview, PublishAnswer, ReviewResponse, RunView } from '@/contracts/runs';

import { DecisionBar } from './decision-bar';
import { DistrictReviewPanel } from './district-review-panel';
import { ReviewTable } from './review-table';
import { RunFacts } from './run-facts';
import { RunProgress } from './run-progress';

export type RunScreenProps = {
  runId: number;
  /** The district open beside (wide) or instead of (phone) the table. */
  selectedCode: string | null;
  wide: boolean;
  run: QueryState<RunView>;
  review: QueryState<ReviewResponse>;
  district: QueryState<DistrictReview>;
  onPublish: () => Promise<PublishAnswer>;
  onDiscard: () => Promise<unknown>;
  onSaveNote: (code: string, note: string) => Promise<unknown>;
  /** The driver's unit from the indicator catalogue (thresholds are incomes). */
  incomeUnit?: string;
};

/**
 * One run: while it works, its progress; once fitted, the review — per district the change
 * against the last published run, each district's fits, checks and residuals, a note — and
 * the decision to publish or discard.
 */
export function RunScreen(props: RunScreenProps) {
  const { runId } = props;
  return (
    <Page
      title={props.run.data ? `Run #${runId} · ${props.run.data.track.name}` : `Run #${runId}`}
      actions={<TextLink href="/runs" label="All runs" leading="← " />}
      fill={props.wide}
      testID="run-screen"
    >
      <RunBody {...props} />
    </Page>
  );
}

function RunBody({
  runId,
  selectedCode,
  wide,
  run,
  review,
  district,
  onPublish,
  onDiscard,
  onSaveNote,
  incomeUnit,
}: RunScreenProps) {
  if (run.status === 'pending') {
    return (
      <View role="progressbar" style={styles.gap} accessible accessibilityLabel="Loading the run">
        <Skeleton width="100%" height={140} />
        <Skeleton width="100%" height={280} />
      </View>
    );
  }
  if (run.status === 'error' || !run.data) {
    if (run.error instanceof ApiError && run.error.code === 'not_found') {
      return (
        <StatePanel
          testID="run-not-found"
          title={`No run #${runId}`}
          message="The number may be mistyped; the list shows every run."
        >
          <TextLink href="/runs" label="Go to the runs" />
        </StatePanel>
      );
    }
    return (
      <QueryErrorPanel
        what={`run #${runId}`}
        error={run.error}
        retrying={run.isFetching}
        onRetry={() => void run.refetch()}
        testID="run-error"
      />
    );
  }
  const r = run.data;
  const active = r.state === 'queued' || r.state === 'running';
  const reviewable = r.state === 'in_review' || r.state === 'published' || r.state === 'discarded';
  const closed = r.state === 'discarded' || r.state === 'failed';
  const rows = review.data?.districts ?? [];
  const row = selectedCode ? (rows.find((d) => d.code === selectedCode) ?? null) : null;

  const panel = selectedCode ? (
    <DistrictReviewPanel
      code={selectedCode}
      row={row}
      review={district}
      onSaveNote={(note) => onSaveNote(selectedCode, note)}
      runClosed={closed}
      incomeUnit={incomeUnit}
      backHref={wide ? undefined : { pathname: '/runs/[id]', params: { id: String(runId) } }}
    />
  ) : wide ? (
    <View style={styles.hint}>
      <Text style={styles.hintText}>
        Choose a district in the table to see its fits, why its threshold moved, its residual checks and plot, and to
        add a note.
      </Text>
    </View>
  ) : null;

  let reviewBlock = null;
  if (reviewable) {
    if (review.status === 'pending') reviewBlock = <Skeleton width="100%" height={320} />;
    else if (review.status === 'error' || !review.data)
      reviewBlock = (
        <QueryErrorPanel
          what="the review"
          error={review.error}
          retrying={review.isFetching}
          onRetry={() => void review.refetch()}
        />
      );
    else
      reviewBlock = (
        <ReviewTable
          runId={runId}
          rows={rows}
          previousRunId={review.data.previousRunId}
          shiftPercent={review.data.thresholdShiftPercent}
          selectedCode={selectedCode}
          incomeUnit={incomeUnit}
        />
      );
  }

  // Phone with a district open: the district alone, with its way back.
  if (!wide && selectedCode && reviewable) {
    return (
      <View style={styles.gap}>
        <DecisionBar runId={runId} state={r.state} onPublish={onPublish} onDiscard={onDiscard} />
        {panel}
      </View>
    );
  }

  return (
    <View style={styles.gap}>
      <RunFacts run={r} />
      {active ? <RunProgress run={r} /> : null}
      <DecisionBar runId={runId} state={r.state} onPublish={onPublish} onDiscard={onDiscard} />
      {reviewable ? (
        <Section title={`Changes by district · ${r.track.name}`}>
          <SplitColumns wide={wide} main={reviewBlock} side={panel} />
        </Section>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  gap: { gap: space.xl },
  hint: {
    borderWidth: 1,
    borderStyle: 'dashed',
    borderColor: colors.border,
    borderRadius: radius.lg,
    padding: space.lg,
  },
  hintText: { ...type.body, color: colors.textMuted },
});
