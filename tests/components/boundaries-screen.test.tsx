// The boundary upload screen over mocked API answers and a mocked file picker: a dry run
// that lists every problem by feature and code, the ST_MakeValid repair only when asked,
// a load with the settings the file was checked with, the check asked again when the
// settings change, the versions history (empty, failed, with Revert), and the role gate.
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { Slot } from 'expo-router';
import { fireEvent, renderRouter, screen, within } from 'expo-router/testing-library';

import BoundariesRoute from '@/app/uploads/boundaries';
import type { BoundaryProblem, BoundaryUploadAnswer, BoundaryVersion } from '@/contracts/boundaries';
import { ApiError, apiGet, apiSend } from '@/lib/api-client';
import { pickGeoJsonFile } from '@/lib/pick-file';

import { answerWith } from './support/mock-api';
import { me } from './support/render-staff';

jest.mock('@/lib/api-client', () => ({
  ...jest.requireActual('@/lib/api-client'),
  apiGet: jest.fn(),
  apiSend: jest.fn(),
}));
jest.mock('@/lib/pick-file', () => ({ pickGeoJsonFile: jest.fn() }));
jest.mock('@/hooks/use-layout-mode', () => ({ useLayoutMode: () => 'phone', useThirdColumn: () => false }));
jest.mock('expo-router/head', () => ({ __esModule: true, default: () => null }));

const mockedGet = apiGet as jest.MockedFunction<typeof apiGet>;
const mockedSend = apiSend as jest.MockedFunction<typeof apiSend>;
const mockedPick = pickGeoJsonFile as jest.MockedFunction<typeof pickGeoJsonFile>;
const file = { name: 'districts.geojson', size: 8200, appendTo: (form: FormData, field: string) => void [form, field] };

function render() {
  const client = new QueryClient({ defaultOptions: { queries: { retry: false, gcTime: Infinity } } });
  function TestLayout() {
    return (
      <QueryClientProvider client={client}>
        <Slot />
      </QueryClientProvider>
    );
  }
  return renderRouter(
    { _layout: TestLayout, index: () => null, 'uploads/boundaries': BoundariesRoute, 'uploads/[id]': () => null },
    { initialUrl: '/uploads/boundaries' },
  );
}

const problem = (p: Partial<BoundaryProblem>): BoundaryProblem => ({
  feature: null,
  code: null,
  problem: 'unknown_code',
  severity: 'error',
  reason: '',
  ...p,
});

function answer(over: Partial<BoundaryUploadAnswer> = {}): BoundaryUploadAnswer {
  const problems = over.problems ?? [];
  return {
    accepted: problems.every((p) => p.severity !== 'error'),
    committed: false,
    versionId: null,
    uploadId: null,
    dataVersion: null,
    counts: {
      features: 3,
      vertices: 42,
      matched: 2,
      missing: 1,
      repaired: 0,
      errors: problems.filter((p) => p.severity === 'error').length,
      warnings: problems.filter((p) => p.severity === 'warning').length,
    },
    problems,
    preview: [
      { feature: 0, code: 'T01', name: 'Ashgrove', areaKm2: 512.34 },
      { feature: 1, code: 'T02', name: 'Bryn Ødegård', areaKm2: 0.5 },
    ],
    missingDistricts: ['T03'],
    ...over,
  };
}

const crossing = problem({
  feature: 1,
  code: 'T02',
  problem: 'self_intersection',
  reason: 'feature 1 (T02) is not a valid polygon: Self-intersection[1 2]',
});
const unknown = problem({
  feature: 2,
  code: 'Z99',
  reason: 'feature 2 has the code Z99, which is not a district of the region',
});
const repaired = problem({
  ...crossing,
  problem: 'repaired',
  severity: 'warning',
  reason: 'feature 1 (T02) was repaired',
});
const noBoundary = problem({
  code: 'T03',
  problem: 'no_boundary',
  severity: 'warning',
  reason: 'district T03 has no feature',
});

const version = (over: Partial<BoundaryVersion> = {}): BoundaryVersion => ({
  id: 3,
  uploadId: 12,
  dataVersion: 9,
  status: 'committed',
  fileName: 'districts.geojson',
  userEmail: 'analyst@crestwatch.example',
  createdAt: '2026-12-04T10:00:00.000Z',
  codeProperty: 'code',
  features: 2,
  vertices: 42,
  repaired: 0,
  missing: 1,
  current: true,
  ...over,
});

