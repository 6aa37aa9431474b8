// The district card over mocked API answers: headline and figures, the band only for a
// bounded interval, the charts' text summaries, sensitivity strip, tabs, subscribe toggle,
// not-estimable and substitute cases, and the stale notice when a refresh fails.
import { onlineManager } from '@tanstack/react-query';
import { act, fireEvent, screen, waitFor, within } from 'expo-router/testing-library';

import { Dimensions } from 'react-native';
import { chartHeight } from '@/components/chart/chart-styles';
import { layout } from '@/components/theme';
import { ApiError, apiGet, apiSend } from '@/lib/api-client';
import { DEFAULT_LOCALE, setRegionLocale } from '@/lib/format';

import {
  cardAnswers,
  estimateRecord,
  estimateResponse,
  notEstimableRecord,
  pm25Track,
  run,
  wholeLineRecord,
} from './support/estimates';
import { gappyDetail } from './support/fixtures';
import { answerWith } from './support/mock-api';
import { renderApp } from './support/render-app';

jest.mock('@/lib/api-client', () => ({
  ...jest.requireActual('@/lib/api-client'),
  apiGet: jest.fn(),
  apiSend: jest.fn(),
}));
jest.mock('@/hooks/use-layout-mode', () => ({ useLayoutMode: () => 'phone', useThirdColumn: () => false }));
jest.mock('expo-router/head', () => ({ __esModule: true, default: () => null }));

const mockedGet = apiGet as jest.MockedFunction<typeof apiGet>;
const mockedSend = apiSend as jest.MockedFunction<typeof apiSend>;

afterEach(() => {
  mockedGet.mockReset();
  mockedSend.mockReset();
});

function answer(main = estimateRecord({}), over: Record<string, unknown> = {}) {
  mockedGet.mockImplementation(answerWith({ ...cardAnswers(main), '/api/districts/T02': gappyDetail, ...over }));
}

