/**
 * A district's data tab: every indicator's yearly series over the district's whole span,
 * gap years present as nulls (and listed), each value with the upload that wrote it;
 * current, or as of an earlier data version. Also the same as a wide CSV that can be
 * uploaded again.
 */
import type { Knex } from 'knex';
import { districtByCode } from '../districts/service';
import { csvLine } from '../http/csv-escape';
import { NotFoundError } from '../http/errors';
import * as store from './store';

export interface IndicatorSeries {
  code: string;
  name: string;
  unit: string;
  mustBePositive: boolean;
  derived: boolean;
  firstYear: number;
  lastYear: number;
  values: number;
  /** Years between the indicator's first and last year without a value. */
  gaps: number[];
  series: { year: number; value: number | null; uploadId: number | null }[];
}

export interface DistrictObservations {
  district: { code: string; name: string };
  /** The data version these values are from. */
  dataVersion: number;
  years: { first: number; last: number } | null;
  indicators: IndicatorSeries[];
}

export async function districtObservations(
  db: Knex,
  code: string,
  q: { indicators?: string[]; asOf?: number },
): Promise<DistrictObservations> {
  const district = await districtByCode(db, code);
  const latest = await store.latestVersion(db);
  if (q.asOf !== undefined && q.asOf > latest)
    throw new NotFoundError(`No data version ${q.asOf}: the latest is ${latest}.`, { asOf: q.asOf, latest });
  const asOf = q.asOf === undefined || q.asOf === latest ? null : q.asOf;
  const [rows, catalogue] = await Promise.all([store.seriesOf(db, district.id, asOf), store.catalogue(db)]);
  const wanted = q.indicators ? new Set(q.indicators) : null;
  if (wanted) {
    const unknown = [...wanted].filter((c) => !catalogue.some((i) => i.code === c));
    if (unknown.length) throw new NotFoundError(`No indicator ${unknown.join(', ')}`, { indicators: unknown });
  }
  const byIndicator = new Map<number, store.SeriesRow[]>();
  for (const r of rows) {
    const list = byIndicator.get(r.indicatorId) ?? [];
    list.push(r);
    byIndicator.set(r.indicatorId, list);
  }
  const years = rows.length
    ? { first: Math.min(...rows.map((r) => r.year)), last: Math.max(...rows.map((r) => r.year)) }
    : null;
  const indicators: IndicatorSeries[] = [];
  for (const ind of catalogue) {
    const list = byIndicator.get(ind.id);
    if (!list || (wanted && !wanted.has(ind.code))) continue;
    const at = new Map(list.map((r) => [r.year, r]));
    const firstYear = list[0].year;
    const lastYear = list[list.length - 1].year;
    const series: IndicatorSeries['series'] = [];
    const gaps: number[] = [];
    for (let y = years!.first; y <= years!.last; y++) {
      const r = at.get(y);
      series.push({ year: y, value: r ? r.value : null, uploadId: r ? r.uploadId : null });
      if (!r && y > firstYear && y < lastYear) gaps.push(y);
    }
    indicators.push({
      code: ind.code,
      name: ind.name,
      unit: ind.unit,
      mustBePositive: ind.mustBePositive,
      derived: ind.derivation !== 'none',
      firstYear,
      lastYear,
      values: list.length,
      gaps,
      series,
    });
  }
  return { district: { code: district.code, name: district.name }, dataVersion: asOf ?? latest, years, indicators };
}

/** The same values as a wide CSV (district_code, district_name, year, one column per uploaded indicator). */
export async function districtObservationsCsv(db: Knex, code: string, q: { asOf?: number }): Promise<string> {
  const data = await districtObservations(db, code, q);
  const uploaded = data.indicators.filter((i) => !i.derived);
  const lines = [csvLine(['district_code', 'district_name', 'year', ...uploaded.map((i) => i.code)])];
  if (data.years) {
    for (let k = 0; k <= data.years.last - data.years.first; k++) {
      const cells = uploaded.map((i) => i.series[k].value);
      if (cells.every((c) => c === null)) continue;
      lines.push(csvLine([data.district.code, data.district.name, data.years.first + k, ...cells]));
    }
  }
  return `${lines.join('\r\n')}\r\n`;
}
