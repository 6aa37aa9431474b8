import { StyleSheet, Text, View } from 'react-native';

import { Section } from '@/components/layout/page';
import { DataTable, type Column } from '@/components/table/data-table';
import { colors, radius, space, type } from '@/components/theme';
import { textSize } from '@/lib/text-size';
import { Pill } from '@/components/ui/pill';
import type { UploadPreview } from '@/contracts/uploads';

import { count } from './upload-words';
import { formatCount } from '@/lib/format';

type DistrictRow = UploadPreview['byDistrict'][number];
type IndicatorRow = UploadPreview['byIndicator'][number];

const countColumns = <T extends { insert: number; change: number; unchanged: number }>(): Column<T>[] => [
  {
    key: 'insert',
    header: 'New',
    width: 72,
    align: 'right',
    render: (r) => String(r.insert),
    sortValue: (r) => r.insert,
  },
  {
    key: 'change',
    header: 'Changed',
    width: 84,
    align: 'right',
    render: (r) => String(r.change),
    sortValue: (r) => r.change,
  },
  {
    key: 'unchanged',
    header: 'Same',
    width: 72,
    align: 'right',
    render: (r) => String(r.unchanged),
    sortValue: (r) => r.unchanged,
  },
];

const districtColumns: Column<DistrictRow>[] = [
  {
    key: 'district',
    header: 'District',
    flex: 2,
    render: (d) => (
      <View style={styles.nameCell}>
        <Text style={styles.name} numberOfLines={1}>
          {d.name || d.district}
        </Text>
        <Text style={styles.code}>{d.district}</Text>
        {d.isNew ? <Pill label="New district" tone="info" /> : null}
      </View>
    ),
    sortValue: (d) => d.district,
  },
  ...countColumns<DistrictRow>(),
];

const indicatorColumns: Column<IndicatorRow>[] = [
  {
    key: 'indicator',
    header: 'Indicator',
    flex: 2,
    render: (r) => (
      <View style={styles.nameCell}>
        <Text style={styles.name}>{r.name || r.indicator}</Text>
        <Text style={styles.code}>{r.indicator}</Text>
      </View>
    ),
    sortValue: (r) => r.indicator,
  },
  ...countColumns<IndicatorRow>(),
];

/** What a checked file would do: totals, then per district and per indicator. */
export function PreviewSummary({ preview }: { preview: UploadPreview }) {
  const years =
    preview.years.first !== null
      ? preview.years.first === preview.years.last
        ? `${preview.years.first}`
        : `${preview.years.first}–${preview.years.last}`
      : '—';
  return (
    <View style={styles.wrap} testID="preview">
      <View style={styles.figures}>
        <Figure label="Rows read" value={formatCount(preview.rowsRead)} />
        <Figure label="New values" value={String(preview.totals.insert)} testID="preview-insert" />
        <Figure label="Changed values" value={String(preview.totals.change)} testID="preview-change" />
        <Figure label="Unchanged" value={String(preview.totals.unchanged)} />
        <Figure label="Years" value={years} />
      </View>
      <Text style={styles.format}>
        {preview.format === 'wide' ? 'Wide layout (one column per indicator)' : 'Long layout (one value per row)'},{' '}
        {preview.delimiter === ';' ? 'semicolon' : 'comma'}-separated
        {preview.decimalComma ? ', decimal comma' : ''}
        {preview.blankLines ? `, ${count(preview.blankLines, 'blank line')} skipped` : ''}.
      </Text>
      {preview.newDistricts.length ? (
        <Text style={styles.format} testID="preview-new-districts">
          New districts: {preview.newDistricts.map((d) => `${d.name} (${d.code}, line ${d.line})`).join('; ')}.
        </Text>
      ) : null}
      {preview.derived.length ? (
        <Text style={styles.format}>
          Derived series recomputed on load:{' '}
          {preview.derived
            .map(
              (d) => `${d.indicator} (${d.insert} new, ${d.change} changed${d.remove ? `, ${d.remove} removed` : ''})`,
            )
            .join('; ')}
          .
        </Text>
      ) : null}
      <Section title="By district">
        <DataTable
          label="Values per district"
          columns={districtColumns}
          rows={preview.byDistrict}
          rowKey={(d) => d.district}
          rowTestID={(d) => `preview-district-${d.district}`}
          cardTitle={(d) => d.name || d.district}
          minWidth={420}
        />
      </Section>
      <Section title="By indicator">
        <DataTable
          label="Values per indicator"
          columns={indicatorColumns}
          rows={preview.byIndicator}
          rowKey={(r) => r.indicator}
          cardTitle={(r) => r.name || r.indicator}
          minWidth={420}
        />
      </Section>
    </View>
  );
}

function Figure({ label, value, testID }: { label: string; value: string; testID?: string }) {
  return (
    <View style={styles.figure} testID={testID}>
      <Text style={styles.figureValue}>{value}</Text>
      <Text style={styles.figureLabel}>{label}</Text>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.lg },
  figures: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  figure: {
    minWidth: 104,
    flexGrow: 1,
    backgroundColor: colors.surface,
    borderColor: colors.border,
    borderWidth: 1,
    borderRadius: radius.md,
    paddingHorizontal: space.md,
    paddingVertical: space.sm,
  },
  figureValue: { ...type.title, fontVariant: ['tabular-nums'], color: colors.text },
  figureLabel: { ...type.caption, color: colors.textMuted },
  format: { ...type.body, color: colors.textMuted },
  nameCell: { gap: space.xxs, minWidth: 0 },
  name: { ...type.bodyStrong, fontSize: textSize(14), color: colors.text },
  code: { ...type.caption, color: colors.textMuted },
});
