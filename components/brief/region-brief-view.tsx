import { StyleSheet, Text, View } from 'react-native';

import { DataTable, type Column } from '@/components/table/data-table';
import { colors, space, type } from '@/components/theme';
import type { RegionBriefContent, RegionBriefRow } from '@/contracts/briefs';
import { useFolded } from '@/hooks/use-folded';

import { BriefChart } from './brief-chart';
import { BriefHeading, BriefTop, Cautions, FigureGrid, keepTogether, ModelLine, TraceFooter } from './brief-sections';
import { formatCount } from '@/lib/format';

/** How many districts each summary list shows before "and n more". */
const LIST_LINES = 8;

// Table parts carry data attributes that the print style sheet turns into a real table, so
// the browser repeats the header row on every printed page (brief-frame.web.tsx).
const part = (name: 'table' | 'thead' | 'tbody' | 'tr' | 'td') => ({ dataSet: { briefTable: name } }) as object;

const COLUMN_BASIS: Record<keyof RegionBriefRow, number> = {
  code: 48,
  name: 180,
  standing: 96,
  gap: 64,
  threshold: 72,
  interval: 132,
  crossing: 132,
};
const NUMERIC = new Set<keyof RegionBriefRow>(['gap', 'threshold']);

function SummaryList({
  title,
  items,
  note,
  more,
}: {
  title: string;
  items: { code: string; name: string; text: string }[];
  note: string | null;
  more: string;
}) {
  return (
    <View style={styles.list} {...keepTogether}>
      <BriefHeading>{title}</BriefHeading>
      {items.length === 0 || note ? <Text style={styles.muted}>{note ?? 'None.'}</Text> : null}
      {items.slice(0, LIST_LINES).map((it) => (
        <Text key={it.code} style={styles.listItem}>
          <Text style={styles.code}>{it.code}</Text> {it.name} — {it.text}
        </Text>
      ))}
      {items.length > LIST_LINES ? (
        <Text style={styles.muted}>
          … and {items.length - LIST_LINES} more {more}.
        </Text>
      ) : null}
    </View>
  );
}

/**
 * The table folded for a phone: a card a district, titled by its name and code, with the
 * other columns as label: value pairs in the brief's own words.
 */
function FoldedBriefTable({ table }: { table: RegionBriefContent['table'] }) {
  const columns: Column<RegionBriefRow>[] = [
    {
      key: 'name',
      header: table.columns.find((col) => col.key === 'name')?.label ?? 'District',
      render: (row) => `${row.name} (${row.code})`,
    },
    ...table.columns
      .filter((col) => col.key !== 'code' && col.key !== 'name')
      .map((col): Column<RegionBriefRow> => ({ key: col.key, header: col.label, render: (row) => row[col.key] })),
  ];
  return (
    <DataTable
      label="All districts"
      columns={columns}
      rows={table.rows}
      rowKey={(row) => row.code}
      folded
      rowTestID={(row) => `brief-row-${row.code}`}
      testID="brief-table"
    />
  );
}

