import { useMemo, useState, type ReactNode } from 'react';
import { Pressable, ScrollView, StyleSheet, Text, View } from 'react-native';

import { colors, radius, space, type } from '@/components/theme';
import { focusOutline, type InteractionState } from '@/components/ui/interaction';
import { WORD_BREAK } from '@/components/ui/word-break';

export type SortDirection = 'asc' | 'desc';
export type SortState = { key: string; direction: SortDirection };

export type Column<T> = {
  key: string;
  header: string;
  /** A second header line (a unit). */
  subheader?: string;
  /** Share of the row's width (default 1), or a fixed width in px. */
  flex?: number;
  width?: number;
  align?: 'left' | 'right';
  /** The cell: text is drawn in the table's type, anything else as it is. */
  render: (row: T) => ReactNode;
  /** Makes the column sortable; nulls go last whichever way. */
  sortValue?: (row: T) => number | string | null;
};

export type DataTableProps<T> = {
  /** Names the table for screen readers. */
  label: string;
  columns: readonly Column<T>[];
  rows: readonly T[];
  rowKey: (row: T) => string;
  /** Starting sort (sortable columns can be re-sorted from their header). */
  initialSort?: SortState;
  /** Highlights one row (the one open beside the table). */
  selectedKey?: string | null;
  /** Below this width the table scrolls sideways instead of squeezing its columns. */
  minWidth?: number;
  rowTestID?: (row: T) => string;
  testID?: string;
};

export function sortRows<T>(rows: readonly T[], column: Column<T> | undefined, direction: SortDirection): T[] {
  if (!column?.sortValue) return [...rows];
  const value = column.sortValue;
  const sign = direction === 'asc' ? 1 : -1;
  return [...rows].sort((a, b) => {
    const va = value(a);
    const vb = value(b);
    if (va === null && vb === null) return 0;
    if (va === null) return 1;
    if (vb === null) return -1;
    if (typeof va === 'number' && typeof vb === 'number') return sign * (va - vb);
    return sign * String(va).localeCompare(String(vb), 'en', { numeric: true });
  });
}

/**
 * A plain table of rows and columns with sortable headers. On a phone a wide table keeps
 * its columns readable and scrolls sideways (minWidth) rather than wrapping every cell.
 */
export function DataTable<T>({
  label,
  columns,
  rows,
  rowKey,
  initialSort,
  selectedKey,
  minWidth,
  rowTestID,
  testID,
}: DataTableProps<T>) {
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
  const toggle = (key: string) =>
    setSort((s) =>
      s?.key === key ? { key, direction: s.direction === 'asc' ? 'desc' : 'asc' } : { key, direction: 'asc' },
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
      {sorted.map((row, i) => {
        const key = rowKey(row);
        return (
          <View
            key={key}
            role="row"
            style={[styles.row, i % 2 === 1 && styles.striped, selectedKey === key && styles.selected]}
            testID={rowTestID?.(row)}
          >
            {columns.map((c) => {
              const content = c.render(row);
              return (
                <View
                  key={c.key}
                  role="cell"
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

function cellSize<T>(c: Column<T>) {
  return c.width ? { width: c.width } : { flex: c.flex ?? 1 };
}

/** Cell text styles, for cells that build their own content. */
export const cellText = StyleSheet.create({
  value: { ...type.numeric, color: colors.text },
  strong: { ...type.numeric, fontFamily: type.label.fontFamily, color: colors.text },
  muted: { ...type.caption, color: colors.textMuted },
});

const styles = StyleSheet.create({
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
  cellRight: { alignItems: 'flex-end' },
  right: { textAlign: 'right' },
  headLabel: { ...type.label, color: colors.text },
  headUnit: { ...type.caption, color: colors.textMuted },
  sortButton: { borderRadius: radius.sm, minHeight: 32, justifyContent: 'center' },
  sortHover: { backgroundColor: colors.selected },
  value: { ...type.numeric, color: colors.text },
});
