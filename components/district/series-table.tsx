import { StyleSheet, Text, View } from 'react-native';

import { colors, radius, space, type } from '@/components/theme';
import type { Indicator, SeriesRow } from '@/contracts/districts';
import { INDICATOR_COLUMNS, type IndicatorColumn } from '@/lib/indicators';

/** Relative column widths: the longer headers and numbers get more of a 390 px screen. */
const COLUMN_WEIGHT: Record<IndicatorColumn['code'], number> = {
  emissions_pc: 1.2,
  income_pc: 1.15,
  population: 0.85,
  pop_density: 0.8,
};
const TOTAL_WEIGHT = INDICATOR_COLUMNS.reduce((sum, c) => sum + COLUMN_WEIGHT[c.code], 0);

export type SeriesTableProps = {
  districtName: string;
  series: SeriesRow[];
  /** Names and units as the API states them, for the legend under the table. */
  indicators: Indicator[];
};

/**
 * The district's values year by year. A missing value is a visible "no data" cell, and a
 * year with no value at all is one "no data this year" band across the row, so a gap is
 * never mistaken for a small number or quietly closed up.
 */
export function SeriesTable({ districtName, series, indicators }: SeriesTableProps) {
  const columns = INDICATOR_COLUMNS;
  return (
    <View style={styles.wrap}>
      <View role="table" aria-label={`Yearly values for ${districtName}`} style={styles.table} testID="series-table">
        <View role="row" style={[styles.row, styles.headRow]}>
          <View role="columnheader" style={[styles.cell, styles.yearCell]}>
            <Text style={styles.headLabel}>Year</Text>
          </View>
          {columns.map((c) => (
            <View
              key={c.code}
              role="columnheader"
              style={[styles.cell, styles.valueCell, { flex: COLUMN_WEIGHT[c.code] }]}
            >
              <Text style={[styles.headLabel, styles.right]}>{c.short}</Text>
              <Text style={[styles.headUnit, styles.right]}>
                {c.shortUnit ?? indicators.find((i) => i.code === c.code)?.unit ?? ''}
              </Text>
            </View>
          ))}
        </View>
        {series.map((row, i) => (
          <SeriesTableRow key={row.year} row={row} columns={columns} striped={i % 2 === 1} />
        ))}
      </View>
      <IndicatorLegend indicators={indicators} />
    </View>
  );
}

function SeriesTableRow({
  row,
  columns,
  striped,
}: {
  row: SeriesRow;
  columns: readonly IndicatorColumn[];
  striped: boolean;
}) {
  const empty = columns.every((c) => row[c.field] === null);
  return (
    <View role="row" style={[styles.row, striped && styles.striped]} testID={`series-row-${row.year}`}>
      <View role="rowheader" style={[styles.cell, styles.yearCell]}>
        <Text style={styles.year}>{row.year}</Text>
      </View>
      {empty ? (
        <View
          role="cell"
          style={[styles.cell, styles.gapCell, styles.gapRowCell, { flex: TOTAL_WEIGHT }]}
          testID={`series-gap-row-${row.year}`}
          accessibilityLabel={`No data for ${row.year}`}
        >
          <Text style={styles.gapText}>no data this year</Text>
        </View>
      ) : (
        columns.map((c) => {
          const value = row[c.field];
          return value === null ? (
            <View
              key={c.code}
              role="cell"
              style={[styles.cell, styles.valueCell, styles.gapCell, { flex: COLUMN_WEIGHT[c.code] }]}
              testID={`series-gap-${row.year}-${c.code}`}
              accessibilityLabel={`${c.short}: no data for ${row.year}`}
            >
              <Text style={[styles.gapText, styles.right]}>no data</Text>
            </View>
          ) : (
            <View key={c.code} role="cell" style={[styles.cell, styles.valueCell, { flex: COLUMN_WEIGHT[c.code] }]}>
              <Text style={[styles.value, styles.right]}>{c.format(value)}</Text>
            </View>
          );
        })
      )}
    </View>
  );
}

/** Full indicator names and units from the API, keyed to the short headers. */
function IndicatorLegend({ indicators }: { indicators: Indicator[] }) {
  if (indicators.length === 0) return null;
  return (
    <View style={styles.legend} testID="series-legend">
      {INDICATOR_COLUMNS.map((c) => {
        const indicator = indicators.find((i) => i.code === c.code);
        if (!indicator) return null;
        return (
          <Text key={c.code} style={styles.legendLine}>
            <Text style={styles.legendTerm}>{c.short}: </Text>
            {indicator.name}, {indicator.unit}
          </Text>
        );
      })}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.md },
  table: {
    backgroundColor: colors.surface,
    borderColor: colors.border,
    borderWidth: 1,
    borderRadius: radius.md,
    overflow: 'hidden',
  },
  row: { flexDirection: 'row', alignItems: 'stretch', minHeight: 36 },
  headRow: { backgroundColor: colors.surfaceSunken, borderBottomWidth: 1, borderBottomColor: colors.border },
  striped: { backgroundColor: colors.background },
  cell: { paddingHorizontal: space.xs + space.xxs, paddingVertical: space.sm, justifyContent: 'center' },
  yearCell: { width: 50 },
  valueCell: { minWidth: 0 },
  right: { textAlign: 'right' },
  headLabel: { ...type.label, color: colors.text },
  headUnit: { ...type.caption, color: colors.textMuted },
  year: { ...type.numeric, fontFamily: type.label.fontFamily, color: colors.text },
  value: { ...type.numeric, color: colors.text },
  gapCell: {
    backgroundColor: colors.gapFill,
    borderLeftWidth: 1,
    borderRightWidth: 1,
    borderStyle: 'dashed',
    borderColor: colors.gapText,
  },
  gapRowCell: { alignItems: 'center' },
  gapText: { ...type.caption, fontFamily: type.label.fontFamily, color: colors.gapText },
  legend: { gap: space.xxs },
  legendLine: { ...type.caption, color: colors.textMuted },
  legendTerm: { fontFamily: type.label.fontFamily, color: colors.text },
});
