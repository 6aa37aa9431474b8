import { fireEvent, screen, waitFor, within } from 'expo-router/testing-library';

import { CAUTION_TEXT } from '@/components/district/caution-note';
import { ApiError, apiGet } from '@/lib/api-client';

import { cardAnswers, co2Track, estimateRecord } from './support/estimates';
import { gappyDetail } from './support/fixtures';
import { answerWith, never } from './support/mock-api';
import { renderApp } from './support/render-app';

jest.mock('@/lib/api-client', () => ({
  ...jest.requireActual('@/lib/api-client'),
  apiGet: jest.fn(),
}));
jest.mock('@/hooks/use-layout-mode', () => ({ useLayoutMode: () => 'phone' }));
// Document titles need the helmet provider of a full ExpoRoot; they are not under test here.
jest.mock('expo-router/head', () => ({ __esModule: true, default: () => null }));

const mockedGet = apiGet as jest.MockedFunction<typeof apiGet>;

afterEach(() => mockedGet.mockReset());

describe('district screen', () => {
  it('shows a loading skeleton first', async () => {
    mockedGet.mockImplementation(
      answerWith({
        ...cardAnswers(estimateRecord({})),
        '/api/districts/T02/estimate': never,
        '/api/districts/T02': never,
      }),
    );
    renderApp('/district/T02');
    expect(await screen.findByTestId('district-detail-loading')).toBeTruthy();
    expect(screen.queryByTestId('series-table')).toBeNull();
  });

  it('shows the header, one row per year, and the caution', async () => {
    mockedGet.mockImplementation(answerWith({ ...cardAnswers(estimateRecord({})), '/api/districts/T02': gappyDetail }));
    renderApp('/district/T02');
    expect(await screen.findByText('Bryn Ødegård')).toBeTruthy();
    expect(await screen.findByText('2001–2010 · 9 years of data · 1 gap year')).toBeTruthy();
    expect(await screen.findByTestId('series-row-2001')).toBeTruthy();
    for (let year = 2001; year <= 2010; year++) expect(screen.getByTestId(`series-row-${year}`)).toBeTruthy();
    const row2001 = within(screen.getByTestId('series-row-2001'));
    expect(row2001.getByText('5.10')).toBeTruthy();
    expect(row2001.getByText('15,300')).toBeTruthy();
    expect(screen.getByText(CAUTION_TEXT)).toBeTruthy();
    expect(screen.getByLabelText('How Crestwatch estimates')).toBeTruthy();
    // Units from the API appear in the legend.
    expect(screen.getByText(/constant currency units per person/)).toBeTruthy();
  });

  it('marks a year with no values as one "no data" band, not empty or zero cells', async () => {
    mockedGet.mockImplementation(answerWith({ ...cardAnswers(estimateRecord({})), '/api/districts/T02': gappyDetail }));
    renderApp('/district/T02');
    const band = await screen.findByTestId('series-gap-row-2004');
    expect(within(band).getByText('no data this year')).toBeTruthy();
    expect(screen.getByLabelText('No data for 2004')).toBeTruthy();
    const row2004 = within(screen.getByTestId('series-row-2004'));
    expect(row2004.queryByText('0')).toBeNull();
    expect(row2004.queryByText('0.00')).toBeNull();
  });

  it('marks a single missing value with its own "no data" cell', async () => {
    mockedGet.mockImplementation(answerWith({ ...cardAnswers(estimateRecord({})), '/api/districts/T02': gappyDetail }));
    renderApp('/district/T02');
    const cell = await screen.findByTestId('series-gap-2007-emissions_pc');
    expect(within(cell).getByText('no data')).toBeTruthy();
    expect(screen.getByLabelText('Emissions: no data for 2007')).toBeTruthy();
    // The other values of 2007 are still shown.
    expect(within(screen.getByTestId('series-row-2007')).getByText('17,100')).toBeTruthy();
  });

  it('says which code is unknown on a 404, without a Retry button', async () => {
    mockedGet.mockImplementation(
      answerWith({
        '/api/districts/ZZ9': new ApiError(404, 'not_found', 'No district ZZ9'),
        '/api/districts/ZZ9/estimate': new ApiError(404, 'not_found', 'No district ZZ9'),
      }),
    );
    renderApp('/district/ZZ9');
    expect(await screen.findByText('No district with code ZZ9')).toBeTruthy();
    expect(screen.queryByText('Retry')).toBeNull();
    expect(screen.getByText('Go to the region list')).toBeTruthy();
  });

  it('offers Retry when the server fails', async () => {
    let calls = 0;
    mockedGet.mockImplementation(
      answerWith({
        ...cardAnswers(estimateRecord({})),
        '/api/districts/T02': gappyDetail,
        '/api/districts/T02/estimate': async () => {
          calls += 1;
          if (calls === 1) throw new ApiError(500, 'internal', 'Boom');
          return cardAnswers(estimateRecord({}))['/api/districts/T02/estimate'];
        },
      }),
    );
    renderApp('/district/T02');
    expect(await screen.findByTestId('district-detail-error')).toBeTruthy();
    fireEvent.press(screen.getByText('Retry'));
    expect(await screen.findByText('Bryn Ødegård')).toBeTruthy();
  });

  it('has a back link to the list on phones', async () => {
    mockedGet.mockImplementation(
      answerWith({
        ...cardAnswers(estimateRecord({})),
        '/api/districts/T02': gappyDetail,
        '/api/districts': { districts: [] },
      }),
    );
    const app = renderApp('/district/T02');
    await screen.findByText('Bryn Ødegård');
    fireEvent.press(screen.getByLabelText('All districts'));
    await waitFor(() => expect(app.getPathname()).toBe('/'));
  });

  it('shows an empty state for a district without observations', async () => {
    mockedGet.mockImplementation(
      answerWith({
        '/api/districts/T03/estimate': {
          district: { code: 'T03', name: 'Coldwater' },
          run: null,
          main: null,
          variants: [],
          note: null,
          track: co2Track,
          tracks: [{ ...co2Track, standing: null, gapPercent: null, shape: null, runId: null }],
        },
        '/api/districts/T03/history': { district: { code: 'T03', name: 'Coldwater' }, history: [] },
        '/api/districts/T03/alerts?limit=20': { alerts: [] },
        '/api/subscriptions': { subscriptions: [] },
        '/api/districts/T03': {
          district: { code: 'T03', name: 'Coldwater', firstYear: null, lastYear: null, nYears: 0 },
          indicators: gappyDetail.indicators,
          series: [],
        },
      }),
    );
    renderApp('/district/T03');
    expect(await screen.findByTestId('district-series-empty')).toBeTruthy();
    expect(screen.getByText('No data yet')).toBeTruthy();
    expect(screen.getByTestId('no-published-estimate')).toBeTruthy();
  });
});
