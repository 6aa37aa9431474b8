/**
 * POST /api/estimate: fitCurve over HTTP. Rows come in the body, or are read for one
 * district from the current observations (emissions, driver and controls by indicator
 * code). Bad input is a 400 naming the row and the reason. The fit runs in the compute
 * pool, off the event loop; controls are capped at 8 and the Newey–West lag at n − 1.
 */
import type { Knex } from 'knex';
import type { ComputePool } from '../compute/pool';
import type { CurveRow, ModelSpecInput } from '../estimation';
import { AppError } from '../http/errors';
import { districtByCode } from '../districts/service';
import { knownIndicatorCodes } from '../indicators/service';
import { currentDataVersion, loadSeries } from '../runs/service';

export interface DistrictSource {
  district: string;
  emissions: string;
  driver: string;
  controls: string[];
  firstYear?: number;
  lastYear?: number;
}

export async function rowsForDistrict(
  db: Knex,
  src: DistrictSource,
): Promise<{ rows: CurveRow[]; droppedYears: number[]; dataVersion: number }> {
  const d = await districtByCode(db, src.district);
  const known = new Set(await knownIndicatorCodes(db, [src.emissions, src.driver, ...src.controls]));
  const unknown = [src.emissions, src.driver, ...src.controls].filter((c) => !known.has(c));
  if (unknown.length)
    throw new AppError(400, 'unknown_indicator', `Unknown indicator: ${unknown.join(', ')}`, { unknown });
  const version = await currentDataVersion(db);
  const sel = {
    emissions: src.emissions,
    driver: src.driver,
    controls: src.controls,
    firstYear: src.firstYear ?? null,
    lastYear: src.lastYear ?? null,
  };
  const [series] = await loadSeries(db, version, sel, [Number(d.id)]);
  if (!series) return { rows: [], droppedYears: [], dataVersion: version };
  const rows = series.data.years.map((year, i) => ({
    year,
    y: series.data.y[i],
    x: series.data.x[i],
    controls: Object.fromEntries(src.controls.map((c) => [c, series.data.controls[c][i]])),
  }));
  return { rows, droppedYears: series.data.droppedYears, dataVersion: version };
}

/** The most controls a fit may use (each row's and the model's), as in saved specs. */
export const MAX_CONTROLS = 8;

/**
 * The Newey–West lag must leave at least one row: lag ≤ n − 1. Refused before any fitting
 * (400 `lag_too_large`), never clamped.
 */
export function checkLag(n: number, lag: number | undefined): void {
  if (lag === undefined || lag <= n - 1) return;
  throw new AppError(
    400,
    'lag_too_large',
    `The Newey–West lag ${lag} is too large for ${n} rows: it may be at most ${Math.max(0, n - 1)} (n − 1).`,
    { lag, n, max: Math.max(0, n - 1) },
  );
}

/** Fits one curve in the compute pool; an engine refusal becomes a 400 naming the row. */
export async function estimate(compute: ComputePool, rows: CurveRow[], model: ModelSpecInput) {
  const out = await compute.run({ kind: 'fit-curve', rows, model });
  if (out.ok) return out.result;
  const { code, message, details } = out.error;
  if (code === 'invalid_argument' && details.reason === 'lag')
    throw new AppError(400, 'lag_too_large', message, details);
  const row =
    typeof details.row === 'number'
      ? ` (row ${details.row}${details.year !== undefined ? `, year ${details.year}` : ''})`
      : '';
  throw new AppError(400, code, `${message}${row}`, details);
}
