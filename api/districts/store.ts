/** The only place district and observation SQL lives; rows come back camelCased. */
import type { Knex } from 'knex';

export interface DistrictSummaryRow {
  id: number;
  code: string;
  name: string;
  firstYear: number | null;
  lastYear: number | null;
  nYears: number;
  latest: Record<string, number> | null;
}

/** A district's identity: its id (for joins), code and name. */
export interface DistrictRef {
  id: number;
  code: string;
  name: string;
}

export interface ObservationRow {
  year: number;
  indicator: string;
  value: number;
}

export interface IndicatorRow {
  code: string;
  name: string;
  unit: string;
}

const summarySql = `
  WITH spans AS (
    SELECT district_id, min(year) AS first_year, max(year) AS last_year, count(DISTINCT year) AS n_years
    FROM observations GROUP BY district_id
  )
  SELECT d.id, d.code, d.name, s.first_year, s.last_year, coalesce(s.n_years, 0) AS n_years,
         (SELECT jsonb_object_agg(i.code, o.value)
            FROM observations o JOIN indicators i ON i.id = o.indicator_id
           WHERE o.district_id = d.id AND o.year = s.last_year) AS latest
  FROM districts d LEFT JOIN spans s ON s.district_id = d.id`;

function toSummary(r: Record<string, unknown>): DistrictSummaryRow {
  return {
    id: Number(r.id),
    code: String(r.code),
    name: String(r.name),
    firstYear: r.first_year === null ? null : Number(r.first_year),
    lastYear: r.last_year === null ? null : Number(r.last_year),
    nYears: Number(r.n_years),
    latest: (r.latest as Record<string, number> | null) ?? null,
  };
}

export async function listDistrictSummaries(db: Knex): Promise<DistrictSummaryRow[]> {
  const { rows } = await db.raw(`${summarySql} ORDER BY d.name, d.code`);
  return rows.map(toSummary);
}

export async function findDistrictSummary(db: Knex, code: string): Promise<DistrictSummaryRow | null> {
  const { rows } = await db.raw(`${summarySql} WHERE d.code = ?`, [code]);
  return rows.length ? toSummary(rows[0]) : null;
}

export async function listObservations(db: Knex, districtId: number): Promise<ObservationRow[]> {
  const rows = await db('observations as o')
    .join('indicators as i', 'i.id', 'o.indicator_id')
    .where('o.district_id', districtId)
    .orderBy([{ column: 'o.year' }, { column: 'i.code' }])
    .select('o.year', 'i.code as indicator', 'o.value');
  return rows.map((r: { year: number; indicator: string; value: number }) => ({
    year: Number(r.year),
    indicator: r.indicator,
    value: Number(r.value),
  }));
}

export async function listIndicators(db: Knex, codes: string[]): Promise<IndicatorRow[]> {
  return db('indicators').whereIn('code', codes).orderBy('id').select('code', 'name', 'unit');
}

export async function findDistrictByCode(db: Knex, code: string): Promise<DistrictRef | null> {
  const r = await db('districts').where({ code }).first('id', 'code', 'name');
  return r ? { id: Number(r.id), code: String(r.code), name: String(r.name) } : null;
}

/** The districts among `codes` that exist (any order). */
export async function findDistrictsByCodes(db: Knex, codes: string[]): Promise<DistrictRef[]> {
  if (!codes.length) return [];
  const rows = await db('districts').whereIn('code', codes).select('id', 'code', 'name');
  return rows.map((r: Record<string, unknown>) => ({ id: Number(r.id), code: String(r.code), name: String(r.name) }));
}

/** Every district's code and name, by name. */
export async function listDistrictNames(db: Knex): Promise<{ code: string; name: string }[]> {
  return db('districts').orderBy('name').select('code', 'name');
}
