/**
 * The COPY text of a run's estimates (PostgreSQL's text format, one line per district and
 * variant): pure, so a compute-pool thread builds it beside the fits and hands the main
 * thread one string per slice of districts — the records are never cloned across the
 * thread boundary nor serialised on the event loop.
 */
import type { EstimateRecord } from './estimate-record';

/** The columns the text fills, in order (api/runs/store.ts copies into them). */
export const ESTIMATE_COPY_COLUMNS =
  'run_id, district_id, variant, status, standing, shape, threshold, gap_percent, crossing_year, u_test_rejects, interval_bounded, last_year, result';

/** One value in COPY's text format: \N for null, backslash, tab and line breaks escaped. */
function copyText(v: string | number | boolean | null | undefined): string {
  if (v === null || v === undefined) return '\\N';
  if (typeof v === 'number') return Number.isFinite(v) ? String(v) : '\\N';
  if (typeof v === 'boolean') return v ? 't' : 'f';
  return v.replace(/[\\\t\n\r]/g, (c) => (c === '\\' ? '\\\\' : c === '\t' ? '\\t' : c === '\n' ? '\\n' : '\\r'));
}

/** The COPY text of some estimates: one line per district and variant. */
export function estimatesCopyText(runId: number, rows: { districtId: number; record: EstimateRecord }[]): string {
  const lines: string[] = [];
  for (const { districtId, record: r } of rows) {
    lines.push(
      [
        runId,
        districtId,
        r.variant,
        r.status,
        r.standing.standing,
        r.shape?.shape ?? null,
        r.threshold?.level ?? null,
        r.gapPercent,
        r.projection?.crossingYear ?? null,
        r.uTest?.rejects ?? null,
        r.standing.intervalBounded,
        r.lastYear,
        JSON.stringify(r),
      ]
        .map(copyText)
        .join('\t'),
    );
  }
  return lines.length ? lines.join('\n') + '\n' : '';
}
