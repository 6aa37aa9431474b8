// The run screen over mocked API answers: progress while it works, the review table with
// its filters and sorting, one district's split of the threshold move, and publishing.
import { fireEvent, screen, waitFor, within } from 'expo-router/testing-library';

import { apiGet, apiSend } from '@/lib/api-client';
import type { DistrictReview, RunEstimateRecord } from '@/contracts/runs';

import { answerWith } from './support/mock-api';
import { me, renderStaff } from './support/render-staff';
import { reviewAnswer, runView, settingsAnswer } from './support/staff-fixtures';

jest.mock('@/lib/api-client', () => ({
  ...jest.requireActual('@/lib/api-client'),
  apiGet: jest.fn(),
  apiSend: jest.fn(),
}));
jest.mock('@/hooks/use-layout-mode', () => ({ useLayoutMode: () => 'wide', useThirdColumn: () => false }));
jest.mock('expo-router/head', () => ({ __esModule: true, default: () => null }));

const mockedGet = apiGet as jest.MockedFunction<typeof apiGet>;
const mockedSend = apiSend as jest.MockedFunction<typeof apiSend>;

afterEach(() => {
  mockedGet.mockReset();
  mockedSend.mockReset();
});

const main = {
  variant: 'main',
  status: 'ok',
  reason: null,
  model: {
    form: 'quadratic',
    transform: 'log',
    covariance: 'newey_west',
    level: 0.95,
    alpha: 0.05,
    intervalMethod: 'fieller',
    controls: [],
    lag: 2,
  },
  n: 20,
  k: 3,
  firstYear: 2006,
  lastYear: 2025,
  droppedYears: [],
  rSquared: 0.9,
  range: null,
  threshold: {
    x: 9.9,
    level: 20000,
    kind: 'peak',
    inRange: true,
    extrapolated: false,
    intervalBounded: true,
    delta: { se: 0.1, levelLo: 18000, levelHi: 22000 },
    fieller: { kind: 'bounded', levelLo: 17500, levelHi: 23000 },
  },
  turningPoints: [],
  standing: {
    standing: 'past_turn',
    intervalMethod: 'fieller',
    intervalBounded: true,
    levelLo: 17500,
    levelHi: 23000,
    note: null,
  },
  shape: { shape: 'inverted_u', decidedBy: 'u_test', notes: [] },
  uTest: { statistic: 2.5, pValue: 0.01, rejects: true, orientation: 'inverted_u' },
  gapPercent: 12,
  elasticity: null,
  trendPerYear: 0.02,
  projection: null,
  points: [],
  curve: [],
  pooledCurve: [],
  diagnostics: {
    durbinWatson: { statistic: 0.9, pValue: 0.001 },
    breuschGodfrey: [{ order: 1, statistic: 7.8, df: 1, pValue: 0.005 }],
    breuschPagan: { statistic: 1.2, df: 2, pValue: 0.55 },
    jarqueBera: { statistic: 0.4, skewness: 0.1, kurtosis: 3.1, pValue: 0.82 },
    largestLeverage: { value: 0.36, year: 2006, row: 0 },
    residualsByYear: [
      { year: 2023, residual: 0.02 },
      { year: 2024, residual: -0.05 },
      { year: 2025, residual: 0.01 },
    ],
  },
} as unknown as RunEstimateRecord;

const t02: DistrictReview = {
  runId: 5,
  code: 'T02',
  records: [main],
  previousRunId: 4,
  previous: null,
  movement: {
    previous: 25000,
    current: 20000,
    previousSpecOnNewData: 21000,
    dataPart: -4000,
    specPart: -1000,
    softwareChanged: false,
    previousSoftware: '0.1.0',
    specChanged: true,
  },
  note: { note: 'Revised income', authorEmail: 'analyst@crestwatch.example', updatedAt: '2026-11-30T10:05:00.000Z' },
};

function answers(over: Record<string, unknown> = {}) {
  mockedGet.mockImplementation(
    answerWith({
      '/api/me': me('analyst'),
      '/api/runs/5': runView(),
      '/api/runs/5/review': reviewAnswer,
      '/api/runs/5/districts/T02': t02,
      '/api/settings': settingsAnswer,
      ...over,
    }),
  );
}

const rowOrder = () => screen.getAllByTestId(/^review-row-/).map((r) => r.props.testID);

