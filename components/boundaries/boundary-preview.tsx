import { StyleSheet, Text, View } from 'react-native';

import { DataTable, type Column } from '@/components/table/data-table';
import { colors, radius, space, type } from '@/components/theme';
import type { BoundaryUploadAnswer } from '@/contracts/boundaries';

import { count } from '@/components/uploads/upload-words';

import { formatArea } from './boundary-words';
import { formatCount } from '@/lib/format';

type Row = BoundaryUploadAnswer['preview'][number];

const columns: Column<Row>[] = [
  {
    key: 'feature',
    header: 'Feature',
    width: 76,
    align: 'right',
    render: (r, { folded }) => (folded ? `Feature ${r.feature}` : String(r.feature)),
    sortValue: (r) => r.feature,
  },
  { key: 'code', header: 'Code', width: 84, render: (r) => r.code, sortValue: (r) => r.code },
  { key: 'name', header: 'District', flex: 2, render: (r) => r.name, sortValue: (r) => r.name },
  {
    key: 'area',
    header: 'Land area',
    subheader: 'on the ellipsoid',
    width: 130,
    align: 'right',
    render: (r) => formatArea(r.areaKm2),
    sortValue: (r) => r.areaKm2,
  },
];

/** What the file holds: the counts, the first features as they would be written (with their area), the districts left out. */
export function BoundaryPreview({ answer }: { answer: BoundaryUploadAnswer }) {
  const c = answer.counts;
  const figures: [string, string, string][] = [
    ['features', 'Features in the file', formatCount(c.features)],
    ['matched', 'Districts matched', formatCount(c.matched)],
    ['vertices', 'Vertices', formatCount(c.vertices)],
    ['missing', 'Without a boundary', formatCount(c.missing)],
  ];
  if (c.repaired) figures.push(['repaired', 'Repaired', formatCount(c.repaired)]);
  return (
    <View style={styles.wrap} testID="boundary-preview">
      <View style={styles.figures}>
        {figures.map(([key, label, value]) => (
          <View key={key} style={styles.figure}>
            <Text style={styles.value} testID={`boundary-count-${key}`}>
              {value}
            </Text>
            <Text style={styles.label}>{label}</Text>
          </View>
        ))}
      </View>
      {answer.preview.length ? (
        <>
          <Text style={styles.caption}>
            {answer.preview.length < c.matched
              ? `The first ${answer.preview.length} of ${count(c.matched, 'district')} as they would be written:`
              : 'The districts as they would be written:'}
          </Text>
          <DataTable
            label="Districts in the boundary file"
            columns={columns}
            rows={answer.preview}
            rowKey={(r) => String(r.feature)}
            minWidth={420}
            rowTestID={(r) => `boundary-preview-${r.code}`}
          />
        </>
      ) : null}
      {answer.missingDistricts.length ? (
        <Text style={styles.caption} testID="boundary-missing">
          Left without a boundary (listed under the map): {answer.missingDistricts.join(', ')}
        </Text>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.md },
  figures: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  figure: {
    minWidth: 140,
    flexGrow: 1,
    flexBasis: 140,
    backgroundColor: colors.surface,
    borderColor: colors.border,
    borderWidth: 1,
    borderRadius: radius.md,
    padding: space.md,
    gap: space.xxs,
  },
  value: { ...type.title, color: colors.text },
  label: { ...type.caption, color: colors.textMuted },
  caption: { ...type.body, color: colors.text },
});
