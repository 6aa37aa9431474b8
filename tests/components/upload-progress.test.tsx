// The upload progress view alone: bytes sent as a progress bar with its value, the server's
// phases in order with their counts, and where a refused upload stopped.
import { render, screen } from '@testing-library/react-native';

import { UploadProgressPanel, stopWords } from '@/components/uploads/upload-progress';
import type { UploadProgress } from '@/contracts/uploads';

const counts = {
  bytesRead: 0,
  bytesTotal: 40_000_000,
  rowsRead: 0,
  values: 0,
  insert: null,
  change: null,
  unchanged: null,
  derived: null,
};

function server(over: Partial<UploadProgress>): UploadProgress {
  return {
    key: 'k'.repeat(32),
    state: 'running',
    phase: 'reading',
    phases: [{ phase: 'reading', atMs: 0 }],
    counts,
    commit: true,
    stoppedAt: null,
    ...over,
  };
}

describe('upload progress', () => {
  it('shows the bytes sent as a progressbar with its value, before the server reports', () => {
    render(
      <UploadProgressPanel
        sent={{ loaded: 12_400_000, total: 40_000_000 }}
        server={null}
        fileSize={40_000_000}
        commit
      />,
    );
    // WAI-ARIA 1.2, progressbar: aria-valuemin/max/now give the range, aria-valuetext the words read out.
    const bar = screen.getByTestId('upload-bytes');
    expect(bar.props.role).toBe('progressbar');
    expect(bar.props['aria-valuemin']).toBe(0);
    expect(bar.props['aria-valuemax']).toBe(40_000_000);
    expect(bar.props['aria-valuenow']).toBe(12_400_000);
    expect(bar.props['aria-valuetext']).toBe('12.4 MB of 40.0 MB');
    expect(screen.getByText('12.4 MB of 40.0 MB')).toBeTruthy();
    expect(screen.getByText('Sending the file')).toBeTruthy();
    // No phase has begun: all three are still to come, in order.
    expect(screen.getByTestId('upload-phase-reading').props.children.join('')).toBe('Next — Reading and checking rows');
    expect(screen.getByTestId('upload-phase-merging').props.children.join('')).toBe(
      'Next — Merging into the stored data',
    );
  });

  it('marks phases done, under way and to come, each with its counts', () => {
    render(
      <UploadProgressPanel
        sent={{ loaded: 40_000_000, total: 40_000_000 }}
        server={server({
          phase: 'merging',
          phases: [
            { phase: 'reading', atMs: 0 },
            { phase: 'checking', atMs: 1200 },
            { phase: 'merging', atMs: 1900 },
          ],
          counts: {
            ...counts,
            bytesRead: 40_000_000,
            rowsRead: 1_000_000,
            values: 1_000_000,
            insert: 990_000,
            change: 10_000,
            unchanged: 0,
            derived: 0,
          },
        })}
        fileSize={40_000_000}
        commit
      />,
    );
    expect(screen.getByText('File sent')).toBeTruthy();
    expect(screen.getByTestId('upload-phase-reading').props.children.join('')).toBe(
      'Done — Reading and checking rows: 1,000,000 rows, 1,000,000 values (100% of the file)',
    );
    expect(screen.getByTestId('upload-phase-checking').props.children.join('')).toBe(
      'Done — Checking against stored data: 990,000 new, 10,000 changed, 0 unchanged',
    );
    expect(screen.getByTestId('upload-phase-merging').props.children.join('')).toBe(
      'Now — Merging into the stored data: writing 990,000 new and 10,000 changed values',
    );
  });

  it('says where a refused upload stopped', () => {
    render(
      <UploadProgressPanel
        sent={null}
        server={server({
          state: 'failed',
          phase: 'checking',
          commit: false,
          phases: [
            { phase: 'reading', atMs: 0 },
            { phase: 'checking', atMs: 300 },
          ],
          counts: {
            ...counts,
            bytesRead: 40_000_000,
            rowsRead: 3,
            values: 3,
            insert: 1,
            change: 0,
            unchanged: 0,
            derived: 0,
          },
          stoppedAt: { phase: 'checking', line: 1234 },
        })}
        fileSize={40_000_000}
        commit={false}
      />,
    );
    expect(screen.getByTestId('upload-stopped').props.children).toBe(
      'Stopped while checking against stored data, at line 1,234.',
    );
    expect(screen.getByTestId('upload-phase-checking').props.children[0]).toBe('Stopped — ');
    expect(screen.queryByTestId('upload-phase-merging')).toBeNull();
  });

  it('words a stop without a line', () => {
    expect(stopWords({ phase: 'reading', line: null })).toBe('Stopped while reading and checking rows.');
  });
});
