/**
 * A run's estimates as CSV: one row per district (main estimate), every figure of the
 * card, at full precision (no rounding for reading: the CSV is for re-use; numbers are
 * written as the shortest text that reads back to the same double). Text cells
 * are quoted, and a leading = + - @ is escaped (api/http/csv-escape.ts). An
 * interval is written only where it is bounded; where the Fieller set is two rays, the
 * ray ends go in their own columns, so no spreadsheet reads them as an interval.
 * UTF-8 with a byte-order mark (spreadsheets need it for names such as "Жарово"), CRLF.
 */
import type { Knex } from 'knex';
import { AppError, NotFoundError } from '../http/errors';
import { csvLine, type CsvCell } from '../http/csv-escape';
import { STAFF, type Caller } from '../http/routes';
import { findRun, notesByCode, type PublishedRun } from '../estimates/service';
import { summaryRecords, type SummaryRecord } from './store';

type Row = SummaryRecord;

const num = (v: number | null | undefined): CsvCell =>
  v === null || v === undefined || !Number.isFinite(v) ? null : v;
const bool = (v: boolean | null | undefined): CsvCell => (v === null || v === undefined ? null : v ? 'true' : 'false');

/** Column name → how to read it from a district's record (and the run / note). */
const COLUMNS: [string, (r: Row, note: string | null) => CsvCell][] = [
  ['district_code', (r) => r.code],
  ['district_name', (r) => r.name],
  ['status', (r) => r.status],
  ['standing', (r) => r.standing.standing],
  ['standing_note', (r) => r.standing.note],
  ['interval_method', (r) => r.standing.intervalMethod],
  ['interval_bounded', (r) => bool(r.standing.intervalBounded)],
  ['shape', (r) => r.shape?.shape ?? null],
  ['shape_decided_by', (r) => r.shape?.decidedBy ?? null],
  ['shape_notes', (r) => (r.shape?.notes.length ? r.shape.notes.join('; ') : null)],
  ['threshold', (r) => num(r.threshold?.level)],
  ['threshold_kind', (r) => r.threshold?.kind ?? null],
  ['threshold_in_range', (r) => bool(r.threshold?.inRange)],
  [
    'interval_lo',
    (r) => (r.standing.intervalBounded && r.threshold?.fieller.kind === 'bounded' ? num(r.standing.levelLo) : null),
  ],
  [
    'interval_hi',
    (r) => (r.standing.intervalBounded && r.threshold?.fieller.kind === 'bounded' ? num(r.standing.levelHi) : null),
  ],
  ['fieller_kind', (r) => r.threshold?.fieller.kind ?? null],
  ['fieller_lo', (r) => (r.threshold?.fieller.kind === 'bounded' ? num(r.threshold.fieller.levelLo) : null)],
  ['fieller_hi', (r) => (r.threshold?.fieller.kind === 'bounded' ? num(r.threshold.fieller.levelHi) : null)],
  [
    'fieller_lower_ray_ends_at',
    (r) => (r.threshold?.fieller.kind === 'two_rays' ? num(r.threshold.fieller.levelLo) : null),
  ],
  [
    'fieller_upper_ray_starts_at',
    (r) => (r.threshold?.fieller.kind === 'two_rays' ? num(r.threshold.fieller.levelHi) : null),
  ],
  ['delta_se_log', (r) => num(r.threshold?.delta.se)],
  ['delta_lo', (r) => (r.threshold?.fieller.kind === 'bounded' ? num(r.threshold.delta.levelLo) : null)],
  ['delta_hi', (r) => (r.threshold?.fieller.kind === 'bounded' ? num(r.threshold.delta.levelHi) : null)],
  ['first_year', (r) => num(r.firstYear)],
  ['last_year', (r) => num(r.lastYear)],
  ['n_years', (r) => num(r.n)],
  ['dropped_years', (r) => (r.droppedYears.length ? r.droppedYears.join(' ') : null)],
  ['driver_now', (r) => num(r.range?.levelNow)],
  ['driver_min', (r) => num(r.range?.levelMin)],
  ['driver_max', (r) => num(r.range?.levelMax)],
  ['gap_percent', (r) => num(r.gapPercent)],
  ['elasticity', (r) => num(r.elasticity?.value)],
  ['elasticity_se', (r) => num(r.elasticity?.se)],
  ['elasticity_lo', (r) => num(r.elasticity?.lo)],
  ['elasticity_hi', (r) => num(r.elasticity?.hi)],
  ['trend_per_year', (r) => num(r.trendPerYear)],
  ['projection_status', (r) => r.projection?.status ?? null],
  ['crossing_year', (r) => num(r.projection?.crossingYear)],
  ['crossing_earliest', (r) => num(r.projection?.earliest)],
  ['crossing_latest', (r) => num(r.projection?.latest)],
  ['projection_note', (r) => r.projection?.note ?? null],
  ['u_test_statistic', (r) => num(r.uTest?.statistic)],
  ['u_test_p', (r) => num(r.uTest?.pValue)],
  ['u_test_rejects', (r) => bool(r.uTest?.rejects)],
  ['wald_f', (r) => num(r.wald?.fStatistic)],
  ['wald_p', (r) => num(r.wald?.pValue)],
  ['r_squared', (r) => num(r.rSquared)],
  ['model_form', (r) => r.model.form],
  ['model_transform', (r) => r.model.transform],
  ['covariance', (r) => r.model.covariance],
  ['lag', (r) => num(r.model.lag)],
  ['confidence_level', (r) => r.model.level],
  ['alpha', (r) => r.model.alpha],
  ['controls', (r) => r.model.controls.join(' ')],
  ['reason', (r) => r.reason?.message ?? null],
  ['analyst_note', (_r, note) => note],
];

