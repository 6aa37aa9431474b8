import { StyleSheet, Text, View } from 'react-native';

import { QueryErrorPanel } from '@/components/state/query-error-panel';
import type { QueryState } from '@/components/state/query-state';
import { Skeleton } from '@/components/state/skeleton';
import { cellText, DataTable, type Column } from '@/components/table/data-table';
import { colors, radius, space, type } from '@/components/theme';
import { Pill } from '@/components/ui/pill';
import { TextLink } from '@/components/ui/text-link';
import { formatLevel, intervalText, levelPercent, notBoundedText, VARIANT_LABEL } from '@/lib/estimate-words';
import { withUnit } from '@/lib/units';
import type { DistrictReview, ReviewRow, RunEstimateRecord } from '@/contracts/runs';

import { DiagnosticsList } from './diagnostics-list';
import { MovementSplit } from './movement-split';
import { NoteEditor } from './note-editor';
import { ResidualPlot } from './residual-plot';
import { shapeWord, standingWord } from './run-words';

const VARIANT_NAMES: Record<string, string> = { main: 'This run’s spec', ...VARIANT_LABEL };
const VARIANT_ORDER = ['main', 'no_controls', 'cubic', 'last20', 'level'];

const variantColumns: Column<RunEstimateRecord>[] = [
  {
    key: 'variant',
    header: 'Fit',
    flex: 1.6,
    render: (r) => <Text style={cellText.strong}>{VARIANT_NAMES[r.variant] ?? r.variant}</Text>,
  },
  {
    key: 'standing',
    header: 'Standing',
    flex: 1.4,
    render: (r) =>
      r.status === 'not_estimable' ? (
        <Text style={cellText.muted}>{r.reason?.message ?? 'not estimable'}</Text>
      ) : (
        standingWord(r.standing.standing)
      ),
  },
  {
    key: 'threshold',
    header: 'Threshold',
    flex: 1,
    align: 'right',
    render: (r) => (r.threshold?.level == null ? '—' : formatLevel(r.threshold.level)),
  },
  { key: 'shape', header: 'Shape', flex: 1, render: (r) => shapeWord(r.shape?.shape) },
  { key: 'n', header: 'Years', width: 64, align: 'right', render: (r) => String(r.n) },
];

export type DistrictReviewPanelProps = {
  code: string;
  /** The district's review row (name, change flags), when the review list has loaded. */
  row: ReviewRow | null;
  review: QueryState<DistrictReview>;
  /** Null when the role may not write notes. */
  onSaveNote: ((note: string) => Promise<unknown>) | null;
  runClosed: boolean;
  /** Phone: a link back to the table. */
  backHref?: { pathname: '/runs/[id]'; params: { id: string } };
  /** The driver's unit from the catalogue (thresholds are incomes). */
  incomeUnit?: string;
};

/** One district in the run: where it stands, every variant, why the threshold moved, the residual checks and plot, a note. */
export function DistrictReviewPanel({
  code,
  row,
  review,
  onSaveNote,
  runClosed,
  backHref,
  incomeUnit,
}: DistrictReviewPanelProps) {
  const title = row ? `${row.name} (${code})` : code;
  return (
    <View style={styles.panel} testID="district-review">
      {backHref ? <TextLink href={backHref} label="All districts in this run" leading="← " /> : null}
      <Text role="heading" aria-level={2} style={styles.title}>
        {title}
      </Text>
      <Body
        review={review}
        row={row}
        code={code}
        onSaveNote={onSaveNote}
        runClosed={runClosed}
        incomeUnit={incomeUnit}
      />
    </View>
  );
}

