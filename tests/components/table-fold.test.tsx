// Tables that fold: below 600 px a DataTable is a list of cards with the same fields (a
// column's header and unit as the label), the same sorting through a "Sort by" control, the
// same selection and row test ids; at 600 px and wider it is the table it was. WCAG 2.2
// SC 1.4.10 (Reflow) is why nothing may need sideways scrolling on a phone; SC 2.5.3 (Label
// in Name) is why a card's accessible name starts with its visible title.
import { act, fireEvent, render, screen, within } from '@testing-library/react-native';
import { Dimensions, StyleSheet, Text } from 'react-native';

import { ReviewTable } from '@/components/runs/review-table';
import { ProblemsTable } from '@/components/uploads/problems-table';
import { SeriesTable } from '@/components/district/series-table';
import { DataTable, type Column } from '@/components/table/data-table';
import { colors } from '@/components/theme';
import type { SeriesRow } from '@/contracts/districts';

import { reviewAnswer } from './support/staff-fixtures';

jest.mock('@/lib/router', () => ({
  ...jest.requireActual('@/lib/router'),
  Link: ({ children }: { children: unknown }) => children,
}));

function windowWidth(width: number) {
  const size = { width, height: 844, scale: 1, fontScale: 1 };
  act(() => Dimensions.set({ window: size, screen: size }));
}

type Row = { code: string; name: string; emissions: number | null; income: number };
// Invented rows (plumbing only).
const rows: Row[] = [
  { code: 'X02', name: 'Bracken', emissions: 7.25, income: 21000 },
  { code: 'X01', name: 'Alder', emissions: 4.5, income: 18500 },
  { code: 'X03', name: 'Cotton', emissions: null, income: 30250 },
];
const columns: Column<Row>[] = [
  { key: 'name', header: 'District', render: (r) => r.name, sortValue: (r) => r.name },
  {
    key: 'emissions',
    header: 'Emissions',
    subheader: 't CO₂ per person',
    align: 'right',
    render: (r) => (r.emissions === null ? '—' : r.emissions.toFixed(2)),
    sortValue: (r) => r.emissions,
  },
  {
    key: 'income',
    header: 'Income',
    subheader: 'per person',
    align: 'right',
    render: (r) => <Text>{r.income.toLocaleString('en-GB')}</Text>,
    sortValue: (r) => r.income,
  },
];

function table(selectedKey: string | null = null) {
  return (
    <DataTable
      label="Districts"
      columns={columns}
      rows={rows}
      rowKey={(r) => r.code}
      selectedKey={selectedKey}
      rowTestID={(r) => `row-${r.code}`}
      testID="t"
    />
  );
}

/** Host elements with an ARIA role (react-native-web passes `role` to the DOM). */
const withRole = (role: string) =>
  screen.UNSAFE_root.findAll((n) => typeof n.type === 'string' && n.props.role === role);

const order = (prefix: string) => screen.getAllByTestId(new RegExp(`^${prefix}`)).map((e) => e.props.testID);

afterEach(() => windowWidth(750));

