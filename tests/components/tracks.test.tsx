// The track switcher (the URL's ?track= wins over the device's memory, which wins over the
// headline track) and the district card's rows per track, over mocked API answers.
import { render } from '@testing-library/react-native';
import { act, fireEvent, screen, waitFor, within } from 'expo-router/testing-library';

import { IndicatorSources } from '@/components/method/indicator-sources';

import { apiGet } from '@/lib/api-client';
import { chosenTrack, requestedTrack, shownTracks, withTrack } from '@/lib/track-choice';
import { rememberedTrack, rememberTrack } from '@/lib/track-memory';

import {
  cardAnswers,
  estimateRecord,
  estimateResponse,
  pm25Track,
  regionAnswer,
  run,
  tracksAnswer,
} from './support/estimates';
import { districtSummaries, gappyDetail } from './support/fixtures';
import { answerWith } from './support/mock-api';
import { renderApp } from './support/render-app';

jest.mock('@/lib/api-client', () => ({ ...jest.requireActual('@/lib/api-client'), apiGet: jest.fn() }));
jest.mock('@/hooks/use-layout-mode', () => ({ useLayoutMode: () => 'phone', useThirdColumn: () => false }));
jest.mock('expo-router/head', () => ({ __esModule: true, default: () => null }));

const mockedGet = apiGet as jest.MockedFunction<typeof apiGet>;
const tracks = tracksAnswer.tracks;

afterEach(() => {
  mockedGet.mockReset();
  rememberTrack(null);
});

const listFor = (_code: string) => regionAnswer(districtSummaries);

/** The region's answers for every track, so the test can read which one the screen asked for. */
function answerRegion() {
  mockedGet.mockImplementation(
    answerWith({
      '/api/tracks': tracksAnswer,
      '/api/region': listFor('co2'),
      '/api/region?track=pm25': listFor('pm25'),
      '/api/region?track=so2': listFor('so2'),
    }),
  );
}

const asked = () => mockedGet.mock.calls.map((c) => c[0]);
const checked = (code: string) => screen.getByTestId(`track-option-${code}`).props.accessibilityState.checked;

describe('which track is chosen', () => {
  it('lists open tracks only, the headline first', () => {
    expect(shownTracks(tracks).map((t) => t.code)).toEqual(['co2', 'pm25', 'so2']);
  });

  it('takes the URL over the device and the device over the headline', () => {
    expect(chosenTrack('pm25', 'so2', tracks)?.code).toBe('pm25');
    expect(chosenTrack(null, 'so2', tracks)?.code).toBe('so2');
    expect(chosenTrack(null, null, tracks)?.code).toBe('co2');
  });

  it('passes over an archived, unknown or malformed code', () => {
    expect(chosenTrack('nox', null, tracks)?.code).toBe('co2');
    expect(chosenTrack('nope', 'pm25', tracks)?.code).toBe('pm25');
    expect(chosenTrack('PM 2.5', null, tracks)?.code).toBe('co2');
    // Once the list is known the request drops a code that is not an open track (the server's headline).
    expect(requestedTrack('nox', null, tracks)).toBeNull();
  });

  it('asks with the URL’s or the device’s code before the list arrives', () => {
    expect(requestedTrack('pm25', 'so2', undefined)).toBe('pm25');
    expect(requestedTrack(null, 'so2', undefined)).toBe('so2');
    expect(requestedTrack(null, null, undefined)).toBeNull();
  });

  it('adds the track to a path', () => {
    expect(withTrack('/api/region', 'pm25')).toBe('/api/region?track=pm25');
    expect(withTrack('/api/x?a=1', 'so2')).toBe('/api/x?a=1&track=so2');
    expect(withTrack('/api/region', null)).toBe('/api/region');
  });
});

