import { act, fireEvent, screen, waitFor, within } from 'expo-router/testing-library';

import { ApiError, apiGet } from '@/lib/api-client';

import { resetRegionFilter } from '@/hooks/use-region-filter';

import { cardAnswers, estimateRecord, regionAnswer, summaryOf } from './support/estimates';
import { districtSummaries, gappyDetail } from './support/fixtures';
import { answerWith, never } from './support/mock-api';
import { renderApp } from './support/render-app';

jest.mock('@/lib/api-client', () => ({
  ...jest.requireActual('@/lib/api-client'),
  apiGet: jest.fn(),
}));
// The list is the home route's content in the phone layout (the wide one shows it beside).
jest.mock('@/hooks/use-layout-mode', () => ({ useLayoutMode: () => 'phone' }));
// Document titles need the helmet provider of a full ExpoRoot; they are not under test here.
jest.mock('expo-router/head', () => ({ __esModule: true, default: () => null }));

const mockedGet = apiGet as jest.MockedFunction<typeof apiGet>;

afterEach(() => {
  mockedGet.mockReset();
  resetRegionFilter();
});

// T01 approaching 18% below, crossing by 2031; T02 past the turn 40% above with an
// unbounded interval; T03 has no estimate (counts as not estimable).
const approaching = summaryOf(estimateRecord({}));
const pastUnbounded = {
  ...approaching,
  standing: 'past_turn' as const,
  gapPercent: 40,
  intervalBounded: false,
  fiellerKind: 'whole_line' as const,
  thresholdLo: null,
  thresholdHi: null,
  projectionStatus: 'already_past' as const,
  crossingYear: 2012,
  crossingEarliest: null,
  crossingLatest: null,
};
// The list reads the region's rows (GET /api/region).
const withEstimates = regionAnswer([
  { ...districtSummaries[0], estimate: approaching },
  { ...districtSummaries[1], estimate: pastUnbounded },
  { ...districtSummaries[2], estimate: null },
]);
const rowOrder = () => screen.getAllByTestId(/^district-row-/).map((r) => r.props.testID);

