// Tracks on the staff screens over mocked API answers: "re-estimate now" for one track or
// all active ones, the admin's tracks section, and a track taking up another saved spec.
import { act, fireEvent, screen, waitFor, within } from 'expo-router/testing-library';

import { apiGet, apiSend } from '@/lib/api-client';
import type { SavedSpec } from '@/contracts/settings';

import { tracksAnswer } from './support/estimates';
import { answerWith } from './support/mock-api';
import { me, renderStaff } from './support/render-staff';
import { settingsAnswer } from './support/staff-fixtures';

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

const spec = (over: Partial<SavedSpec>): SavedSpec => ({
  id: 1,
  name: 'Regional default',
  description: '',
  emissionsIndicator: 'emissions_pc',
  driverIndicator: 'income_pc',
  controls: [],
  firstYear: null,
  lastYear: null,
  minYears: null,
  tracks: [],
  form: 'quadratic',
  transform: 'log',
  covariance: 'newey_west',
  intervalMethod: 'fieller',
  levelControls: [],
  archived: false,
  createdAt: '2026-01-05T09:00:00.000Z',
  updatedAt: '2026-01-05T09:00:00.000Z',
  ...over,
});
const specsAnswer = {
  specs: [
    spec({}),
    spec({ id: 5, name: 'CO₂ levels', transform: 'level' }),
    spec({ id: 2, name: 'Particles default', emissionsIndicator: 'pm25' }),
  ],
  headlineSpecId: 1,
};

describe('re-estimate now', () => {
  const answers = {
    '/api/me': me('analyst'),
    '/api/settings': settingsAnswer,
    '/api/tracks': tracksAnswer,
    '/api/runs?limit=30': { runs: [] },
  };

  it('offers each open track, headline first, and all active tracks; lists the runs it queued', async () => {
    mockedGet.mockImplementation(answerWith(answers));
    mockedSend.mockResolvedValue({
      id: 21,
      state: 'queued',
      track: 'co2',
      runs: [
        { id: 21, state: 'queued', track: 'co2' },
        { id: 22, state: 'queued', track: 'pm25' },
        { id: 23, state: 'queued', track: 'so2' },
      ],
    });
    renderStaff('/runs');
    const choice = await screen.findByTestId('run-track');
    const options = within(choice)
      .getAllByRole('radio')
      .map((o) => o.props.testID);
    // The archived track (nox) is not offered; three active tracks make "all" worth offering.
    expect(options).toEqual(['run-track-co2', 'run-track-pm25', 'run-track-so2', 'run-track-all']);
    expect(screen.getByTestId('run-track-co2').props.accessibilityState.checked).toBe(true);
    fireEvent.press(screen.getByTestId('run-track-all'));
    await act(async () => fireEvent.press(screen.getByTestId('run-start')));
    expect(mockedSend).toHaveBeenCalledWith('POST', '/api/runs', expect.objectContaining({ json: { track: 'all' } }));
    expect(
      await screen.findByText('Queued 3 runs: #21 CO₂ per person, #22 Fine particles, #23 SO₂ per person.'),
    ).toBeTruthy();
  });
});

describe('the runs list per track', () => {
  it('shows every track’s runs, or one track’s through GET /api/runs?track=', async () => {
    mockedGet.mockImplementation(
      answerWith({
        '/api/me': me('analyst'),
        '/api/settings': settingsAnswer,
        '/api/tracks': tracksAnswer,
        '/api/runs?limit=30': { runs: [] },
        '/api/runs?limit=30&track=pm25': { runs: [] },
      }),
    );
    renderStaff('/runs');
    await screen.findByTestId('runs-track');
    expect(screen.getByTestId('runs-track-all').props.accessibilityState.checked).toBe(true);
    await act(async () => fireEvent.press(screen.getByTestId('runs-track-pm25')));
    await waitFor(() => expect(mockedGet.mock.calls.map((c) => c[0])).toContain('/api/runs?limit=30&track=pm25'));
  });
});

