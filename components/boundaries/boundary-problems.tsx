import { StyleSheet, Text, useWindowDimensions, View } from 'react-native';

import { DataTable, type Column } from '@/components/table/data-table';
import { colors, radius, space, type } from '@/components/theme';
import { Pill } from '@/components/ui/pill';
import type { BoundaryProblem } from '@/contracts/boundaries';

import { PROBLEM_LABEL } from './boundary-words';

type Row = BoundaryProblem & { i: number };

const columns: Column<Row>[] = [
  {
    key: 'feature',
    header: 'Feature',
    width: 76,
    align: 'right',
    render: (p) => (p.feature === null ? '—' : String(p.feature)),
    sortValue: (p) => p.feature,
  },
  { key: 'code', header: 'Code', width: 84, render: (p) => p.code ?? '—', sortValue: (p) => p.code },
  {
    key: 'severity',
    header: 'Kind',
    width: 96,
    render: (p) => (
      <Pill label={p.severity === 'error' ? 'Error' : 'Warning'} tone={p.severity === 'error' ? 'danger' : 'warning'} />
    ),
    sortValue: (p) => p.severity,
  },
  {
    key: 'problem',
    header: 'Problem',
    width: 150,
    render: (p) => PROBLEM_LABEL[p.problem],
    sortValue: (p) => p.problem,
  },
];

const reasonColumn: Column<Row> = { key: 'reason', header: 'What is wrong', flex: 3, render: (p) => p.reason };

/** Below this window width the problems are cards (a table would hide the reasons off to the side). */
const NARROW = 760;

/** One problem as a card: where (feature and code), its kind, and the reason in full. */
function ProblemCard({ p }: { p: Row }) {
  return (
    <View style={styles.card} testID={`boundary-problem-${p.i}`} role="listitem">
      <View style={styles.cardHead}>
        <Text style={styles.where}>{p.feature === null ? (p.code ? 'District' : 'File') : `Feature ${p.feature}`}</Text>
        {p.code ? <Text style={styles.where}>{p.code}</Text> : null}
        <Pill
          label={p.severity === 'error' ? 'Error' : 'Warning'}
          tone={p.severity === 'error' ? 'danger' : 'warning'}
        />
        <Text style={styles.kind}>{PROBLEM_LABEL[p.problem]}</Text>
      </View>
      <Text style={styles.reason}>{p.reason}</Text>
    </View>
  );
}

export type BoundaryProblemsProps = {
  problems: BoundaryProblem[];
  errors: number;
  warnings: number;
};

/**
 * Every problem of a boundary file by feature (its index in `features`, from 0, as in the
 * file) and code, with the reason; errors first. The server lists the first 200; the
 * counts cover the whole file.
 */
export function BoundaryProblems({ problems, errors, warnings }: BoundaryProblemsProps) {
  const rows = problems.map((p, i) => ({ ...p, i }));
  const narrow = useWindowDimensions().width < NARROW;
  return (
    <View style={styles.wrap} testID="boundary-problems">
      <Text style={styles.summary} testID="boundary-problems-summary">
        {errors} {errors === 1 ? 'error' : 'errors'}, {warnings} {warnings === 1 ? 'warning' : 'warnings'}.{' '}
        {errors > 0
          ? 'Errors stop the whole file from loading: nothing is written until every one is fixed.'
          : 'Warnings ask for a second look; they do not stop the load.'}
      </Text>
      {narrow ? (
        <View role="list" aria-label="Problems found in the boundary file" style={styles.cards}>
          {rows.map((p) => (
            <ProblemCard key={p.i} p={p} />
          ))}
        </View>
      ) : (
        <DataTable
          label="Problems found in the boundary file"
          columns={[...columns, reasonColumn]}
          rows={rows}
          rowKey={(p) => String(p.i)}
          rowTestID={(p) => `boundary-problem-${p.i}`}
        />
      )}
      {errors + warnings > problems.length ? (
        <Text style={styles.more}>
          Showing the first {problems.length} problems; the counts above cover the whole file.
        </Text>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.sm },
  summary: { ...type.body, color: colors.text },
  more: { ...type.caption, color: colors.textMuted },
  cards: { gap: space.sm },
  card: {
    gap: space.xs,
    backgroundColor: colors.surface,
    borderColor: colors.border,
    borderWidth: 1,
    borderRadius: radius.md,
    padding: space.md,
  },
  cardHead: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.sm },
  where: { ...type.bodyStrong, color: colors.text },
  kind: { ...type.body, color: colors.textMuted },
  reason: { ...type.body, color: colors.text },
});