function answers(role: 'analyst' | 'official' = 'analyst', versions: unknown = { versions: [] }) {
  mockedGet.mockImplementation(answerWith({ '/api/me': me(role), '/api/boundaries/versions': versions }));
}

beforeEach(() => mockedPick.mockResolvedValue(file));
afterEach(() => {
  mockedGet.mockReset();
  mockedSend.mockReset();
  mockedPick.mockReset();
});

/** The problem table's column headers, which a card (narrow screens) shows beside each value. */
const FIELD_LABELS = new Set(['Code', 'Kind', 'Problem', 'What is wrong']);

const rowTexts = (testID: string) =>
  screen
    .getAllByTestId(new RegExp(`^${testID}-\\d+$`))
    .map((r) =>
      within(r)
        .queryAllByText(/.+/)
        .map((t) => String(t.props.children))
        .filter((t) => !FIELD_LABELS.has(t)),
    )
    // A table cell says "6" or "—"; a card (narrow screens) says "Feature 6" or "District".
    .map(([first, ...rest]) => [first.replace(/^Feature /, '').replace(/^(District|File)$/, '—'), ...rest]);

describe('boundary upload screen', () => {
  it('lists every problem by feature and code, repairs only when asked, then loads with the checked settings', async () => {
    answers();
    const paths: string[] = [];
    mockedSend.mockImplementation(async (_method, path) => {
      paths.push(path);
      if (path === '/api/boundaries?codeProperty=code') return answer({ problems: [crossing, unknown, noBoundary] });
      if (path === '/api/boundaries?codeProperty=code&repair=true')
        return answer({ problems: [repaired, noBoundary], counts: { ...answer().counts, repaired: 1, warnings: 2 } });
      if (path === '/api/boundaries?codeProperty=code&repair=true&commit=true')
        return answer({
          committed: true,
          versionId: 4,
          uploadId: 13,
          dataVersion: 10,
          problems: [repaired, noBoundary],
          counts: { ...answer().counts, repaired: 1, warnings: 2 },
        });
      throw new Error(`unexpected ${path}`);
    });
    render();
    expect(await screen.findByTestId('boundary-versions-empty')).toBeTruthy();
    fireEvent.press(screen.getByTestId('boundary-choose'));

    expect(await screen.findByTestId('boundary-not-accepted')).toBeTruthy();
    expect(screen.queryByTestId('boundary-commit')).toBeNull();
    expect(
      screen.getByText(
        'Feature 1 (T02) is not a valid polygon: Self-intersection[1 2] (and 1 more error and 1 warning). Nothing was written; the whole file loads only when every error is fixed.',
      ),
    ).toBeTruthy();
    const rows = rowTexts('boundary-problem');
    expect(rows[0].slice(0, 4)).toEqual(['1', 'T02', 'Error', 'Crosses itself']);
    expect(rows[1].slice(0, 4)).toEqual(['2', 'Z99', 'Error', 'Unknown code']);
    expect(rows[2].slice(0, 4)).toEqual(['—', 'T03', 'Warning', 'No boundary']);

    // The repair is the analyst's choice: the box is off until asked.
    expect(screen.getByTestId('boundary-repair').props.accessibilityState?.checked ?? false).toBe(false);
    fireEvent.press(screen.getByTestId('boundary-repair-again'));
    expect(await screen.findByTestId('boundary-ready')).toBeTruthy();
    expect(
      screen.getByText(
        /Loading writes boundaries for 2 districts \(42 vertices\); 1 feature repaired with ST_MakeValid; 1 district left without a boundary/,
      ),
    ).toBeTruthy();
    expect(within(screen.getByTestId('boundary-preview-T01')).getByText('512 km²')).toBeTruthy();
    expect(within(screen.getByTestId('boundary-preview-T02')).getByText('0.500 km²')).toBeTruthy();
    expect(screen.getByTestId('boundary-missing')).toBeTruthy();

    fireEvent.press(screen.getByTestId('boundary-commit'));
    expect(
      await screen.findByText(
        'Loaded as boundary version 4 (upload #13, data version 10): boundaries for 2 districts (42 vertices); 1 feature repaired with ST_MakeValid; 1 district left without a boundary.',
      ),
    ).toBeTruthy();
    expect(paths).toEqual([
      '/api/boundaries?codeProperty=code',
      '/api/boundaries?codeProperty=code&repair=true',
      '/api/boundaries?codeProperty=code&repair=true&commit=true',
    ]);
  });

  it('asks for a new check when the code property changes after one', async () => {
    answers();
    mockedSend.mockImplementation(async (_method, path) =>
      path.includes('district_id')
        ? answer()
        : answer({ problems: [problem({ feature: 0, problem: 'no_code', reason: 'x' })] }),
    );
    render();
    fireEvent.press(await screen.findByTestId('boundary-choose'));
    expect(await screen.findByTestId('boundary-not-accepted')).toBeTruthy();
    fireEvent.changeText(screen.getByTestId('boundary-code-property'), 'district_id');
    expect(screen.getByTestId('boundary-stale')).toBeTruthy();
    fireEvent.press(screen.getByTestId('boundary-recheck'));
    expect(await screen.findByTestId('boundary-ready')).toBeTruthy();
    expect(mockedSend).toHaveBeenLastCalledWith(
      'POST',
      '/api/boundaries?codeProperty=district_id',
      expect.objectContaining({ form: expect.anything() }),
    );
    expect(screen.queryByTestId('boundary-stale')).toBeNull();
    // An empty property cannot be sent.
    fireEvent.changeText(screen.getByTestId('boundary-code-property'), ' ');
    expect(screen.getByText('Name the property that holds the district code.')).toBeTruthy();
  });

  it('shows a refused commit with its problems, and a file over the size cap in words', async () => {
    answers();
    mockedSend
      .mockResolvedValueOnce(answer())
      .mockRejectedValueOnce(new ApiError(422, 'boundaries_rejected', 'not loaded', answer({ problems: [unknown] })))
      .mockRejectedValueOnce(
        new ApiError(
          413,
          'payload_too_large',
          'The file is larger than the upload limit of 50 MB (set by BOUNDARY_MAX_BYTES); nothing was loaded.',
        ),
      );
    render();
    fireEvent.press(await screen.findByTestId('boundary-choose'));
    fireEvent.press(await screen.findByTestId('boundary-commit'));
    expect(await screen.findByText('The boundaries were not loaded')).toBeTruthy();
    expect(
      screen.getByText('Feature 2 has the code Z99, which is not a district of the region. Nothing was written.'),
    ).toBeTruthy();
    expect(rowTexts('boundary-problem')[0].slice(0, 2)).toEqual(['2', 'Z99']);
    fireEvent.press(screen.getByTestId('boundary-choose'));
    expect(await screen.findByText('The file is too large')).toBeTruthy();
    expect(
      screen.getByText(
        'The file is larger than the upload limit of 50 MB (set by BOUNDARY_MAX_BYTES); nothing was loaded.',
      ),
    ).toBeTruthy();
  });

  it('lists the versions with the one in force and reverts one', async () => {
    answers('analyst', { versions: [version(), version({ id: 2, uploadId: 8, current: false, dataVersion: 6 })] });
    mockedSend.mockResolvedValue({
      reverted: version({ status: 'reverted', current: false }),
      revertUploadId: 14,
      dataVersion: 11,
      restored: { changedBack: 0, removed: 0, reinserted: 0, derived: 0 },
      currentVersionId: 2,
    });
    render();
    expect(await screen.findByTestId('boundary-versions')).toBeTruthy();
    expect(within(screen.getByTestId('boundary-version-status-3')).getByText('In force')).toBeTruthy();
    expect(within(screen.getByTestId('boundary-version-status-2')).getByText('Replaced')).toBeTruthy();
    fireEvent.press(screen.getByTestId('boundary-revert-3'));
    fireEvent.press(screen.getByTestId('boundary-revert-3-confirm'));
    expect(
      await screen.findByText('Boundary version 3 reverted (data version 11). Boundary version 2 is in force again.'),
    ).toBeTruthy();
    expect(mockedSend).toHaveBeenCalledWith('POST', '/api/boundaries/versions/3/revert', expect.anything());
  });

  it('says when the versions could not be loaded', async () => {
    answers('analyst', new ApiError(500, 'internal', 'boom'));
    render();
    expect(await screen.findByTestId('boundary-versions-error')).toBeTruthy();
  });

  it('is closed to officials, without asking for the versions', async () => {
    answers('official');
    render();
    expect(await screen.findByTestId('role-gate-refused')).toBeTruthy();
    expect(mockedGet.mock.calls.map((c) => c[0])).not.toContain('/api/boundaries/versions');
  });
});