describe('district card', () => {
  it('leads with the standing and the headline sentence, then the figures and the model line', async () => {
    answer();
    renderApp('/district/T02');
    const headline = await screen.findByTestId('card-headline');
    expect(headline.props.children).toBe(
      'Income is 18% below the estimated turning point; at the recent trend it would reach it around 2031 (2028–2040).',
    );
    const panel = within(screen.getByTestId('headline-panel'));
    expect(panel.getByText('Approaching')).toBeTruthy();
    expect(panel.getByText('Rise then fall (inverted U)')).toBeTruthy();
    const threshold = within(screen.getByTestId('figure-threshold'));
    // the figure, and under it the driver's unit from the run's catalogue labels (support/estimates.ts)
    expect(threshold.getByText('30,000')).toBeTruthy();
    expect(threshold.getByText('€ per person')).toBeTruthy();
    expect(threshold.getByText('Fieller 95%: 26,000–36,000 — sets the standing')).toBeTruthy();
    expect(threshold.getByText('Delta method 95%: 25,500–35,000')).toBeTruthy();
    expect(within(screen.getByTestId('figure-elasticity')).getByText('+0.21')).toBeTruthy();
    expect(within(screen.getByTestId('figure-crossing')).getByText('2031 (2028–2040)')).toBeTruthy();
    expect(screen.getByTestId('model-line').props.children.join('')).toMatch(
      /Quadratic in logs · Newey–West errors \(lag 2\) · controls: population density · n = 20, 2006–2025 · 95% Fieller intervals/,
    );
    expect(screen.getByText(/Run #7, published 2 Oct 2026/)).toBeTruthy();
    expect(screen.getByTestId('district-brief-link')).toBeTruthy();
  });

  it('draws a band for a bounded interval and says so in words', async () => {
    answer();
    renderApp('/district/T02');
    await screen.findByTestId('card-headline');
    const curve = within(screen.getByTestId('curve-chart'));
    expect(curve.getByTestId('legend-band')).toBeTruthy();
    expect(curve.queryByTestId('legend-no-band')).toBeNull();
    const summary = screen.getByTestId('curve-chart-summary');
    expect(textOf(summary)).toMatch(/with its 95% Fieller interval \(26,000–36,000\) as a shaded band/);
    expect(screen.getByTestId('curve-chart-box').props['aria-label']).toBe(textOf(summary).replace(/^In words: /, ''));
    expect(textOf(screen.getByTestId('path-chart-summary'))).toMatch(/it meets the threshold around 2031/);
  });

  it('draws no band where the Fieller set is the whole line', async () => {
    answer(wholeLineRecord());
    renderApp('/district/T02');
    await screen.findByTestId('card-headline');
    for (const id of ['curve-chart', 'path-chart']) {
      const chart = within(screen.getByTestId(id));
      expect(chart.queryByTestId('legend-band')).toBeNull();
      expect(chart.getByText('No band: interval not bounded at 95%')).toBeTruthy();
    }
    expect(textOf(screen.getByTestId('curve-chart-summary'))).toMatch(
      /as a line without a band: interval not bounded at 95% \(any income \(the whole line\)\)/,
    );
    expect(
      screen.getByText(/Interval not bounded at 95%: the data are consistent with a turning point at any income/),
    ).toBeTruthy();
    expect(
      within(screen.getByTestId('figure-threshold')).getByText(/Fieller 95%: interval not bounded at 95%/),
    ).toBeTruthy();
    // The strip joins one frame after the headline.
    expect(await screen.findByTestId('sensitivity-unbounded-main', { includeHiddenElements: true })).toBeTruthy();
    expect(screen.queryByTestId('sensitivity-band-main', { includeHiddenElements: true })).toBeNull();
  });

  it('shows each variant’s threshold in the sensitivity strip, bounded or not', async () => {
    answer();
    renderApp('/district/T02');
    await screen.findByTestId('card-headline');
    expect(await screen.findByLabelText('Published spec: 30,000 (26,000–36,000)')).toBeTruthy();
    expect(screen.getByLabelText('Without controls: 28,000 (25,000–31,000)')).toBeTruthy();
    expect(screen.getByLabelText('Cubic: 33,000 (24,000–52,000)')).toBeTruthy();
    expect(
      screen.getByLabelText('Last 20 years only: 31,000; interval not bounded at 95% (below 20,000 or above 60,000)'),
    ).toBeTruthy();
    expect(screen.getByLabelText('Level form: not estimable (Too few rows)')).toBeTruthy();
    expect(screen.getByTestId('sensitivity-band-cubic', { includeHiddenElements: true })).toBeTruthy();
    expect(screen.getByTestId('sensitivity-unbounded-last20', { includeHiddenElements: true })).toBeTruthy();
  });

  it('draws the charts after mount, behind placeholders of the same height', async () => {
    answer();
    renderApp('/district/T02');
    await screen.findByTestId('card-headline');
    const box = screen.getByTestId('curve-chart-box');
    // 280 px at the default text size, a little taller with a larger one (react-native's jest
    // set-up reports a font scale of 2); the placeholder takes the same height.
    const height = chartHeight(layout.curveChartHeight, Dimensions.get('window').fontScale || 1);
    expect(height).toBeGreaterThanOrEqual(280);
    expect(box.props.style).toEqual(expect.arrayContaining([expect.objectContaining({ height })]));
    // Nothing is measured in the test renderer until a layout event arrives.
    const placeholder = screen.getByTestId('curve-chart-placeholder', { includeHiddenElements: true });
    expect(placeholder.props.style).toEqual(expect.arrayContaining([expect.objectContaining({ height })]));
    await act(async () => {
      fireEvent(box, 'layout', { nativeEvent: { layout: { width: 358, height: 280, x: 0, y: 0 } } });
    });
    await waitFor(
      () => expect(screen.queryByTestId('curve-chart-placeholder', { includeHiddenElements: true })).toBeNull(),
      { timeout: 20_000 },
    );
  }, 90_000);

  it('labels a regional substitute', async () => {
    answer(
      estimateRecord({
        status: 'substitute',
        reason: { code: 'too_few_rows', message: 'series too short; the regional pooled curve stands in' },
      }),
    );
    renderApp('/district/T02');
    expect(await screen.findByTestId('substitute-label')).toBeTruthy();
    expect(
      screen.getByText(
        'Regional substitute: this district’s own series is too short, so the regional pooled curve stands in for it.',
      ),
    ).toBeTruthy();
    expect(within(screen.getByTestId('curve-chart')).getByText('Regional pooled curve (stands in)')).toBeTruthy();
    expect(await screen.findByLabelText(/^Published \(regional substitute\)/)).toBeTruthy();
  });

  it('says why a district is not estimable and draws no threshold', async () => {
    answer(notEstimableRecord());
    renderApp('/district/T02');
    const headline = await screen.findByTestId('card-headline');
    expect(headline.props.children).toBe(
      'No curve could be estimated for this district: Only 6 usable years; the model needs at least 9.',
    );
    expect(within(screen.getByTestId('headline-panel')).getByText('Not estimable')).toBeTruthy();
    const curve = within(screen.getByTestId('curve-chart'));
    expect(curve.queryByTestId('legend-threshold')).toBeNull();
    expect(curve.queryByTestId('legend-band')).toBeNull();
    expect(textOf(screen.getByTestId('curve-chart-summary'))).toMatch(
      /No fitted curve: the district is not estimable in this run/,
    );
  });

  it('shows the reviewing analyst’s note', async () => {
    answer(estimateRecord({}), {
      '/api/districts/T02/estimate': {
        ...(cardAnswers(estimateRecord({}))['/api/districts/T02/estimate'] as object),
        note: {
          note: 'Series revised in 2026; read with the 2024 upload.',
          authorEmail: 'analyst@crestwatch.example',
          updatedAt: run.publishedAt,
        },
      },
    });
    renderApp('/district/T02');
    expect(await screen.findByText('Series revised in 2026; read with the 2024 upload.')).toBeTruthy();
  });

  it('shows history and alerts in their tabs', async () => {
    answer(estimateRecord({}), {
      '/api/districts/T02/alerts?limit=20': {
        alerts: [
          {
            id: 3,
            runId: 7,
            kind: 'crossing',
            details: { from: 'approaching', to: 'at_turn' },
            createdAt: '2026-10-02T09:00:00.000Z',
          },
        ],
      },
    });
    renderApp('/district/T02');
    await screen.findByTestId('card-headline');
    fireEvent.press(await screen.findByTestId('tab-history'));
    expect(await screen.findByTestId('history-7')).toBeTruthy();
    expect(screen.getByText('Run #7 · 2 Oct 2026 · data v3')).toBeTruthy();
    fireEvent.press(screen.getByTestId('tab-alerts'));
    expect(await screen.findByText('Standing moved from Approaching to At the turn.')).toBeTruthy();
  });

  it('subscribes with the toggle, and unsubscribes the district’s own subscription', async () => {
    let subscriptions: unknown[] = [];
    answer(estimateRecord({}), { '/api/subscriptions': async () => ({ subscriptions }) });
    mockedSend.mockImplementation(async (method) => {
      if (method === 'POST')
        subscriptions = [
          {
            id: 11,
            scope: 'district',
            districtCodes: ['T02'],
            kinds: ['crossing'],
            delivery: 'instant',
            attachBrief: false,
            createdAt: run.publishedAt,
          },
        ];
      else subscriptions = [];
      return undefined as never;
    });
    renderApp('/district/T02');
    await screen.findByTestId('card-headline');
    const toggle = await screen.findByTestId('subscribe-toggle');
    await waitFor(() => expect(toggle.props.accessibilityState.disabled).toBe(false));
    expect(toggle.props.accessibilityState.checked).toBe(false);
    await act(async () => fireEvent.press(toggle));
    expect(mockedSend).toHaveBeenCalledWith('POST', '/api/subscriptions', {
      json: {
        tracks: 'all',
        scope: 'district',
        districtCodes: ['T02'],
        kinds: [],
        delivery: 'instant',
        attachBrief: false,
      },
    });
    await waitFor(() => expect(screen.getByTestId('subscribe-toggle').props.accessibilityState.checked).toBe(true));
    await act(async () => fireEvent.press(screen.getByTestId('subscribe-toggle')));
    expect(mockedSend).toHaveBeenLastCalledWith('DELETE', '/api/subscriptions/11');
    await waitFor(() => expect(screen.getByTestId('subscribe-toggle').props.accessibilityState.checked).toBe(false));
  });

  it('says the figures may be out of date while the device is offline', async () => {
    answer();
    renderApp('/district/T02');
    await screen.findByTestId('card-headline');
    expect(screen.queryByTestId('stale-notice')).toBeNull();
    act(() => onlineManager.setOnline(false));
    try {
      expect(await screen.findByText(/they will refresh when the connection returns/)).toBeTruthy();
      expect(screen.getByTestId('card-headline')).toBeTruthy();
    } finally {
      act(() => onlineManager.setOnline(true));
    }
    await waitFor(() => expect(screen.queryByTestId('stale-notice')).toBeNull());
  });

  it('keeps the last figures when a refresh fails, and says they may be stale', async () => {
    answer();
    const { client } = renderApp('/district/T02');
    await screen.findByTestId('card-headline');
    expect(screen.queryByTestId('stale-notice')).toBeNull();
    mockedGet.mockImplementation(async () => {
      throw new ApiError(0, 'network_error', 'The Crestwatch server could not be reached.');
    });
    await act(async () => {
      await client.refetchQueries();
    });
    expect(await screen.findByTestId('stale-notice')).toBeTruthy();
    expect(screen.getByText(/Showing this district’s figures as loaded at/)).toBeTruthy();
    expect(screen.getByTestId('card-headline')).toBeTruthy();
  });

  // The region locale (admin setting, carried by GET /api/me) formats the card's figures;
  // "30.000" and "95 %" (U+00A0 before %) are de-DE's CLDR formats in Node's ICU.
  it('formats its figures in the region’s locale from /api/me', async () => {
    answer(estimateRecord({}), {
      '/api/me': {
        id: 3,
        email: 'o@example.test',
        name: null,
        role: 'official',
        csrfToken: 't',
        regionLocale: 'de-DE',
      },
    });
    renderApp('/district/T02', { regionLocale: true });
    await waitFor(() => expect(within(screen.getByTestId('figure-threshold')).getByText('30.000')).toBeTruthy());
    expect(screen.getByTestId('card-headline').props.children).toMatch(/^Income is 18\u00a0% below/);
    setRegionLocale(DEFAULT_LOCALE);
  });

  // Plain words (issue 17): an official's card says what `flat` means, at the run's own
  // test level α, and names the track's indicator as the catalogue does.
  it('says "no clear link" for a flat curve, at the run’s level, naming a PM2.5 track’s indicator', async () => {
    const base = estimateRecord({});
    const flat = estimateRecord({
      standing: { ...base.standing, standing: 'no_turn', intervalBounded: null, levelLo: null, levelHi: null },
      shape: { shape: 'flat', decidedBy: 'joint_test', notes: [] },
      threshold: null,
      gapPercent: null,
      projection: null,
      model: { ...base.model, alpha: 0.1 },
    });
    const pmRun = { ...run, units: { ...run.units, emissions: pm25Track.indicator } };
    answer(flat, { '/api/districts/T02/estimate': estimateResponse(flat, { run: pmRun, track: pm25Track }) });
    renderApp('/district/T02');
    const headline = await screen.findByTestId('card-headline');
    expect(headline.props.children).toBe(
      'No clear link between income and PM2.5 annual mean over the observed incomes at the 10% level.',
    );
    expect(screen.getByTestId('card-shape').props.children).toBe('No clear link with income at the 10% level');
    expect(screen.queryByText(/\bFlat\b/)).toBeNull();
  });
});

/** The text of a Text element with nested children, as one string. */
function textOf(node: { props: { children?: unknown } }): string {
  const walk = (c: unknown): string => {
    if (c === null || c === undefined || typeof c === 'boolean') return '';
    if (typeof c === 'string' || typeof c === 'number') return String(c);
    if (Array.isArray(c)) return c.map(walk).join('');
    if (typeof c === 'object' && 'props' in (c as object))
      return walk((c as { props: { children?: unknown } }).props.children);
    return '';
  };
  return walk(node.props.children);
}
