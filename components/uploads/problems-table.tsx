import { StyleSheet, Text, View } from 'react-native';

import { DataTable, type Column } from '@/components/table/data-table';
import { colors, space, type } from '@/components/theme';
import { Pill } from '@/components/ui/pill';
import type { UploadProblem } from '@/contracts/uploads';

/** More than this many rows would make a phone scroll for ever; the counts say how many there are. */
const SHOWN = 200;

const columns: Column<UploadProblem & { i: number }>[] = [
  {
    key: 'line',
    header: 'Line',
    width: 64,
    align: 'right',
    render: (p, { folded }) =>
      folded ? (p.line === null ? 'No line' : `Line ${p.line}`) : p.line === null ? '—' : String(p.line),
    sortValue: (p) => p.line,
  },
  {
    key: 'column',
    header: 'Column',
    width: 120,
    render: (p) => (p.column === null ? '—' : p.field ? `${p.column} · ${p.field}` : String(p.column)),
    sortValue: (p) => p.column,
  },
  {
    key: 'severity',
    header: 'Kind',
    width: 96,
    render: (p) => (
      <Pill label={p.severity === 'error' ? 'Error' : 'Warning'} tone={p.severity === 'error' ? 'danger' : 'warning'} />
    ),
    sortValue: (p) => p.severity,
  },
  { key: 'reason', header: 'What is wrong', flex: 3, long: true, render: (p) => p.reason },
];

export type ProblemsTableProps = {
  problems: UploadProblem[];
  /** The server listed only the first problems (its cap); the counts cover all. */
  truncated?: boolean;
  errorCount?: number;
  warningCount?: number;
};

/** Every problem the check found, in the server's order (by line, then column); any column re-sorts. */
export function ProblemsTable({ problems, truncated = false, errorCount, warningCount }: ProblemsTableProps) {
  const errors = errorCount ?? problems.filter((p) => p.severity === 'error').length;
  const warnings = warningCount ?? problems.filter((p) => p.severity === 'warning').length;
  const rows = problems.slice(0, SHOWN).map((p, i) => ({ ...p, i }));
  return (
    <View style={styles.wrap} testID="problems">
      <Text style={styles.summary} testID="problems-summary">
        {errors} {errors === 1 ? 'error' : 'errors'}, {warnings} {warnings === 1 ? 'warning' : 'warnings'}.{' '}
        {errors > 0
          ? 'Errors stop the file from loading; fix them in the file and choose it again.'
          : 'Warnings ask for a second look; they do not stop the load.'}
      </Text>
      <DataTable
        label="Problems found in the file"
        columns={columns}
        rows={rows}
        rowKey={(p) => String(p.i)}
        minWidth={560}
        rowTestID={(p) => `problem-${p.i}`}
        testID="problems-table"
      />
      {problems.length > SHOWN || truncated ? (
        <Text style={styles.more}>
          Showing the first {Math.min(SHOWN, problems.length)} problems; the counts above cover the whole file.
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