describe('track switcher on the region view', () => {
  it('opens the headline track when neither the URL nor the device names one', async () => {
    answerRegion();
    renderApp('/');
    await screen.findByTestId('track-switcher');
    expect(checked('co2')).toBe(true);
    expect(checked('pm25')).toBe(false);
    // The headline first, the archived track absent.
    const options = within(screen.getByTestId('track-switcher')).getAllByRole('radio');
    expect(options.map((o) => o.props.testID)).toEqual(['track-option-co2', 'track-option-pm25', 'track-option-so2']);
    expect(asked()).toContain('/api/region');
    expect(asked()).not.toContain('/api/region?track=pm25');
  });

  it('opens the device’s remembered track when the URL has none', async () => {
    rememberTrack('so2');
    answerRegion();
    renderApp('/');
    await screen.findByTestId('track-switcher');
    await waitFor(() => expect(checked('so2')).toBe(true));
    expect(asked()).toContain('/api/region?track=so2');
    expect(asked()).not.toContain('/api/region');
  });

  it('lets the URL win over the device', async () => {
    rememberTrack('so2');
    answerRegion();
    renderApp('/?track=pm25');
    await screen.findByTestId('track-switcher');
    await waitFor(() => expect(checked('pm25')).toBe(true));
    expect(asked()).toContain('/api/region?track=pm25');
    expect(asked()).not.toContain('/api/region?track=so2');
  });

  it('switching puts the track in the URL, remembers it, and reloads the list for it', async () => {
    answerRegion();
    const app = renderApp('/');
    await screen.findByTestId('track-switcher');
    await act(async () => fireEvent.press(screen.getByTestId('track-option-pm25')));
    await waitFor(() => expect(checked('pm25')).toBe(true));
    expect(app.getSearchParams()).toEqual({ track: 'pm25' });
    expect(asked()).toContain('/api/region?track=pm25');
    // Remembered on the device (the in-memory copy here; localStorage in a browser, see the e2e test).
    expect(rememberedTrack()).toBe('pm25');
  });

  it('says so when the tracks cannot be loaded, and still shows the headline list', async () => {
    mockedGet.mockImplementation(answerWith({ '/api/region': listFor('co2') }));
    renderApp('/');
    expect(await screen.findByTestId('track-switcher-error')).toBeTruthy();
    expect(await screen.findByText('Ashgrove')).toBeTruthy();
  });
});