function Body({ review, row, code, onSaveNote, runClosed, incomeUnit }: Omit<DistrictReviewPanelProps, 'backHref'>) {
  if (review.status === 'pending') {
    return (
      <View style={styles.gap} accessible accessibilityLabel={`Loading ${code}`}>
        <Skeleton width="70%" height={20} />
        <Skeleton width="100%" height={120} />
        <Skeleton width="100%" height={180} />
      </View>
    );
  }
  if (review.status === 'error' || !review.data) {
    return (
      <QueryErrorPanel
        what={`district ${code} in this run`}
        error={review.error}
        retrying={review.isFetching}
        onRetry={() => void review.refetch()}
      />
    );
  }
  const d = review.data;
  const records = [...d.records].sort((a, b) => VARIANT_ORDER.indexOf(a.variant) - VARIANT_ORDER.indexOf(b.variant));
  const main = records.find((r) => r.variant === 'main') ?? null;
  return (
    <View style={styles.gap}>
      {main ? (
        <Headline main={main} row={row} incomeUnit={incomeUnit} />
      ) : (
        <Text style={styles.body}>No estimate for this district in the run.</Text>
      )}
      <Block title="Why the threshold moved">
        <MovementSplit movement={d.movement} previousRunId={d.previousRunId} />
      </Block>
      <Block title="Sensitivity">
        <DataTable
          label={`Fits of ${code} under each variant`}
          columns={variantColumns}
          rows={records}
          rowKey={(r) => r.variant}
          cardTitle={(r) => VARIANT_NAMES[r.variant] ?? r.variant}
          minWidth={440}
          testID="variants"
        />
      </Block>
      {main?.diagnostics ? (
        <>
          <Block title="Residual checks">
            <DiagnosticsList diagnostics={main.diagnostics} alpha={main.model.alpha} />
          </Block>
          <ResidualPlot residuals={main.diagnostics.residualsByYear} />
        </>
      ) : (
        <Text style={styles.muted}>
          {main?.status === 'substitute'
            ? 'The series is too short for its own fit: the regional pooled curve stands in, so there are no residual checks of its own.'
            : 'No residual checks for this fit.'}
        </Text>
      )}
      <Block title="Note">
        {onSaveNote ? (
          <NoteEditor note={d.note} onSave={onSaveNote} closed={runClosed} />
        ) : (
          <Text style={styles.muted}>{d.note?.note ?? 'No note.'}</Text>
        )}
      </Block>
    </View>
  );
}

function Headline({ main, row, incomeUnit }: { main: RunEstimateRecord; row: ReviewRow | null; incomeUnit?: string }) {
  const t = main.threshold;
  const level = main.model.level;
  const interval = t ? intervalText(t.fieller.kind, t.fieller.levelLo, t.fieller.levelHi) : null;
  return (
    <View style={styles.headline}>
      <View style={styles.pills}>
        <Pill label={standingWord(main.standing.standing)} tone="info" testID="district-review-standing" />
        {row?.change.standingChanged && row.previous ? (
          <Pill label={`was ${standingWord(row.previous.standing)}`} tone="warning" />
        ) : null}
        {main.status === 'substitute' ? <Pill label="Regional curve stands in" tone="neutral" /> : null}
      </View>
      <Text style={styles.body}>
        {t?.level != null
          ? `Threshold ${withUnit(formatLevel(t.level), incomeUnit ?? '')}; ${levelPercent(level)} Fieller interval ${interval}${t.intervalBounded ? '' : ` (${notBoundedText(level)})`}.`
          : 'No threshold in this fit.'}{' '}
        Shape: {shapeWord(main.shape?.shape)}. {main.n} years
        {main.firstYear ? `, ${main.firstYear}–${main.lastYear}` : ''}.
      </Text>
    </View>
  );
}

function Block({ title, children }: { title: string; children: React.ReactNode }) {
  return (
    <View style={styles.block}>
      <Text role="heading" aria-level={3} style={styles.blockTitle}>
        {title}
      </Text>
      {children}
    </View>
  );
}

const styles = StyleSheet.create({
  panel: {
    gap: space.md,
    backgroundColor: colors.surface,
    borderColor: colors.border,
    borderWidth: 1,
    borderRadius: radius.lg,
    padding: space.lg,
  },
  title: { ...type.title, color: colors.text },
  gap: { gap: space.lg },
  headline: { gap: space.sm },
  pills: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xs },
  body: { ...type.body, color: colors.text },
  muted: { ...type.body, color: colors.textMuted },
  block: { gap: space.sm },
  blockTitle: { ...type.bodyStrong, color: colors.text },
});