const RUN_COLUMNS = [
  'run_id',
  'run_state',
  'published_at',
  'data_version',
  'data_hash',
  'software_version',
  'spec_name',
];

export const EXPORT_COLUMNS: readonly string[] = [...RUN_COLUMNS, ...COLUMNS.map(([name]) => name)];

export function estimatesCsv(run: PublishedRun, rows: Row[], notes: Map<string, string>): string {
  const runCells: CsvCell[] = [
    run.id,
    run.state,
    run.publishedAt,
    num(run.dataVersion),
    run.dataHash,
    run.softwareVersion,
    run.spec.name,
  ];
  const lines = [csvLine([...EXPORT_COLUMNS])];
  for (const r of rows) {
    const note = notes.get(r.code) ?? null;
    lines.push(csvLine([...runCells, ...COLUMNS.map(([, read]) => read(r, note))]));
  }
  return `\uFEFF${lines.join('\r\n')}\r\n`;
}

/**
 * Who may export what: every signed-in role a published run; analysts and admins also a
 * run in review (to check it before publishing). Other states have nothing to export.
 */
export async function exportRun(db: Knex, caller: Caller, runId: number): Promise<{ filename: string; csv: string }> {
  const run = await findRun(db, runId);
  if (!run) throw new NotFoundError(`No run ${runId}`, { runId });
  if (run.state !== 'published') {
    if (run.state !== 'in_review')
      throw new AppError(
        409,
        'run_not_ready',
        `Run #${runId} is ${run.state}: only published runs (and, for analysts, runs in review) can be exported.`,
      );
    if (!STAFF.includes(caller.role))
      throw new AppError(
        403,
        'forbidden',
        `Run #${runId} is still in review: officials can export it once it is published.`,
      );
  }
  const [rows, notes] = await Promise.all([summaryRecords(db, runId), notesByCode(db, runId)]);
  return { filename: `crestwatch-run-${runId}-estimates.csv`, csv: estimatesCsv(run, rows, notes) };
}
