// The upload screen over mocked API answers and a mocked file picker: check, preview with
// its problems, load, the refusal with every problem listed, the history with Revert, and
// the role gate.
import { fireEvent, screen, waitFor, within } from 'expo-router/testing-library';

import { ApiError, apiGet, apiSend } from '@/lib/api-client';
import { pickCsvFile } from '@/lib/pick-file';

import { answerWith } from './support/mock-api';
import { me, renderStaff } from './support/render-staff';
import { committedAnswer, previewAnswer, settingsAnswer, upload } from './support/staff-fixtures';

jest.mock('@/lib/api-client', () => ({
  ...jest.requireActual('@/lib/api-client'),
  apiGet: jest.fn(),
  apiSend: jest.fn(),
}));
jest.mock('@/lib/pick-file', () => ({ pickCsvFile: jest.fn() }));
jest.mock('@/hooks/use-layout-mode', () => ({ useLayoutMode: () => 'phone', useThirdColumn: () => false }));
jest.mock('expo-router/head', () => ({ __esModule: true, default: () => null }));

const mockedGet = apiGet as jest.MockedFunction<typeof apiGet>;
const mockedSend = apiSend as jest.MockedFunction<typeof apiSend>;
const mockedPick = pickCsvFile as jest.MockedFunction<typeof pickCsvFile>;
const appended: [string, string][] = [];
const file = {
  name: 'series.csv',
  size: 1200,
  appendTo: (_form: FormData, field: string) => appended.push([field, 'series.csv']),
};

beforeEach(() => {
  appended.length = 0;
  mockedPick.mockResolvedValue(file);
});
afterEach(() => {
  mockedGet.mockReset();
  mockedSend.mockReset();
  mockedPick.mockReset();
});

function answers(role: 'analyst' | 'official' = 'analyst', uploads = [upload()]) {
  mockedGet.mockImplementation(
    answerWith({
      '/api/me': me(role),
      '/api/uploads?limit=50': { uploads, nextBefore: null },
      '/api/settings': settingsAnswer,
    }),
  );
}

