import { StyleSheet, Text, useWindowDimensions, View } from 'react-native';

import { DataTable, type Column } from '@/components/table/data-table';
import { colors, space, type } from '@/components/theme';
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
    render: (p, { folded }) =>
      folded
        ? p.feature === null
          ? p.code
            ? 'District'
            : 'File'
          : `Feature ${p.feature}`
        : p.feature === null
          ? '—'
          : String(p.feature),
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

const reasonColumn: Column<Row> = {
  key: 'reason',
  header: 'What is wrong',
  flex: 3,
  long: true,
  render: (p) => p.reason,
};

/** Below this window width the problems are cards (the table needs the room for its reasons). */
const NARROW = 760;

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
      <DataTable
        label="Problems found in the boundary file"
        columns={[...columns, reasonColumn]}
        rows={rows}
        rowKey={(p) => String(p.i)}
        rowTestID={(p) => `boundary-problem-${p.i}`}
        folded={narrow}
      />
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
});
