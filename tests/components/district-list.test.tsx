import { act, fireEvent, screen, waitFor } from 'expo-router/testing-library';

import { ApiError, apiGet } from '@/lib/api-client';

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

afterEach(() => mockedGet.mockReset());

describe('region list', () => {
  it('shows skeleton rows while the list loads', async () => {
    mockedGet.mockImplementation(answerWith({ '/api/districts': never }));
    renderApp('/');
    expect(await screen.findByTestId('district-list-loading')).toBeTruthy();
    expect(screen.getByLabelText('Loading the district list')).toBeTruthy();
    expect(screen.getByText('Loading districts…')).toBeTruthy();
    expect(screen.queryByTestId('district-list')).toBeNull();
  });

  it('lists every district with code, coverage and latest values with units', async () => {
    mockedGet.mockImplementation(answerWith({ '/api/districts': { districts: districtSummaries } }));
    renderApp('/');
    expect(await screen.findByText('Ashgrove')).toBeTruthy();
    expect(screen.getByText('3 districts')).toBeTruthy();
    expect(screen.getByText('T01')).toBeTruthy();
    expect(screen.getByText('6.25')).toBeTruthy();
    expect(screen.getByText('18,400')).toBeTruthy();
    expect(screen.getAllByText('t CO₂ per person').length).toBeGreaterThan(0);
    // T02 has one year without data inside its span, and no emissions value in its latest year.
    expect(screen.getByText('2001–2010 · 1 gap year')).toBeTruthy();
    expect(screen.getByText('no data')).toBeTruthy();
    // T03 has nothing yet.
    expect(screen.getByText('No data yet')).toBeTruthy();
    expect(screen.getByText('No values yet')).toBeTruthy();
    const row = screen.getByTestId('district-row-T01');
    expect(row.props.accessibilityRole ?? row.props.role).toBe('link');
  });

  it('filters by name or code, ignoring case and accents, and says when nothing matches', async () => {
    mockedGet.mockImplementation(answerWith({ '/api/districts': { districts: districtSummaries } }));
    renderApp('/');
    await screen.findByText('Ashgrove');
    const search = screen.getByLabelText('Find a district by name or code');

    fireEvent.changeText(search, 'odegard');
    expect(screen.getByText('Bryn Ødegård')).toBeTruthy();
    expect(screen.queryByText('Ashgrove')).toBeNull();
    expect(screen.getByText('1 of 3 districts match')).toBeTruthy();

    fireEvent.changeText(search, 't03');
    expect(screen.getByText('Coldwater')).toBeTruthy();
    expect(screen.queryByText('Bryn Ødegård')).toBeNull();

    fireEvent.changeText(search, 'zz');
    expect(screen.getByTestId('district-list-no-match')).toBeTruthy();
    expect(screen.getByText('Nothing matches “zz”')).toBeTruthy();
    fireEvent.press(screen.getByText('Clear the search'));
    expect(screen.getByText('Ashgrove')).toBeTruthy();
    expect(screen.getByText('3 districts')).toBeTruthy();
  });

  it('shows an empty state when the region has no districts', async () => {
    mockedGet.mockImplementation(answerWith({ '/api/districts': { districts: [] } }));
    renderApp('/');
    expect(await screen.findByTestId('district-list-empty')).toBeTruthy();
    expect(screen.getByText('No districts yet')).toBeTruthy();
  });

  it('shows the error with a Retry button that loads the list again', async () => {
    let calls = 0;
    mockedGet.mockImplementation(
      answerWith({
        '/api/districts': async () => {
          calls += 1;
          if (calls === 1) throw new ApiError(503, 'database_unavailable', 'The database is not reachable.');
          return { districts: districtSummaries };
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
      answerWith({ '/api/districts': { districts: districtSummaries }, '/api/districts/T02': gappyDetail }),
    );
    const app = renderApp('/');
    fireEvent.press(await screen.findByTestId('district-row-T02'));
    await waitFor(() => expect(app.getPathname()).toBe('/district/T02'));
    expect(await screen.findByTestId('district-name')).toBeTruthy();
    expect(mockedGet).toHaveBeenCalledWith('/api/districts/T02', expect.anything());
  });
});
