/**
 * POST /api/estimate: fitCurve over HTTP. Rows come in the body, or are read for one
 * district from the current observations (emissions, driver and controls by indicator
 * code). Bad input is a 400 naming the row and the reason.
 */
import type { Knex } from 'knex';
import { EstimationInputError, fitCurve, type CurveRow, type ModelSpecInput } from '../estimation';
import { AppError, NotFoundError } from '../http/errors';
import { currentDataVersion, loadSeries } from '../runs/data-store';

export interface DistrictSource {
  district: string;
  emissions: string;
  driver: string;
  controls: string[];
  firstYear?: number;
  lastYear?: number;
}

export async function rowsForDistrict(db: Knex, src: DistrictSource): Promise<{ rows: CurveRow[]; droppedYears: number[]; dataVersion: number }> {
  const d = await db('districts').where({ code: src.district }).first('id');
  if (!d) throw new NotFoundError(`No district with code ${src.district}`, { code: src.district });
  const known = new Set((await db('indicators').whereIn('code', [src.emissions, src.driver, ...src.controls]).select('code')).map((r: { code: string }) => r.code));
  const unknown = [src.emissions, src.driver, ...src.controls].filter((c) => !known.has(c));
  if (unknown.length) throw new AppError(400, 'unknown_indicator', `Unknown indicator: ${unknown.join(', ')}`, { unknown });
  const version = await currentDataVersion(db);
  const sel = { emissions: src.emissions, driver: src.driver, controls: src.controls, firstYear: src.firstYear ?? null, lastYear: src.lastYear ?? null };
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

export function estimate(rows: CurveRow[], model: ModelSpecInput) {
  try {
    return fitCurve(rows, model);
  } catch (err) {
    if (err instanceof EstimationInputError) {
      const row = typeof err.details.row === 'number' ? ` (row ${err.details.row}${err.details.year !== undefined ? `, year ${err.details.year}` : ''})` : '';
      throw new AppError(400, err.code, `${err.message}${row}`, err.details);
    }
    throw err;
  }
}