describe('region list', () => {
  it('shows skeleton rows while the list loads', async () => {
    mockedGet.mockImplementation(answerWith({ '/api/region': never }));
    renderApp('/');
    expect(await screen.findByTestId('district-list-loading')).toBeTruthy();
    expect(screen.getByLabelText('Loading the district list')).toBeTruthy();
    expect(screen.getByText('Loading districts…')).toBeTruthy();
    expect(screen.queryByTestId('district-list')).toBeNull();
  });

  it('lists every district with its standing, gap, crossing and last data year', async () => {
    mockedGet.mockImplementation(answerWith({ '/api/region': withEstimates }));
    renderApp('/');
    expect(await screen.findByText('Ashgrove')).toBeTruthy();
    expect(screen.getByText('3 districts')).toBeTruthy();
    expect(screen.getByText('T01')).toBeTruthy();
    const t01 = within(screen.getByTestId('district-row-T01'));
    expect(t01.getByText('Approaching')).toBeTruthy();
    expect(t01.getByTestId('standing-mark-approaching', { includeHiddenElements: true })).toBeTruthy();
    expect(t01.getByText('−18%')).toBeTruthy();
    expect(t01.getByText('by 2031')).toBeTruthy();
    expect(t01.getByText('Data to 2010')).toBeTruthy();
    const t02 = within(screen.getByTestId('district-row-T02'));
    expect(t02.getByText('Past the turn')).toBeTruthy();
    expect(t02.getByText('unbounded')).toBeTruthy();
    expect(t02.getByText('passed 2012')).toBeTruthy();
    // T03 has neither data nor an estimate.
    const t03 = within(screen.getByTestId('district-row-T03'));
    expect(t03.getByText('No data yet')).toBeTruthy();
    expect(t03.getByText('Not estimable')).toBeTruthy();
    const row = screen.getByTestId('district-row-T02');
    expect(row.props.accessibilityRole ?? row.props.role).toBe('link');
    // The row's name is its visible words, then the standing in words with the run's level
    // (read by screen readers only).
    expect(row.props.accessibilityLabel).toBeUndefined();
    expect(
      within(row).getByText(/Past the turn, income 40% above the threshold, interval not bounded at 95%/),
    ).toBeTruthy();
    // Counts per standing at the top.
    expect(screen.getByLabelText('Approaching: 1 district')).toBeTruthy();
    expect(screen.getByLabelText('Past the turn: 1 district')).toBeTruthy();
    expect(screen.getByLabelText('Not estimable: 1 district')).toBeTruthy();
    expect(screen.getByLabelText('At the turn: 0 districts')).toBeTruthy();
  });

  it('sorts by gap, name and crossing year', async () => {
    const far = { ...approaching, gapPercent: -60, crossingYear: 2029 };
    const data = regionAnswer([
      { ...districtSummaries[0], estimate: far },
      { ...districtSummaries[1], estimate: pastUnbounded },
      { ...districtSummaries[2], estimate: { ...approaching, gapPercent: -5, crossingYear: 2040 } },
    ]);
    mockedGet.mockImplementation(answerWith({ '/api/region': data }));
    renderApp('/');
    await screen.findByText('Ashgrove');
    expect(rowOrder()).toEqual(['district-row-T01', 'district-row-T02', 'district-row-T03']);
    fireEvent.press(screen.getByTestId('sort-gap'));
    // Closest to the threshold first: 5%, 40%, 60%.
    expect(rowOrder()).toEqual(['district-row-T03', 'district-row-T02', 'district-row-T01']);
    fireEvent.press(screen.getByTestId('sort-crossing'));
    // Projected crossings ahead first (2029, 2040); one already passed has none ahead.
    expect(rowOrder()).toEqual(['district-row-T01', 'district-row-T03', 'district-row-T02']);
    fireEvent.press(screen.getByTestId('sort-name'));
    expect(rowOrder()).toEqual(['district-row-T01', 'district-row-T02', 'district-row-T03']);
  });

  it('filters by standing and by shape, and clears both', async () => {
    const rising = { ...approaching, standing: 'no_turn' as const, shape: 'increasing' as const };
    const data = regionAnswer([
      withEstimates.districts[0],
      withEstimates.districts[1],
      { ...districtSummaries[2], estimate: rising },
    ]);
    mockedGet.mockImplementation(answerWith({ '/api/region': data }));
    renderApp('/');
    await screen.findByText('Ashgrove');
    fireEvent.press(screen.getByTestId('standing-filter-past_turn'));
    expect(rowOrder()).toEqual(['district-row-T02']);
    expect(screen.getByText('1 of 3 districts shown')).toBeTruthy();
    fireEvent.press(screen.getByTestId('standing-filter-approaching'));
    expect(rowOrder()).toEqual(['district-row-T01', 'district-row-T02']);
    fireEvent.press(screen.getByTestId('standing-filter-approaching'));
    fireEvent.press(screen.getByTestId('standing-filter-past_turn'));
    fireEvent.press(screen.getByTestId('shape-filter-toggle'));
    fireEvent.press(screen.getByTestId('shape-filter-increasing'));
    expect(rowOrder()).toEqual(['district-row-T03']);
    fireEvent.press(screen.getByTestId('standing-filter-at_turn'));
    expect(screen.getByTestId('district-list-no-match')).toBeTruthy();
    fireEvent.press(screen.getByText('Clear search and filters'));
    expect(rowOrder()).toHaveLength(3);
  });

  it('filters by name or code, ignoring case and accents, and says when nothing matches', async () => {
    mockedGet.mockImplementation(answerWith({ '/api/region': regionAnswer(districtSummaries) }));
    renderApp('/');
    await screen.findByText('Ashgrove');
    const search = screen.getByLabelText('Find a district by name or code');

    fireEvent.changeText(search, 'odegard');
    expect(screen.getByText('Bryn Ødegård')).toBeTruthy();
    expect(screen.queryByText('Ashgrove')).toBeNull();
    expect(screen.getByText('1 of 3 districts shown')).toBeTruthy();

    fireEvent.changeText(search, 't03');
    expect(screen.getByText('Coldwater')).toBeTruthy();
    expect(screen.queryByText('Bryn Ødegård')).toBeNull();

    fireEvent.changeText(search, 'zz');
    expect(screen.getByTestId('district-list-no-match')).toBeTruthy();
    expect(screen.getByText('Nothing matches “zz”')).toBeTruthy();
    fireEvent.press(screen.getByText('Clear search and filters'));
    expect(screen.getByText('Ashgrove')).toBeTruthy();
    expect(screen.getByText('3 districts')).toBeTruthy();
  });

  it('shows an empty state when the region has no districts', async () => {
    mockedGet.mockImplementation(answerWith({ '/api/region': regionAnswer([]) }));
    renderApp('/');
    expect(await screen.findByTestId('district-list-empty')).toBeTruthy();
    expect(screen.getByText('No districts yet')).toBeTruthy();
  });

  it('shows the error with a Retry button that loads the list again', async () => {
    let calls = 0;
    mockedGet.mockImplementation(
      answerWith({
        '/api/region': async () => {
          calls += 1;
          if (calls === 1) throw new ApiError(503, 'database_unavailable', 'The database is not reachable.');
          return regionAnswer(districtSummaries);
        },
      }),
    );
    renderApp('/');
    expect(await screen.findByTestId('district-list-error')).toBeTruthy();
    expect(screen.getByText('Could not load the district list')).toBeTruthy();
    expect(screen.getByText(/could not answer just now \(503 database_unavailable\)/)).toBeTruthy();

    await act(async () => {
      fireEvent.press(screen.getByText('Retry'));
    });
    expect(await screen.findByText('Ashgrove')).toBeTruthy();
    expect(calls).toBe(2);
  });

  it('says so when the server cannot be reached', async () => {
    mockedGet.mockImplementation(async () => {
      throw new ApiError(0, 'network_error', 'The Crestwatch server could not be reached.');
    });
    renderApp('/');
    expect(await screen.findByText(/could not be reached/)).toBeTruthy();
    expect(screen.getByText('Retry')).toBeTruthy();
  });

  it('opens a district from its row', async () => {
    mockedGet.mockImplementation(
      answerWith({
        '/api/region': regionAnswer(districtSummaries),
        '/api/districts/T02': gappyDetail,
        ...cardAnswers(estimateRecord({})),
      }),
    );
    const app = renderApp('/');
    fireEvent.press(await screen.findByTestId('district-row-T02'));
    await waitFor(() => expect(app.getPathname()).toBe('/district/T02'));
    expect(await screen.findByTestId('district-name')).toBeTruthy();
    expect(mockedGet).toHaveBeenCalledWith('/api/districts/T02/estimate', expect.anything());
  });
});
