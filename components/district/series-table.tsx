import { StyleSheet, Text, View } from 'react-native';

import { DataTable, type Column } from '@/components/table/data-table';
import { colors, radius, space, type } from '@/components/theme';
import type { Indicator, SeriesRow } from '@/contracts/districts';
import { INDICATOR_COLUMNS } from '@/lib/indicators';

/** Relative column widths: the longer headers and numbers get more of the row. */
const COLUMN_WEIGHT: Record<(typeof INDICATOR_COLUMNS)[number]['code'], number> = {
  emissions_pc: 1.2,
  income_pc: 1.15,
  population: 0.85,
  pop_density: 0.8,
};

export type SeriesTableProps = {
  districtName: string;
  series: SeriesRow[];
  /** Names and units as the API states them, for the legend under the table. */
  indicators: Indicator[];
};

/**
 * The district's values year by year. A missing value is a visible "no data" cell, and a
 * year with no value at all is one "no data this year" band across the row, so a gap is
 * never mistaken for a small number or quietly closed up. Below 600 px each year is a card.
 */
export function SeriesTable({ districtName, series, indicators }: SeriesTableProps) {
  const columns: Column<SeriesRow>[] = [
    {
      key: 'year',
      header: 'Year',
      width: 64,
      rowHeader: true,
      render: (row) => <Text style={styles.year}>{row.year}</Text>,
    },
    ...INDICATOR_COLUMNS.map((c): Column<SeriesRow> => ({
      key: c.code,
      header: c.short,
      subheader: c.shortUnit ?? indicators.find((i) => i.code === c.code)?.unit ?? '',
      flex: COLUMN_WEIGHT[c.code],
      align: 'right',
      render: (row, { folded }) => {
        const value = row[c.field];
        return value === null ? (
          <View
            style={[styles.gapMark, folded && styles.start]}
            testID={`series-gap-${row.year}-${c.code}`}
            accessibilityLabel={`${c.short}: no data for ${row.year}`}
          >
            <Text style={styles.gapText}>no data</Text>
          </View>
        ) : (
          <Text style={[styles.value, folded && styles.left]} testID={`series-value-${row.year}-${c.code}`}>
            {c.format(value)}
          </Text>
        );
      },
    })),
  ];
  return (
    <View style={styles.wrap}>
      <DataTable
        label={`Yearly values for ${districtName}`}
        columns={columns}
        rows={series}
        rowKey={(row) => String(row.year)}
        titleKey="year"
        cardLayout="grid"
        cardTitle={(row) => String(row.year)}
        rowBand={(row, { folded }) =>
          INDICATOR_COLUMNS.every((c) => row[c.field] === null) ? (
            <View
              role={folded ? undefined : 'cell'}
              style={styles.gapBand}
              testID={`series-gap-row-${row.year}`}
              accessibilityLabel={`No data for ${row.year}`}
            >
              <Text style={styles.gapText}>no data this year</Text>
            </View>
          ) : null
        }
        rowTestID={(row) => `series-row-${row.year}`}
        testID="series-table"
      />
      <IndicatorLegend indicators={indicators} />
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

const gapEdge = {
  backgroundColor: colors.gapFill,
  borderWidth: 1,
  borderStyle: 'dashed',
  borderColor: colors.gapText,
  borderRadius: radius.sm,
} as const;

const styles = StyleSheet.create({
  wrap: { gap: space.md },
  year: { ...type.numeric, fontFamily: type.label.fontFamily, color: colors.text },
  value: { ...type.numeric, color: colors.text, textAlign: 'right' },
  left: { textAlign: 'left' },
  start: { alignSelf: 'flex-start' },
  gapMark: { ...gapEdge, paddingHorizontal: space.xs, paddingVertical: space.xxs },
  gapBand: { ...gapEdge, flex: 1, alignItems: 'center', justifyContent: 'center', padding: space.sm },
  gapText: { ...type.caption, fontFamily: type.label.fontFamily, color: colors.gapText },
  legend: { gap: space.xxs },
  legendLine: { ...type.caption, color: colors.textMuted },
  legendTerm: { fontFamily: type.label.fontFamily, color: colors.text },
});