/** The region brief as a page: the same summary, pooled curve and table as its PDF. */
export function RegionBriefView({ content: c }: { content: RegionBriefContent }) {
  const folded = useFolded();
  return (
    <View style={styles.page} testID="region-brief">
      <BriefTop subtitle={c.subtitle} />
      <Text role="heading" aria-level={1} style={styles.title}>
        Region brief
      </Text>
      <Text style={styles.headline}>{c.headline}</Text>
      <View style={styles.counts} {...keepTogether}>
        {c.counts.map((k) => (
          <View key={k.key} style={styles.count} testID={`brief-count-${k.key}`}>
            <Text style={[styles.countValue, k.count === 0 && styles.muted]}>{formatCount(k.count)}</Text>
            <Text style={styles.countLabel}>{k.label}</Text>
          </View>
        ))}
      </View>
      <View style={styles.lists}>
        <SummaryList
          title="Crossed since the last publish"
          items={c.crossed}
          note={c.crossedNote}
          more="in the alerts of this run"
        />
        <SummaryList title="Largest threshold shifts" items={c.shifts} note={c.shiftsNote} more="in the table" />
        {c.map ? (
          <View style={styles.map}>
            <BriefChart scene={c.map} testID="brief-region-map" />
          </View>
        ) : null}
      </View>
      <View style={styles.block} {...keepTogether}>
        <BriefHeading>Regional pooled curve</BriefHeading>
        {c.pooled.figures.length ? <FigureGrid figures={c.pooled.figures} /> : null}
        {c.pooled.chart ? <BriefChart scene={c.pooled.chart} testID="brief-pooled-chart" /> : null}
        {c.pooled.note ? <Text style={styles.muted}>{c.pooled.note}</Text> : null}
      </View>
      <ModelLine text={c.modelLine} />
      <Cautions cautions={c.cautions} />
      <View style={styles.block}>
        <BriefHeading>All districts</BriefHeading>
        {folded ? (
          <FoldedBriefTable table={c.table} />
        ) : (
          <View style={styles.table} {...part('table')} testID="brief-table">
            <View {...part('thead')}>
              <View style={[styles.row, styles.headRow]} {...part('tr')}>
                {c.table.columns.map((col) => (
                  <Text
                    key={col.key}
                    style={[
                      styles.cell,
                      styles.headCell,
                      { flexBasis: COLUMN_BASIS[col.key] },
                      NUMERIC.has(col.key) && styles.numeric,
                    ]}
                    {...part('td')}
                  >
                    {col.label}
                  </Text>
                ))}
              </View>
            </View>
            <View {...part('tbody')}>
              {c.table.rows.map((row, i) => (
                <View key={row.code} style={[styles.row, i % 2 === 1 && styles.shaded]} {...part('tr')}>
                  {c.table.columns.map((col) => (
                    <Text
                      key={col.key}
                      style={[
                        styles.cell,
                        { flexBasis: COLUMN_BASIS[col.key] },
                        NUMERIC.has(col.key) && styles.numeric,
                        col.key === 'code' && styles.code,
                      ]}
                      {...part('td')}
                    >
                      {row[col.key]}
                    </Text>
                  ))}
                </View>
              ))}
            </View>
          </View>
        )}
        <Text style={styles.muted}>
          {formatCount(c.table.rows.length)} districts. Gap: income now against the threshold. “Regional curve”: the
          pooled curve stands in for a short series.
        </Text>
      </View>
      <TraceFooter trace={c.trace} />
    </View>
  );
}

const styles = StyleSheet.create({
  map: { width: 240, maxWidth: '100%' },
  page: { gap: space.md },
  title: { ...type.heading, color: colors.text },
  headline: { ...type.body, color: colors.text },
  counts: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  count: { flexGrow: 1, flexBasis: 120, backgroundColor: colors.surfaceSunken, padding: space.sm, borderRadius: 4 },
  countValue: { ...type.heading, color: colors.text },
  countLabel: { ...type.caption, color: colors.textMuted },
  lists: { flexDirection: 'row', flexWrap: 'wrap', gap: space.lg },
  list: { flexGrow: 1, flexBasis: 280, gap: space.xxs },
  listItem: { ...type.caption, color: colors.text },
  code: { fontFamily: type.label.fontFamily },
  muted: { ...type.caption, color: colors.textMuted },
  block: { gap: space.sm },
  table: { borderTopWidth: 1, borderTopColor: colors.textMuted },
  row: {
    flexDirection: 'row',
    flexWrap: 'wrap',
    borderBottomWidth: StyleSheet.hairlineWidth,
    borderBottomColor: colors.border,
    paddingVertical: space.xxs,
  },
  headRow: { backgroundColor: colors.surfaceSunken },
  shaded: { backgroundColor: colors.surface },
  cell: { ...type.caption, color: colors.text, flexGrow: 1, flexShrink: 1, paddingHorizontal: space.xs },
  headCell: { fontFamily: type.label.fontFamily, color: colors.textMuted },
  numeric: { textAlign: 'right', fontVariant: ['tabular-nums'] },
});
