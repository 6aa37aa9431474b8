import { useMemo, useState } from 'react';
import { Pressable, ScrollView, StyleSheet, Text, View } from 'react-native';

import { colors, radius, space, type } from '@/components/theme';
import { focusOutline, type InteractionState } from '@/components/ui/interaction';
import { WORD_BREAK } from '@/components/ui/word-break';
import { useFolded } from '@/hooks/use-folded';

import { FoldedTable } from './folded-table';
import { cellSize, sortRows, type DataTableProps, type SortedTableProps, type SortState } from './table-model';

export {
  cellText,
  sortRows,
  titleOf,
  type Column,
  type DataTableProps,
  type SortDirection,
  type SortState,
} from './table-model';

/**
 * A table of rows and columns with sortable headers. Below 600 px it folds into a list of
 * cards with the same fields, a "Sort by" control in place of the headers, and nothing
 * that scrolls sideways (components/table/folded-table.tsx). A table with a minWidth also
 * folds where its own room is narrower than that (a panel beside another table, a
 * tablet), rather than scrolling sideways.
 */
export function DataTable<T>(props: DataTableProps<T>) {
  const { columns, rows, initialSort, minWidth, testID } = props;
  const windowFolded = useFolded();
  const [room, setRoom] = useState<number | null>(null);
  const cramped = minWidth !== undefined && room !== null && room < minWidth;
  const folded = props.folded ?? (windowFolded || cramped);
  const [sort, setSort] = useState<SortState | null>(initialSort ?? null);
  const sorted = useMemo(
    () =>
      sort
        ? sortRows(
            rows,
            columns.find((c) => c.key === sort.key),
            sort.direction,
          )
        : [...rows],
    [rows, columns, sort],
  );
  const shown = folded ? (
    <FoldedTable {...props} rows={sorted} sort={sort} onSort={setSort} />
  ) : (
    <WideTable {...props} rows={sorted} sort={sort} onSort={setSort} />
  );
  if (minWidth === undefined || props.folded !== undefined) return shown;
  // The frame takes its width from its parent, whatever it holds, so folding does not change it.
  return (
    <View
      style={styles.frame}
      onLayout={(e) => setRoom(e.nativeEvent.layout.width)}
      testID={testID ? `${testID}-frame` : undefined}
    >
      {shown}
    </View>
  );
}

function WideTable<T>({
  label,
  columns,
  rows,
  rowKey,
  selectedKey,
  minWidth,
  rowTestID,
  testID,
  rowBand,
  titleKey,
  sort,
  onSort,
}: SortedTableProps<T>) {
  const toggle = (key: string) =>
    onSort(
      sort?.key === key ? { key, direction: sort.direction === 'asc' ? 'desc' : 'asc' } : { key, direction: 'asc' },
    );
  const titleIndex = Math.max(
    0,
    columns.findIndex((c) => c.key === titleKey),
  );

  const table = (
    <View role="table" aria-label={label} style={[styles.table, minWidth ? { minWidth } : null]} testID={testID}>
      <View role="row" style={[styles.row, styles.headRow]}>
        {columns.map((c) => {
          const active = sort?.key === c.key;
          const arrow = active ? (sort!.direction === 'asc' ? ' ▲' : ' ▼') : '';
          const content = (
            <>
              <Text style={[styles.headLabel, c.align === 'right' && styles.right]}>
                {c.header}
                {arrow ? <Text aria-hidden>{arrow}</Text> : null}
                {c.subheader ? WORD_BREAK : null}
              </Text>
              {c.subheader ? (
                <Text style={[styles.headUnit, c.align === 'right' && styles.right]}>{c.subheader}</Text>
              ) : null}
            </>
          );
          return (
            <View
              key={c.key}
              role="columnheader"
              aria-sort={active ? (sort!.direction === 'asc' ? 'ascending' : 'descending') : undefined}
              style={[styles.cell, cellSize(c)]}
            >
              {c.sortValue ? (
                <Pressable
                  accessibilityRole="button"
                  // Starts with the header it shows (WCAG 2.2 SC 2.5.3 Label in Name).
                  accessibilityLabel={`${c.header}${c.subheader ? `, ${c.subheader}` : ''}: sort by this column${active ? (sort!.direction === 'asc' ? ', now ascending' : ', now descending') : ''}`}
                  onPress={() => toggle(c.key)}
                  testID={testID ? `${testID}-sort-${c.key}` : undefined}
                  style={(state: InteractionState) => [
                    styles.sortButton,
                    state.hovered && styles.sortHover,
                    focusOutline(state),
                  ]}
                >
                  {content}
                </Pressable>
              ) : (
                content
              )}
            </View>
          );
        })}
      </View>
      {rows.map((row, i) => {
        const key = rowKey(row);
        const band = rowBand?.(row, { folded: false }) ?? null;
        const cells = band ? columns.slice(0, titleIndex + 1) : columns;
        return (
          <View
            key={key}
            role="row"
            style={[styles.row, i % 2 === 1 && styles.striped, selectedKey === key && styles.selected]}
            testID={rowTestID?.(row)}
          >
            {cells.map((c) => {
              const content = c.render(row, { folded: false });
              return (
                <View
                  key={c.key}
                  role={c.rowHeader ? 'rowheader' : 'cell'}
                  style={[styles.cell, cellSize(c), c.align === 'right' && styles.cellRight]}
                >
                  {typeof content === 'string' || typeof content === 'number' ? (
                    <Text style={[styles.value, c.align === 'right' && styles.right]}>{content}</Text>
                  ) : (
                    content
                  )}
                </View>
              );
            })}
            {band ? <View style={styles.band}>{band}</View> : null}
          </View>
        );
      })}
    </View>
  );
  if (!minWidth) return table;
  return (
    <ScrollView
      horizontal
      contentContainerStyle={styles.scrollContent}
      accessibilityLabel={`${label} (scrolls sideways)`}
    >
      {table}
    </ScrollView>
  );
}

const styles = StyleSheet.create({
  frame: { alignSelf: 'stretch', minWidth: 0 },
  scrollContent: { flexGrow: 1 },
  table: {
    flexGrow: 1,
    backgroundColor: colors.surface,
    borderColor: colors.border,
    borderWidth: 1,
    borderRadius: radius.md,
    overflow: 'hidden',
  },
  row: { flexDirection: 'row', alignItems: 'stretch', minHeight: 40 },
  headRow: { backgroundColor: colors.surfaceSunken, borderBottomWidth: 1, borderBottomColor: colors.border },
  striped: { backgroundColor: colors.background },
  selected: { backgroundColor: colors.selected, borderLeftWidth: 3, borderLeftColor: colors.selectedRule },
  cell: {
    paddingHorizontal: space.sm,
    paddingVertical: space.sm,
    justifyContent: 'center',
    minWidth: 0,
    gap: space.xxs,
  },
  band: { flex: 1, minWidth: 0, flexDirection: 'row', alignItems: 'stretch' },
  cellRight: { alignItems: 'flex-end' },
  right: { textAlign: 'right' },
  headLabel: { ...type.label, color: colors.text },
  headUnit: { ...type.caption, color: colors.textMuted },
  sortButton: { borderRadius: radius.sm, minHeight: 32, justifyContent: 'center' },
  sortHover: { backgroundColor: colors.selected },
  value: { ...type.numeric, color: colors.text },
});
