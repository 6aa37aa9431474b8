import type { ReactNode } from 'react';
import { StyleSheet } from 'react-native';

import { colors, type } from '@/components/theme';

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
  /**
   * The cell: text is drawn in the table's type, anything else as it is. `folded` is true
   * when the row is drawn as a card (a link may then say more than a narrow cell has room for).
   */
  render: (row: T, how: { folded: boolean }) => ReactNode;
  /** Makes the column sortable; nulls go last whichever way. */
  sortValue?: (row: T) => number | string | null;
  /** Running text (a reason, say): in a card its label stands above it and it takes the card's width. */
  long?: boolean;
  /** The cell heads its row for screen readers (role rowheader). */
  rowHeader?: boolean;
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

/** A column's name in a folded card: its header, with its unit line in brackets. */
export function fieldLabel<T>(c: Column<T>): string {
  return c.subheader ? `${c.header} (${c.subheader})` : c.header;
}

/**
 * A row's title as plain text: the caller's wording, else the title cell when it is text,
 * else its sort value, else the row key.
 */
export function titleOf<T>(
  row: T,
  column: Column<T>,
  rowKey: (row: T) => string,
  cardTitle?: (row: T) => string,
): string {
  if (cardTitle) return cardTitle(row);
  const content = column.render(row, { folded: true });
  if (typeof content === 'string' || typeof content === 'number') return String(content);
  const sortable = column.sortValue?.(row);
  return sortable === null || sortable === undefined ? rowKey(row) : String(sortable);
}

export function cellSize<T>(c: Column<T>) {
  return c.width ? { width: c.width } : { flex: c.flex ?? 1 };
}

/** Cell text styles, for cells that build their own content. */
export const cellText = StyleSheet.create({
  value: { ...type.numeric, color: colors.text },
  strong: { ...type.numeric, fontFamily: type.label.fontFamily, color: colors.text },
  muted: { ...type.caption, color: colors.textMuted },
});

export type DataTableProps<T> = {
  /** Names the table (and, folded, the list of cards) for screen readers. */
  label: string;
  columns: readonly Column<T>[];
  rows: readonly T[];
  rowKey: (row: T) => string;
  /** Starting sort (sortable columns can be re-sorted from their header, or the Sort by control when folded). */
  initialSort?: SortState;
  /** Highlights one row (the one open beside the table). */
  selectedKey?: string | null;
  /** The width the columns need: with less room than this the table folds into cards (it never squeezes them). */
  minWidth?: number;
  rowTestID?: (row: T) => string;
  testID?: string;
  /** The column that titles each folded card (the row's key field); the first column by default. */
  titleKey?: string;
  /** The card title as plain text, which starts the card's accessible name; by default the title cell's text. */
  cardTitle?: (row: T) => string;
  /** A row drawn as one band across its value cells instead of the cells (a year with no data, say). */
  rowBand?: (row: T, how: { folded: boolean }) => ReactNode | null;
  /** Folded cards list their fields one a line (default), or two abreast, label above value, for short numbers. */
  cardLayout?: 'lines' | 'grid';
  /** Folds or not regardless of the window and the room (tests, and screens that decide for themselves). */
  folded?: boolean;
};

/** What the wide table and the folded cards draw from: the rows in order and the sort that made it. */
export type SortedTableProps<T> = DataTableProps<T> & { sort: SortState | null; onSort: (sort: SortState) => void };