describe('a DataTable', () => {
  it('is a table of rows at 600 px and wider, with its headers and units', () => {
    windowWidth(600);
    render(table());
    expect(screen.getByTestId('t').props.role).toBe('table');
    expect(withRole('columnheader')).toHaveLength(3);
    expect(screen.getByText('t CO₂ per person')).toBeTruthy();
    expect(withRole('list')).toHaveLength(0);
    expect(screen.getByTestId('row-X01').props.role).toBe('row');
  });

  it('folds below 600 px into a list of cards with the same fields, label: value', () => {
    windowWidth(599);
    render(table());
    expect(withRole('table')).toHaveLength(0);
    expect(withRole('columnheader')).toHaveLength(0);
    const [list] = withRole('list');
    expect(list.props['aria-label']).toBe('Districts');
    expect(withRole('listitem')).toHaveLength(rows.length);
    for (const r of rows) {
      const card = screen.getByTestId(`row-${r.code}`);
      expect(card.props.role).toBe('listitem');
      // SC 2.5.3: the name starts with the visible title (here it is the title).
      expect(card.props['aria-label']).toBe(r.name);
      const inCard = within(card);
      expect(inCard.getByText(r.name)).toBeTruthy();
      // Each other column as its header with the unit line, then the value the table shows.
      expect(inCard.getByText('Emissions (t CO₂ per person)')).toBeTruthy();
      expect(inCard.getByText(r.emissions === null ? '—' : r.emissions.toFixed(2))).toBeTruthy();
      expect(inCard.getByText('Income (per person)')).toBeTruthy();
      expect(inCard.getByText(r.income.toLocaleString('en-GB'))).toBeTruthy();
    }
  });

  it('sorts folded cards through Sort by and Order as the headers sort rows, nulls last both ways', () => {
    windowWidth(1024);
    const wide = render(table());
    fireEvent.press(screen.getByTestId('t-sort-emissions'));
    const wideAsc = order('row-');
    fireEvent.press(screen.getByTestId('t-sort-emissions'));
    const wideDesc = order('row-');
    wide.unmount();
    // Ascending 4.50, 7.25, then the row with no value; descending 7.25, 4.50, then it.
    expect(wideAsc).toEqual(['row-X01', 'row-X02', 'row-X03']);
    expect(wideDesc).toEqual(['row-X02', 'row-X01', 'row-X03']);

    windowWidth(390);
    render(table());
    const group = withRole('radiogroup').find((g) => g.props['aria-label'] === 'Sort by')!;
    expect(group).toBeTruthy();
    const radios = group.findAll((n) => typeof n.type === 'string' && n.props.role === 'radio');
    expect(radios.map((r) => r.props.accessibilityLabel)).toEqual(['District', 'Emissions', 'Income']);
    // Unsorted until asked: the rows' own order, and no direction to choose yet.
    expect(order('row-')).toEqual(['row-X02', 'row-X01', 'row-X03']);
    fireEvent.press(screen.getByTestId('t-order-desc'));
    expect(order('row-')).toEqual(['row-X02', 'row-X01', 'row-X03']);
    fireEvent.press(screen.getByTestId('t-sort-by-emissions'));
    expect(
      screen.getByTestId('t-sort-by-emissions').props.accessibilityState?.checked ??
        screen.getByTestId('t-sort-by-emissions').props['aria-checked'],
    ).toBe(true);
    expect(order('row-')).toEqual(wideAsc);
    fireEvent.press(screen.getByTestId('t-order-desc'));
    expect(order('row-')).toEqual(wideDesc);
    // A new key keeps the chosen direction.
    fireEvent.press(screen.getByTestId('t-sort-by-name'));
    expect(order('row-')).toEqual(['row-X03', 'row-X02', 'row-X01']);
  });

  it('keeps the selected row marked in both shapes, and follows the window across the fold', () => {
    windowWidth(390);
    render(table('X02'));
    const fill = (id: string) => StyleSheet.flatten(screen.getByTestId(id).props.style).backgroundColor;
    expect(fill('row-X02')).toBe(colors.selected);
    expect(fill('row-X01')).not.toBe(colors.selected);
    windowWidth(800);
    expect(screen.getByTestId('t').props.role).toBe('table');
    expect(fill('row-X02')).toBe(colors.selected);
    expect(fill('row-X01')).not.toBe(colors.selected);
    windowWidth(390);
    expect(screen.getByTestId('row-X02').props.role).toBe('listitem');
  });
});

describe('a DataTable with less room than its columns need', () => {
  it('folds in a narrow panel of a wide window, and unfolds when the panel grows', () => {
    windowWidth(1440);
    render(
      <DataTable
        label="Districts"
        columns={columns}
        rows={rows}
        rowKey={(r) => r.code}
        minWidth={440}
        rowTestID={(r) => `row-${r.code}`}
        testID="t"
      />,
    );
    expect(screen.getByTestId('t').props.role).toBe('table');
    const layout = (width: number) =>
      fireEvent(screen.getByTestId('t-frame'), 'layout', {
        nativeEvent: { layout: { x: 0, y: 0, width, height: 300 } },
      });
    layout(406);
    expect(withRole('table')).toHaveLength(0);
    expect(screen.getByTestId('row-X01').props.role).toBe('listitem');
    layout(440);
    expect(screen.getByTestId('t').props.role).toBe('table');
  });
});