describe('district card rows per track', () => {
  function answerCard(over: Record<string, unknown> = {}) {
    mockedGet.mockImplementation(
      answerWith({ ...cardAnswers(estimateRecord({})), '/api/districts/T02': gappyDetail, ...over }),
    );
  }

  it('shows one row per track with its mark, standing word and gap; the chosen one marked', async () => {
    answerCard();
    renderApp('/district/T02');
    const rows = within(await screen.findByTestId('track-rows'));
    // Rows as the API gives them (support/estimates.ts trackRows): CO₂ −12.4%, PM2.5 +8.1%, SO₂ unpublished.
    expect(rows.getByTestId('track-row-co2-standing')).toHaveTextContent('Approaching', { exact: true });
    expect(rows.getByTestId('track-row-co2-gap').props.children).toBe('gap −12%');
    expect(rows.getByTestId('standing-mark-approaching', { includeHiddenElements: true })).toBeTruthy();
    expect(rows.getByTestId('track-row-pm25-standing')).toHaveTextContent('Past the turn', { exact: true });
    expect(rows.getByTestId('track-row-pm25-gap').props.children).toBe('gap +8%');
    expect(rows.getByTestId('track-row-so2-standing')).toHaveTextContent('No published run yet', { exact: true });
    expect(rows.getByTestId('track-row-so2-gap').props.children).toBe('');
    expect(rows.getByText('µg/m³')).toBeTruthy();
    expect(rows.getByTestId('track-row-co2').props.accessibilityState.selected).toBe(true);
    expect(rows.getByTestId('track-row-pm25').props.accessibilityState.selected).toBe(false);
    expect(screen.getByTestId('card-track').props.children).toBe('CO₂ per person · t CO₂ per person');
  });

  it('opens the track of the URL, and pressing a row shows that track’s full card', async () => {
    const pm25 = estimateResponse(estimateRecord({}), {
      track: pm25Track,
      run: {
        ...run,
        id: 9,
        units: { ...run.units, emissions: { ...pm25Track.indicator } },
      },
    });
    answerCard({
      '/api/districts/T02/estimate?track=pm25': pm25,
      '/api/districts/T02/history?track=pm25': { district: { code: 'T02', name: 'Bryn Ødegård' }, history: [] },
    });
    const app = renderApp('/district/T02');
    await screen.findByTestId('track-rows');
    await act(async () => fireEvent.press(screen.getByTestId('track-row-pm25')));
    await waitFor(() => expect(screen.getByTestId('card-track').props.children).toBe('Fine particles · µg/m³'));
    expect(app.getSearchParams()).toEqual({ code: 'T02', track: 'pm25' });
    expect(asked()).toContain('/api/districts/T02/estimate?track=pm25');
    // The chart's words and the brief link now name the particles and their unit, not CO₂.
    expect(screen.getByTestId('curve-chart-box').props['aria-label']).toMatch(
      /^PM2\.5 annual mean against real income per person, both on log scales/,
    );
    expect(screen.getByTestId('curve-chart-box').props['aria-label']).toMatch(/µg\/m³\./);
    expect(screen.getByTestId('district-brief-link').props.accessibilityLabel).toBe(
      'Brief: Fine particles, for Bryn Ødegård, PDF',
    );
  });

  it('says so when the chosen track has no published run', async () => {
    answerCard({
      '/api/districts/T02/estimate?track=so2': estimateResponse(null, {
        run: null,
        track: {
          code: 'so2',
          name: 'SO₂ per person',
          indicator: {
            code: 'so2_pc',
            name: 'SO₂ emissions per person',
            unit: 'kg per person',
            source: null,
            licence: null,
          },
        },
      }),
      '/api/districts/T02/history?track=so2': { district: { code: 'T02', name: 'Bryn Ødegård' }, history: [] },
    });
    renderApp('/district/T02?track=so2');
    const empty = await screen.findByTestId('no-published-estimate');
    expect(within(empty).getByText('No published run for SO₂ per person yet')).toBeTruthy();
    expect(screen.getByTestId('track-rows')).toBeTruthy();
  });
});

describe('the method page’s series and sources', () => {
  it('gives each catalogue indicator its unit, publisher and terms, and names the tracks watching it', () => {
    const catalogue = [
      {
        code: 'emissions_pc',
        name: 'CO₂ emissions per person',
        unit: 't CO₂ per person',
        description: '',
        mustBePositive: true,
        derivation: null,
      },
      {
        code: 'income_pc',
        name: 'Real income per person',
        unit: '€ per person',
        description: '',
        mustBePositive: true,
        derivation: null,
      },
    ];
    render(
      <IndicatorSources
        indicators={{ status: 'success', data: catalogue, error: null, isFetching: false, refetch: jest.fn() } as never}
        tracks={tracks}
      />,
    );
    const co2 = within(screen.getByTestId('indicator-source-emissions_pc'));
    // Source and licence of the CO₂ indicator as the track list labels it (support/estimates.ts co2Indicator).
    expect(co2.getByText('Watched as CO₂ per person.')).toBeTruthy();
    expect(co2.getByText('Published by: Regional inventory office')).toBeTruthy();
    expect(co2.getByText('Terms of use: CC BY 4.0')).toBeTruthy();
    const income = within(screen.getByTestId('indicator-source-income_pc'));
    expect(income.getByText('Published by: not recorded in the catalogue')).toBeTruthy();
    expect(income.queryByText(/^Watched as/)).toBeNull();
  });
});
