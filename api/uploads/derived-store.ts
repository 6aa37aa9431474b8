/**
 * Derived series, computed in the database: for each derived indicator D with source A
 * and divisor B, D = A ÷ B (per person) or A ÷ B × 100 (real from nominal), for the
 * (district, year) keys whose sources were touched. The values A and B are the staged
 * ones where an upload gives them (views of evaluate-store.ts), else the stored ones. The result, with the stored D
 * beside it, goes to the temp table `upload_derived`, which the merge applies like any
 * other change.
 */
import { clip } from './parse/values';
import type { Problem } from './problems';
import type { Sql } from '../db/connection';

export interface DerivedDef {
  id: number;
  code: string;
  derivation: 'per_person' | 'real_from_nominal' | 'ratio' | 'from_boundaries';
  /** null for from_boundaries */
  sourceId: number;
  divisorId: number;
  mustBePositive: boolean;
}

/** Where the touched keys come from: the staged upload, a revert's restore set, or everything stored. */
export type KeySource = 'staged' | 'restored' | 'all';

export async function derivedDefs(conn: Sql): Promise<DerivedDef[]> {
  const { rows } = await conn.query(
    `SELECT id, code, derivation, source_indicator_id, divisor_indicator_id, must_be_positive
       FROM indicators WHERE derivation <> 'none' ORDER BY id`,
  );
  return rows.map((r) => ({
    id: r.id,
    code: r.code,
    derivation: r.derivation,
    sourceId: r.source_indicator_id,
    divisorId: r.divisor_indicator_id,
    mustBePositive: r.must_be_positive,
  }));
}

export async function createDerivedTable(conn: Sql): Promise<void> {
  await conn.query(`CREATE TEMP TABLE IF NOT EXISTS upload_derived (
      district_id integer, indicator_id integer, year integer, value double precision,
      old_value double precision, old_upload_id integer, kind "char", line integer) ON COMMIT DROP`);
}

/** Computes the changes to D for the touched keys into upload_derived; returns how many. */
export async function deriveChanges(conn: Sql, def: DerivedDef, keys: KeySource): Promise<number> {
  if (def.derivation === 'from_boundaries') return deriveAreaChanges(conn, def, keys);
  const scale = def.derivation === 'real_from_nominal' ? 100 : 1;
  const keySql = {
    staged: `SELECT district_id, year FROM upload_eval WHERE kind = 'c' AND indicator_id IN ($1, $2)
             UNION SELECT district_id, year FROM upload_new WHERE indicator_id IN ($1, $2)`,
    restored: `SELECT DISTINCT district_id, year FROM upload_restore WHERE indicator_id IN ($1, $2)`,
    all: `SELECT district_id, year FROM observations WHERE indicator_id IN ($1, $2, $3) GROUP BY 1, 2`,
  }[keys];
  const staged = keys === 'staged';
  const on = (alias: string, param: string) =>
    `${alias}.district_id = k.district_id AND ${alias}.year = k.year AND ${alias}.indicator_id = ${param}`;
  const { rowCount } = await conn.query(
    `INSERT INTO upload_derived (district_id, indicator_id, year, value, old_value, old_upload_id, kind, line)
     WITH k AS (${keySql}),
     e AS (
       SELECT k.district_id, k.year,
              ${staged ? 'coalesce(sa.value, oa.value)' : 'oa.value'} AS a,
              ${staged ? 'coalesce(sb.value, ob.value)' : 'ob.value'} AS b,
              ${staged ? 'coalesce(sa.line, sb.line)' : 'NULL::int'} AS line,
              od.value AS old_value, od.upload_id AS old_upload_id
         FROM k
         ${staged ? `LEFT JOIN upload_staged sa ON ${on('sa', '$1')} LEFT JOIN upload_staged sb ON ${on('sb', '$2')}` : ''}
         LEFT JOIN observations oa ON ${on('oa', '$1')}
         LEFT JOIN observations ob ON ${on('ob', '$2')}
         LEFT JOIN observations od ON ${on('od', '$3')}
     ), v AS (
       SELECT e.*, CASE WHEN a IS NOT NULL AND b > 0 THEN a / b * $4::float8 END AS value FROM e
     )
     SELECT district_id, $3, year, value, old_value, old_upload_id,
            CASE WHEN old_value IS NULL THEN 'i' WHEN value IS NULL THEN 'r' ELSE 'c' END, line
       FROM v
      WHERE value IS DISTINCT FROM old_value`,
    [def.sourceId, def.divisorId, def.id, scale],
  );
  return rowCount ?? 0;
}

/** Derived values that break D's positivity rule (only possible when a source may be ≤ 0). */
export async function derivedNotPositive(
  conn: Sql,
  def: DerivedDef,
  limit: number,
): Promise<{ listed: Problem[]; total: number }> {
  if (!def.mustBePositive) return { listed: [], total: 0 };
  const { rows } = await conn.query(
    `SELECT u.line, d.code AS district, u.year, u.value, count(*) OVER () AS total
       FROM upload_derived u JOIN districts d ON d.id = u.district_id
      WHERE u.indicator_id = $1 AND u.value <= 0
      ORDER BY u.line NULLS LAST, d.code, u.year LIMIT $2`,
    [def.id, limit],
  );
  return {
    total: rows.length ? Number(rows[0].total) : 0,
    listed: rows.map((r) => ({
      line: r.line,
      column: null,
      field: null,
      code: 'derived_not_positive' as const,
      severity: 'error' as const,
      reason: `the derived ${def.code} for ${r.district} ${r.year} would be ${clip(String(r.value))}, but it must be positive`,
    })),
  };
}

/**
 * Land area from the current boundary version (api/boundaries), km², for every touched
 * (district, year) where the district has data: staged keys of any indicator, or every
 * key of a plain indicator. A revert's restore set already holds the right values, so it
 * derives nothing. A district without a boundary gets no value (a stored one is removed).
 */
async function deriveAreaChanges(conn: Sql, def: DerivedDef, keys: KeySource): Promise<number> {
  if (keys === 'restored') return 0;
  const keySql =
    keys === 'staged'
      ? `SELECT district_id, year FROM upload_eval WHERE kind = 'c' UNION SELECT district_id, year FROM upload_new`
      : `SELECT o.district_id, o.year FROM observations o JOIN indicators i ON i.id = o.indicator_id WHERE i.derivation = 'none' GROUP BY 1, 2`;
  const { rowCount } = await conn.query(
    `INSERT INTO upload_derived (district_id, indicator_id, year, value, old_value, old_upload_id, kind, line)
     WITH k AS (${keySql}),
     cur AS (SELECT b.id FROM boundary_versions b JOIN uploads u ON u.id = b.upload_id
              WHERE u.status = 'committed' ORDER BY u.version DESC LIMIT 1),
     v AS (
       SELECT k.district_id, k.year, db.area_km2 AS value, od.value AS old_value, od.upload_id AS old_upload_id
         FROM k
         LEFT JOIN district_boundaries db ON db.district_id = k.district_id AND db.version_id = (SELECT id FROM cur)
         LEFT JOIN observations od ON od.district_id = k.district_id AND od.year = k.year AND od.indicator_id = $1
     )
     SELECT district_id, $1, year, value, old_value, old_upload_id,
            CASE WHEN old_value IS NULL THEN 'i' WHEN value IS NULL THEN 'r' ELSE 'c' END, NULL::int
       FROM v
      WHERE value IS DISTINCT FROM old_value`,
    [def.id],
  );
  return rowCount ?? 0;
}