describe('run review', () => {
  it('shows the progress of a running run and asks for no review yet', async () => {
    answers({
      '/api/runs/5': runView({
        state: 'running',
        progress: { chunksDone: 1, chunksTotal: 4, districts: 24 },
        finishedAt: null,
        standingCounts: null,
      }),
    });
    renderStaff('/runs/5');
    expect(await screen.findByTestId('run-progress')).toBeTruthy();
    expect(screen.getByText('Fitting districts: 1 of 4 chunks done (24 districts).')).toBeTruthy();
    expect(screen.getByText('Running')).toBeTruthy();
    expect(mockedGet.mock.calls.map((c) => c[0])).not.toContain('/api/runs/5/review');
  });

  it('compares with the last published run, filters by what changed and sorts by the move', async () => {
    answers();
    renderStaff('/runs/5');
    await screen.findByTestId('review-table');
    expect(screen.getByText(/Compared with published run #4: 1 of 3 districts changed/)).toBeTruthy();
    expect(rowOrder()).toEqual(['review-row-T01', 'review-row-T02', 'review-row-T03']);
    const t02Row = within(screen.getByTestId('review-row-T02'));
    expect(t02Row.getByText('Approaching → Past the turn')).toBeTruthy();
    expect(t02Row.getByText('−20.0%')).toBeTruthy();
    expect(t02Row.getByText('flipped')).toBeTruthy();

    fireEvent.press(screen.getByTestId('review-filter-standing'));
    expect(rowOrder()).toEqual(['review-row-T02']);
    expect(screen.getByTestId('review-count').props.children).toBe('1 of 3 districts');
    fireEvent.press(screen.getByTestId('review-filter-shape'));
    expect(screen.getByText('No district matches. Choose “All districts” or clear the search.')).toBeTruthy();

    fireEvent.press(screen.getByTestId('review-filter-all'));
    fireEvent.press(screen.getByTestId('review-table-sort-move'));
    // Largest move first, a district without a threshold last.
    expect(rowOrder()).toEqual(['review-row-T02', 'review-row-T01', 'review-row-T03']);
    fireEvent.changeText(screen.getByTestId('review-search'), 'cold');
    expect(rowOrder()).toEqual(['review-row-T03']);
  });

  it('splits a district’s threshold move into data revisions and the spec change, with its checks', async () => {
    answers();
    renderStaff('/runs/5?district=T02');
    const panel = within(await screen.findByTestId('district-review'));
    await screen.findByTestId('movement');
    expect(panel.getByText('Bryn Ødegård (T02)')).toBeTruthy();
    expect(within(screen.getByTestId('movement-data')).getByText(/−4,000/)).toBeTruthy();
    expect(within(screen.getByTestId('movement-spec')).getByText(/−1,000/)).toBeTruthy();
    expect(panel.getByText(/Threshold 25,000 → 20,000 \(−20\.0%\) against published run #4\./)).toBeTruthy();
    const checks = within(screen.getByTestId('diagnostics'));
    expect(checks.getAllByText('Sign of serial correlation')).toHaveLength(2);
    expect(checks.getAllByText('No sign at α')).toHaveLength(2);
    expect(screen.getByTestId('residual-plot-summary')).toBeTruthy();
    expect(screen.getByDisplayValue('Revised income')).toBeTruthy();
  });

  it('publishes after asking once and reports the alerts it raised', async () => {
    answers();
    mockedSend.mockResolvedValue({ previousRunId: 4, alerts: 2, mails: 3 });
    renderStaff('/runs/5');
    fireEvent.press(await screen.findByTestId('run-publish'));
    expect(mockedSend).not.toHaveBeenCalled();
    fireEvent.press(screen.getByTestId('run-publish-confirm'));
    expect(await screen.findByText('Published. Compared with run #4: 2 alerts raised, 3 e-mails queued.')).toBeTruthy();
    expect(mockedSend).toHaveBeenCalledWith('POST', '/api/runs/5/publish', expect.anything());
  });

  it('saves a note for the next brief', async () => {
    answers();
    mockedSend.mockResolvedValue(undefined);
    renderStaff('/runs/5?district=T02');
    const input = await screen.findByTestId('note-input');
    fireEvent.changeText(input, 'Check the 2024 census revision');
    fireEvent.press(screen.getByTestId('note-save'));
    await waitFor(() =>
      expect(mockedSend).toHaveBeenCalledWith('PUT', '/api/runs/5/districts/T02/note', {
        json: { note: 'Check the 2024 census revision' },
      }),
    );
    expect(await screen.findByText('Note saved.')).toBeTruthy();
  });
});