describe('upload screen', () => {
  it('checks a chosen file, shows what it would change and its warning, then loads it', async () => {
    answers();
    mockedSend.mockImplementation(async (method, path) => {
      if (/^\/api\/uploads\?progress=[0-9a-f]{32}$/.test(path)) return previewAnswer;
      if (/^\/api\/uploads\/7\/commit\?progress=[0-9a-f]{32}$/.test(path)) return committedAnswer;
      throw new Error(`unexpected ${method} ${path}`);
    });
    renderStaff('/uploads');
    fireEvent.press(await screen.findByTestId('upload-choose'));
    expect(await screen.findByTestId('upload-ready')).toBeTruthy();
    // A dry run: the file goes in the multipart field `file`; the server applies the change factor itself.
    // The bytes sent are followed, and the server reports its phases under a fresh key.
    expect(mockedSend).toHaveBeenCalledWith(
      'POST',
      expect.stringMatching(/^\/api\/uploads\?progress=[0-9a-f]{32}$/),
      expect.objectContaining({ form: expect.anything(), onUploadProgress: expect.any(Function) }),
    );
    expect(appended).toEqual([['file', 'series.csv']]);
    expect(screen.getByText(/Loading writes 6 new, 4 changed, 0 unchanged in one step/)).toBeTruthy();
    expect(
      within(screen.getByTestId('problems')).getByText('value changes by more than ×3 against the stored 2.1'),
    ).toBeTruthy();
    expect(within(screen.getByTestId('preview-district-T02')).getByText('Bryn Ødegård')).toBeTruthy();

    fireEvent.press(screen.getByTestId('upload-commit'));
    expect(await screen.findByText('Loaded as upload #7: 6 new, 4 changed, 0 unchanged. Data version 5.')).toBeTruthy();
    expect(mockedSend).toHaveBeenCalledWith(
      'POST',
      expect.stringMatching(/^\/api\/uploads\/7\/commit\?progress=/),
      expect.anything(),
    );
    expect(screen.getByLabelText('See the values of Ashgrove')).toBeTruthy();
  });

  it('lists every problem of a refused file by line and column, and says nothing was written', async () => {
    answers();
    mockedSend.mockRejectedValue(
      // The panel composes its words from the fields; the server's own sentence is not read.
      new ApiError(422, 'upload_rejected', 'A sentence the panel does not show.', {
        uploadId: 9,
        problems: [
          {
            line: 3,
            column: 4,
            field: 'value',
            code: 'not_a_number',
            severity: 'error',
            reason: 'value "abc" is not a number',
          },
          {
            line: 5,
            column: 3,
            field: 'year',
            code: 'year_in_future',
            severity: 'error',
            reason: 'year 2999 is in the future',
          },
        ],
        errorCount: 2,
        warningCount: 0,
        truncated: false,
        preview: null,
      }),
    );
    renderStaff('/uploads');
    fireEvent.press(await screen.findByTestId('upload-choose'));
    const refused = await screen.findByTestId('upload-refused');
    expect(within(refused).getByText('The file was not loaded')).toBeTruthy();
    // Composed from the refusal's fields: the first error's place and reason, and the count of the rest.
    expect(
      within(refused).getByText(
        'Line 3, column 4 (value): value "abc" is not a number (and 1 more error). Nothing was written.',
      ),
    ).toBeTruthy();
    expect(within(refused).queryByText(/A sentence the panel does not show/)).toBeNull();
    const first = within(screen.getByTestId('problem-0'));
    expect(first.getByText('3')).toBeTruthy();
    expect(first.getByText('4 · value')).toBeTruthy();
    expect(first.getByText('value "abc" is not a number')).toBeTruthy();
    expect(within(screen.getByTestId('problem-1')).getByText('year 2999 is in the future')).toBeTruthy();
    expect(screen.getByTestId('problems-summary').props.children.join('')).toMatch(/^2 errors, 0 warnings\./);
    expect(screen.queryByTestId('upload-commit')).toBeNull();
  });

  it('shows the bytes sent, then the server phase polled under the upload key', async () => {
    let key = '';
    let finish: (v: unknown) => void = () => {};
    mockedGet.mockImplementation(async (path: string) => {
      if (path === `/api/uploads/progress/${key}`)
        return {
          key,
          state: 'running',
          phase: 'checking',
          phases: [
            { phase: 'reading', atMs: 0 },
            { phase: 'checking', atMs: 900 },
          ],
          counts: {
            bytesRead: 40_000_000,
            bytesTotal: 40_000_000,
            rowsRead: 812_400,
            values: 812_400,
            insert: null,
            change: null,
            unchanged: null,
            derived: null,
          },
          commit: false,
          stoppedAt: null,
        };
      return answerWith({
        '/api/me': me('analyst'),
        '/api/uploads?limit=50': { uploads: [upload()], nextBefore: null },
        '/api/settings': settingsAnswer,
      })(path);
    });
    mockedSend.mockImplementation((_method, path, options) => {
      key = /progress=([0-9a-f]+)/.exec(path)![1];
      options!.onUploadProgress!(12_400_000, 40_000_000);
      return new Promise((resolve) => (finish = resolve)) as never;
    });
    renderStaff('/uploads');
    fireEvent.press(await screen.findByTestId('upload-choose'));
    // The server is asked under the key the upload was sent with, and its phase shown with its counts.
    expect(await screen.findByText(/Checking against stored data: 812,400 values/)).toBeTruthy();
    expect(
      screen.getByText(/Reading and checking rows: 812,400 rows, 812,400 values \(100% of the file\)/),
    ).toBeTruthy();
    // WAI-ARIA 1.2, progressbar role: the bar carries its range and a text for the value.
    const bar = screen.getByTestId('upload-bytes');
    expect(bar.props.role).toBe('progressbar');
    expect(bar.props['aria-valuetext']).toBe('40.0 MB of 40.0 MB');
    finish(previewAnswer);
    expect(await screen.findByTestId('upload-ready')).toBeTruthy();
    expect(screen.queryByTestId('upload-progress')).toBeNull();
  });

  it('does nothing when the picker is cancelled', async () => {
    answers();
    mockedPick.mockResolvedValue(null);
    renderStaff('/uploads');
    fireEvent.press(await screen.findByTestId('upload-choose'));
    await waitFor(() => expect(mockedPick).toHaveBeenCalled());
    expect(mockedSend).not.toHaveBeenCalled();
    expect(screen.queryByTestId('upload-ready')).toBeNull();
  });

  it('reverts a loaded upload from the history after asking once', async () => {
    answers('analyst', [upload({ id: 3 }), upload({ id: 2, kind: 'seed', fileName: null, canRevert: false })]);
    mockedSend.mockResolvedValue({
      reverted: upload({ id: 3, status: 'reverted' }),
      revert: upload({ id: 8, kind: 'revert', version: 6 }),
      restored: { changedBack: 4, removed: 6, reinserted: 0, derived: 0 },
    });
    renderStaff('/uploads');
    const row = await screen.findByTestId('upload-row-3');
    expect(within(row).getByText('series.csv')).toBeTruthy();
    expect(within(screen.getByTestId('upload-row-2')).getByText('Demo region data')).toBeTruthy();
    expect(screen.queryByTestId('upload-revert-2')).toBeNull();
    fireEvent.press(screen.getByTestId('upload-revert-3'));
    expect(mockedSend).not.toHaveBeenCalled();
    fireEvent.press(screen.getByTestId('upload-revert-3-confirm'));
    expect(
      await screen.findByText('Upload #3 reverted: 4 values put back, 6 removed, 0 restored. Data version 6.'),
    ).toBeTruthy();
    expect(mockedSend).toHaveBeenCalledWith('POST', '/api/uploads/3/revert', expect.anything());
  });

  it('shows a revert the server refuses in its own words', async () => {
    answers();
    mockedSend.mockRejectedValue(
      new ApiError(409, 'superseded', 'Upload 3 cannot be reverted: upload 5 changed the same values since.'),
    );
    renderStaff('/uploads');
    fireEvent.press(await screen.findByTestId('upload-revert-3'));
    fireEvent.press(screen.getByTestId('upload-revert-3-confirm'));
    expect(
      await screen.findByText('Upload 3 cannot be reverted: upload 5 changed the same values since.'),
    ).toBeTruthy();
  });

  it('is closed to officials, without asking for the history', async () => {
    answers('official');
    renderStaff('/uploads');
    expect(await screen.findByTestId('role-gate-refused')).toBeTruthy();
    expect(screen.getByText('Not available to officials')).toBeTruthy();
    expect(mockedGet.mock.calls.map((c) => c[0])).not.toContain('/api/uploads?limit=50');
  });
});
