import { StyleSheet, Text, View } from 'react-native';

import { ChoiceGroup } from '@/components/form/choice-group';
import { colors, radius, space, type } from '@/components/theme';

import { fieldLabel, titleOf, type Column, type SortDirection, type SortedTableProps } from './table-model';

const ORDER = [
  { value: 'asc', label: 'Ascending' },
  { value: 'desc', label: 'Descending' },
] as const;

/**
 * A data table folded for a narrow window: one card a row, titled by the row's key field,
 * then each other column as "label: value" (the header with its unit line). There are no
 * headers to tap, so a "Sort by" group and an "Order" group sort the cards the way the
 * headers sort the rows. Cards wrap their text; nothing scrolls sideways.
 */
export function FoldedTable<T>({
  label,
  columns,
  rows,
  rowKey,
  selectedKey,
  rowTestID,
  testID,
  titleKey,
  cardTitle,
  rowBand,
  cardLayout = 'lines',
  sort,
  onSort,
}: SortedTableProps<T>) {
  const title = columns.find((c) => c.key === titleKey) ?? columns[0];
  const fields = columns.filter((c) => c !== title);
  const sortable = columns.filter((c) => c.sortValue);
  return (
    <View style={styles.wrap} testID={testID}>
      {sortable.length ? (
        <View style={styles.sort} testID={testID ? `${testID}-sort` : undefined}>
          <ChoiceGroup
            label="Sort by"
            choices={sortable.map((c) => ({ value: c.key, label: c.header || c.key }))}
            value={sort?.key ?? null}
            onChange={(key) => onSort({ key, direction: sort?.direction ?? 'asc' })}
            testID={testID ? `${testID}-sort-by` : undefined}
          />
          <ChoiceGroup<SortDirection>
            label="Order"
            choices={ORDER}
            value={sort ? sort.direction : null}
            disabled={!sort}
            onChange={(direction) => sort && onSort({ key: sort.key, direction })}
            testID={testID ? `${testID}-order` : undefined}
          />
        </View>
      ) : null}
      <View role="list" aria-label={label} style={styles.list}>
        {rows.map((row) => {
          const key = rowKey(row);
          const band = rowBand?.(row, { folded: true }) ?? null;
          const heading = title.render(row, { folded: true });
          return (
            <View
              key={key}
              role="listitem"
              aria-label={titleOf(row, title, rowKey, cardTitle)}
              style={[styles.card, selectedKey === key && styles.selected]}
              testID={rowTestID?.(row)}
            >
              <View style={styles.title}>
                {typeof heading === 'string' || typeof heading === 'number' ? (
                  <Text style={styles.titleText}>{heading}</Text>
                ) : (
                  heading
                )}
              </View>
              {band ?? (
                <View style={cardLayout === 'grid' ? styles.grid : styles.lines}>
                  {fields.map((c) => (
                    <Field key={c.key} column={c} row={row} grid={cardLayout === 'grid'} />
                  ))}
                </View>
              )}
            </View>
          );
        })}
      </View>
    </View>
  );
}

function Field<T>({ column, row, grid }: { column: Column<T>; row: T; grid: boolean }) {
  const content = column.render(row, { folded: true });
  if (content === null || content === undefined || content === false) return null;
  const value =
    typeof content === 'string' || typeof content === 'number' ? <Text style={styles.value}>{content}</Text> : content;
  // A column without a header (an action such as Revert) stands on its own line.
  if (!column.header) return <View style={styles.action}>{value}</View>;
  return (
    <View style={grid ? [styles.tile, column.long && styles.fullRow] : column.long ? styles.stacked : styles.field}>
      <Text style={grid || column.long ? styles.tileLabel : styles.label}>{fieldLabel(column)}</Text>
      <View style={styles.fieldValue}>{value}</View>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.md, minWidth: 0 },
  sort: { gap: space.sm },
  list: { gap: space.sm },
  card: {
    backgroundColor: colors.surface,
    borderColor: colors.border,
    borderWidth: 1,
    borderRadius: radius.md,
    padding: space.md,
    gap: space.sm,
    minWidth: 0,
  },
  selected: { backgroundColor: colors.selected, borderLeftWidth: 4, borderLeftColor: colors.selectedRule },
  title: { gap: space.xxs, paddingBottom: space.xs, borderBottomWidth: 1, borderBottomColor: colors.border },
  titleText: { ...type.bodyStrong, color: colors.text },
  lines: { gap: space.sm },
  grid: { flexDirection: 'row', flexWrap: 'wrap', rowGap: space.sm, columnGap: space.md },
  field: { flexDirection: 'row', alignItems: 'flex-start', gap: space.md },
  label: { ...type.caption, color: colors.textMuted, width: '40%', flexShrink: 0 },
  tile: { flexBasis: '40%', flexGrow: 1, minWidth: 0, gap: space.xxs },
  fullRow: { flexBasis: '100%' },
  stacked: { gap: space.xxs, minWidth: 0 },
  tileLabel: { ...type.caption, color: colors.textMuted },
  // Stretch, so a one-line cell (an e-mail address, say) ends in an ellipsis at the card's edge.
  fieldValue: { flex: 1, minWidth: 0, alignItems: 'stretch', gap: space.xxs },
  value: { ...type.numeric, color: colors.text },
  action: { alignItems: 'flex-start' },
});