describe('the run review folded', () => {
  const review = () => (
    <ReviewTable
      runId={5}
      rows={reviewAnswer.districts}
      previousRunId={4}
      shiftPercent={10}
      selectedCode="T01"
      incomeUnit="currency units per person"
    />
  );

  it('filters, searches and sorts the cards as the table does', () => {
    windowWidth(390);
    render(review());
    expect(withRole('table')).toHaveLength(0);
    expect(order('review-row-')).toEqual(['review-row-T01', 'review-row-T02', 'review-row-T03']);
    const t02 = screen.getByTestId('review-row-T02');
    expect(t02.props['aria-label']).toBe('Bryn Ødegård');
    expect(within(t02).getByText('Threshold (currency units per person)')).toBeTruthy();
    expect(within(t02).getByText('Moved (vs published)')).toBeTruthy();
    expect(within(t02).getByText('−20.0%')).toBeTruthy();
    expect(within(t02).getByText('Approaching → Past the turn')).toBeTruthy();

    fireEvent.press(screen.getByTestId('review-filter-standing'));
    expect(order('review-row-')).toEqual(['review-row-T02']);
    fireEvent.press(screen.getByTestId('review-filter-all'));
    // The same order as tapping the Moved header (tests/components/run-review.test.tsx):
    // largest move first, a district without a threshold last.
    fireEvent.press(screen.getByTestId('review-table-sort-by-move'));
    expect(order('review-row-')).toEqual(['review-row-T02', 'review-row-T01', 'review-row-T03']);
    fireEvent.changeText(screen.getByTestId('review-search'), 'cold');
    expect(order('review-row-')).toEqual(['review-row-T03']);
  });
});

describe('a district’s yearly values folded', () => {
  // Invented values (plumbing only); 2004 has none at all, 2005 lacks its emissions.
  const series: SeriesRow[] = [
    { year: 2003, emissionsPc: 5.1, incomePc: 15300, population: 40000, popDensity: 120 },
    { year: 2004, emissionsPc: null, incomePc: null, population: null, popDensity: null },
    { year: 2005, emissionsPc: null, incomePc: 15900, population: 40500, popDensity: 121 },
  ];

  it('is a card a year, each value under its indicator and unit, a gap year one band', () => {
    windowWidth(390);
    render(
      <SeriesTable
        districtName="Alder"
        series={series}
        indicators={[{ code: 'emissions_pc', name: 'CO₂ emissions per person', unit: 't CO₂ per person' }]}
      />,
    );
    expect(withRole('table')).toHaveLength(0);
    const y2003 = screen.getByTestId('series-row-2003');
    expect(y2003.props['aria-label']).toBe('2003');
    expect(within(y2003).getByText('5.10')).toBeTruthy();
    expect(within(y2003).getByText('15,300')).toBeTruthy();
    // The unit from the catalogue, or the column's own short unit line.
    expect(within(y2003).getByText('Emissions (t CO₂ per person)')).toBeTruthy();
    expect(within(y2003).getByText('Income (per person, real)')).toBeTruthy();
    const band = within(screen.getByTestId('series-row-2004')).getByTestId('series-gap-row-2004');
    expect(within(band).getByText('no data this year')).toBeTruthy();
    expect(within(screen.getByTestId('series-row-2004')).queryByText(/^Emissions/)).toBeNull();
    expect(screen.getByLabelText('Emissions: no data for 2005')).toBeTruthy();
  });
});

describe('an upload’s problems folded', () => {
  it('titles each card by its line and gives the reason the card’s width under its label', () => {
    windowWidth(390);
    render(
      <ProblemsTable
        problems={[
          { line: null, column: null, field: null, code: 'no_rows', severity: 'error', reason: 'the file has no rows' },
          { line: 4, column: 4, field: 'value', code: 'large_change', severity: 'warning', reason: 'changes by ×3' },
        ]}
      />,
    );
    const line4 = screen.getByTestId('problem-1');
    expect(line4.props['aria-label']).toBe('Line 4');
    expect(within(line4).getByText('Line 4')).toBeTruthy();
    expect(within(line4).getByText('What is wrong')).toBeTruthy();
    expect(within(line4).getByText('changes by ×3')).toBeTruthy();
    expect(screen.getByTestId('problem-0').props['aria-label']).toBe('No line');
    // Sorting by line puts the problem without one last, as the Line header does.
    expect(order('problem-')).toEqual(['problem-0', 'problem-1']);
    fireEvent.press(screen.getByTestId('problems-table-sort-by-line'));
    expect(order('problem-')).toEqual(['problem-1', 'problem-0']);
  });
});