describe('tracks section of the settings (admin)', () => {
  const answers = {
    '/api/me': me('admin'),
    '/api/settings': settingsAnswer,
    '/api/tracks': tracksAnswer,
    '/api/specs': specsAnswer,
  };

  it('pauses a track, makes another the headline, and refuses a malformed code before sending', async () => {
    mockedGet.mockImplementation(answerWith(answers));
    mockedSend.mockResolvedValue({ track: tracksAnswer.tracks[0] });
    renderStaff('/settings');
    await screen.findByTestId('tracks-admin');
    await act(async () => fireEvent.press(screen.getByTestId('track-pause-pm25')));
    expect(mockedSend).toHaveBeenCalledWith(
      'PATCH',
      '/api/tracks/pm25',
      expect.objectContaining({ json: { state: 'paused' } }),
    );
    await act(async () => fireEvent.press(screen.getByTestId('track-headline-pm25')));
    expect(mockedSend).toHaveBeenCalledWith(
      'PATCH',
      '/api/tracks/pm25',
      expect.objectContaining({ json: { headline: true } }),
    );
    // The headline track can be neither archived nor made headline again.
    expect(screen.queryByTestId('track-archive-co2')).toBeNull();
    expect(screen.queryByTestId('track-headline-co2')).toBeNull();

    mockedSend.mockClear();
    fireEvent.changeText(screen.getByTestId('track-new-code'), 'PM 10');
    fireEvent.changeText(screen.getByTestId('track-new-name'), 'Coarse particles');
    fireEvent.press(screen.getByTestId('track-new-save'));
    expect(await screen.findByText(/^Code: a track code is a lower-case letter/)).toBeTruthy();
    expect(screen.getByText('Spec: choose the saved spec the track starts with.')).toBeTruthy();
    expect(mockedSend).not.toHaveBeenCalled();
  });

  it('shows the tracks read-only to analysts', async () => {
    mockedGet.mockImplementation(answerWith({ ...answers, '/api/me': me('analyst') }));
    renderStaff('/settings');
    await screen.findByTestId('tracks-admin');
    expect(screen.queryByTestId('track-pause-co2')).toBeNull();
    expect(screen.queryByTestId('track-new')).toBeNull();
  });
});

describe('a track’s spec (specs screen)', () => {
  it('offers only saved specs of the track’s own indicator and sends the choice', async () => {
    mockedGet.mockImplementation(
      answerWith({
        '/api/me': me('analyst'),
        '/api/tracks': tracksAnswer,
        '/api/specs': specsAnswer,
        '/api/indicators': { indicators: [] },
      }),
    );
    mockedSend.mockResolvedValue({ track: tracksAnswer.tracks[1] });
    renderStaff('/specs');
    const co2 = within(await screen.findByTestId('track-spec-co2'));
    // CO₂ may take "CO₂ levels" but never the particles' spec.
    expect(co2.getByTestId('track-spec-choice-co2-5')).toBeTruthy();
    expect(co2.queryByTestId('track-spec-choice-co2-2')).toBeNull();
    // The particle track has no other spec of its indicator to choose.
    expect(
      within(screen.getByTestId('track-spec-pm25')).getByText(/No other saved spec watches PM2.5 annual mean/),
    ).toBeTruthy();
    fireEvent.press(co2.getByTestId('track-spec-choice-co2-5'));
    await act(async () => fireEvent.press(co2.getByTestId('track-spec-save-co2')));
    expect(mockedSend).toHaveBeenCalledWith(
      'PUT',
      '/api/tracks/co2/spec',
      expect.objectContaining({ json: { specId: 5 } }),
    );
    await waitFor(() => expect(screen.getByText('CO₂ per person uses “CO₂ levels” from its next run.')).toBeTruthy());
    // The spec list says which track uses which spec.
    expect(screen.getByTestId('spec-row-1-tracks').props.children.join('')).toBe('Used by CO₂ per person');
  });
});
