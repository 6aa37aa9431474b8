/** Indicator catalogue SQL. Writes take a raw connection so they share the transaction of a recomputation. */
import type { Knex } from 'knex';
import type { Sql } from '../db/connection';

export interface IndicatorRow {
  id: number;
  code: string;
  name: string;
  unit: string;
  description: string;
  mustBePositive: boolean;
  /** who publishes the series, and under which terms (null: not recorded) */
  source: string | null;
  licence: string | null;
  derivation: 'none' | 'per_person' | 'real_from_nominal' | 'from_boundaries' | 'ratio';
  sourceId: number | null;
  divisorId: number | null;
  sourceCode: string | null;
  divisorCode: string | null;
  baseYear: number | null;
  stats: { districts: number; values: number; firstYear: number | null; lastYear: number | null };
}

const SELECT = `
  SELECT i.id, i.code, i.name, i.unit, i.description, i.must_be_positive, i.source, i.licence, i.derivation, i.base_year,
         i.source_indicator_id, i.divisor_indicator_id,
         s.code AS source_code, v.code AS divisor_code,
         coalesce(st.districts, 0)::int AS districts, coalesce(st.n, 0)::int AS n, st.first_year, st.last_year
    FROM indicators i
    LEFT JOIN indicators s ON s.id = i.source_indicator_id
    LEFT JOIN indicators v ON v.id = i.divisor_indicator_id
    LEFT JOIN LATERAL (
      SELECT count(DISTINCT o.district_id) AS districts, count(*) AS n, min(o.year) AS first_year, max(o.year) AS last_year
        FROM observations o WHERE o.indicator_id = i.id
    ) st ON true`;

/** One row of SELECT above, as pg returns it (integer columns come back as numbers). */
interface IndicatorDbRow {
  id: number;
  code: string;
  name: string;
  unit: string;
  description: string;
  must_be_positive: boolean;
  source: string | null;
  licence: string | null;
  derivation: IndicatorRow['derivation'];
  source_indicator_id: number | null;
  divisor_indicator_id: number | null;
  source_code: string | null;
  divisor_code: string | null;
  base_year: number | null;
  districts: number;
  n: number;
  first_year: number | null;
  last_year: number | null;
}

function toRow(r: IndicatorDbRow): IndicatorRow {
  return {
    id: r.id,
    code: r.code,
    name: r.name,
    unit: r.unit,
    description: r.description,
    mustBePositive: r.must_be_positive,
    source: r.source,
    licence: r.licence,
    derivation: r.derivation,
    sourceId: r.source_indicator_id,
    divisorId: r.divisor_indicator_id,
    sourceCode: r.source_code,
    divisorCode: r.divisor_code,
    baseYear: r.base_year,
    stats: { districts: r.districts, values: r.n, firstYear: r.first_year, lastYear: r.last_year },
  };
}

export async function listIndicators(db: Knex): Promise<IndicatorRow[]> {
  const { rows } = await db.raw(`${SELECT} ORDER BY i.id`);
  return rows.map(toRow);
}

export async function findIndicator(conn: Sql, code: string, { forUpdate = false } = {}): Promise<IndicatorRow | null> {
  if (forUpdate) await conn.query(`SELECT 1 FROM indicators WHERE code = $1 FOR UPDATE`, [code]);
  const { rows } = await conn.query(`${SELECT} WHERE i.code = $1`, [code]);
  return rows.length ? toRow(rows[0]) : null;
}

export interface IndicatorWrite {
  name: string;
  unit: string;
  description: string;
  mustBePositive: boolean;
  source: string | null;
  licence: string | null;
  derivation: 'none' | 'per_person' | 'real_from_nominal' | 'from_boundaries' | 'ratio';
  sourceId: number | null;
  divisorId: number | null;
  baseYear: number | null;
}

export async function insertIndicator(conn: Sql, code: string, w: IndicatorWrite): Promise<void> {
  await conn.query(
    `INSERT INTO indicators (code, name, unit, description, must_be_positive, derivation, source_indicator_id, divisor_indicator_id, base_year, source, licence)
     VALUES ($1, $2, $3, $4, $5, $6, $7, $8, $9, $10, $11)`,
    [
      code,
      w.name,
      w.unit,
      w.description,
      w.mustBePositive,
      w.derivation,
      w.sourceId,
      w.divisorId,
      w.baseYear,
      w.source,
      w.licence,
    ],
  );
}

export async function updateIndicator(conn: Sql, id: number, w: IndicatorWrite): Promise<void> {
  await conn.query(
    `UPDATE indicators SET name = $2, unit = $3, description = $4, must_be_positive = $5, derivation = $6,
            source_indicator_id = $7, divisor_indicator_id = $8, base_year = $9, source = $10, licence = $11,
            updated_at = now()
      WHERE id = $1`,
    [
      id,
      w.name,
      w.unit,
      w.description,
      w.mustBePositive,
      w.derivation,
      w.sourceId,
      w.divisorId,
      w.baseYear,
      w.source,
      w.licence,
    ],
  );
}

/** Values ≤ 0 stored for an indicator (a positive rule cannot be switched on over them). */
export async function nonPositiveValues(
  conn: Sql,
  id: number,
): Promise<{ count: number; sample: { district: string; year: number; value: number }[] }> {
  const { rows } = await conn.query(
    `SELECT d.code AS district, o.year, o.value, count(*) OVER () AS total
       FROM observations o JOIN districts d ON d.id = o.district_id
      WHERE o.indicator_id = $1 AND o.value <= 0 ORDER BY d.code, o.year LIMIT 5`,
    [id],
  );
  return {
    count: rows.length ? Number(rows[0].total) : 0,
    sample: rows.map((r) => ({ district: r.district, year: r.year, value: r.value })),
  };
}

/** Derived indicators that use this one as a source or divisor. */
export async function dependents(conn: Sql, id: number): Promise<string[]> {
  const { rows } = await conn.query(
    `SELECT code FROM indicators WHERE source_indicator_id = $1 OR divisor_indicator_id = $1 ORDER BY code`,
    [id],
  );
  return rows.map((r) => r.code);
}

/** Which of these codes the catalogue has (the light check a spec or a what-if fit needs). */
export async function existingCodes(db: Knex, codes: string[]): Promise<string[]> {
  const rows: { code: string }[] = await db('indicators').whereIn('code', codes).select('code');
  return rows.map((r) => r.code);
}
