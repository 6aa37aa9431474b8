/**
 * Reverting a change set and rebuilding earlier data versions, from observation_history
 * (superseded values) and observations (current values, each with its upload).
 *
 * The rebuild rule lives in the migration's observations_as_of(v): it holds because
 * every write except a first write into an empty cell leaves a history row.
 */
import type { Sql } from '../db/connection';

export interface RevertConflict {
  district: string;
  indicator: string;
  year: number;
  heldBy: number | null;
}

/**
 * Cells the upload wrote that now hold something else (a later upload changed them):
 * reverting would undo that later work too, so it is refused.
 */
export async function revertConflicts(
  conn: Sql,
  uploadId: number,
  version: number,
  limit = 20,
): Promise<{ listed: RevertConflict[]; total: number }> {
  const { rows } = await conn.query(
    `WITH mine AS (
       SELECT h.district_id, h.indicator_id, h.year, h.value IS NULL AS removed
         FROM observation_history h WHERE h.version = $2 AND h.upload_id = $1
       UNION ALL
       SELECT h.district_id, h.indicator_id, h.year, false
         FROM observation_history h WHERE h.version > $2 AND h.previous_upload_id = $1 AND h.upload_id <> $1
     ), bad AS (
       SELECT DISTINCT m.district_id, m.indicator_id, m.year, o.upload_id AS held_by
         FROM mine m LEFT JOIN observations o
           ON o.district_id = m.district_id AND o.indicator_id = m.indicator_id AND o.year = m.year
        WHERE CASE WHEN m.removed THEN o.year IS NOT NULL ELSE o.upload_id IS DISTINCT FROM $1 END
     )
     SELECT d.code AS district, i.code AS indicator, b.year, b.held_by, count(*) OVER () AS total
       FROM bad b JOIN districts d ON d.id = b.district_id JOIN indicators i ON i.id = b.indicator_id
      ORDER BY d.code, i.code, b.year LIMIT $3`,
    [uploadId, version, limit],
  );
  return {
    total: rows.length ? Number(rows[0].total) : 0,
    listed: rows.map((r) => ({ district: r.district, indicator: r.indicator, year: r.year, heldBy: r.held_by })),
  };
}

/**
 * The restore set of an upload into temp table upload_restore: the cells it changed or
 * removed go back to the value they held before (from its history rows), the cells it
 * filled for the first time are removed. Same columns as every change table, plus the
 * upload whose value a cell holds again.
 */
export async function buildRestoreSet(conn: Sql, uploadId: number, version: number): Promise<number> {
  await conn.query(`CREATE TEMP TABLE upload_restore ON COMMIT DROP AS
    SELECT h.district_id, h.indicator_id, h.year,
           h.previous_value AS value, h.previous_upload_id AS value_upload_id,
           o.value AS old_value, o.upload_id AS old_upload_id,
           (CASE WHEN h.previous_value IS NULL THEN 'r' WHEN o.year IS NULL THEN 'i' ELSE 'c' END)::"char" AS kind
      FROM observation_history h
      LEFT JOIN observations o ON o.district_id = h.district_id AND o.indicator_id = h.indicator_id AND o.year = h.year
     WHERE h.version = ${Number(version)} AND h.upload_id = ${Number(uploadId)}
    UNION ALL
    SELECT o.district_id, o.indicator_id, o.year, NULL, NULL, o.value, o.upload_id, 'r'::"char"
      FROM observations o
     WHERE o.upload_id = ${Number(uploadId)}
       AND NOT EXISTS (SELECT 1 FROM observation_history h
                        WHERE h.version = ${Number(version)} AND h.upload_id = ${Number(uploadId)}
                          AND h.district_id = o.district_id AND h.indicator_id = o.indicator_id AND h.year = o.year)`);
  // A cell that was removed and is still empty needs nothing.
  await conn.query(`DELETE FROM upload_restore WHERE kind = 'r' AND old_value IS NULL`);
  const { rows } = await conn.query(`SELECT count(*)::int AS n FROM upload_restore`);
  return rows[0].n;
}

/** The observation set of data version v, as a FROM item (migration: observations_as_of). */
export function observationsAsOfSql(v: number): string {
  const version = Number(v);
  if (!Number.isInteger(version) || version < 0) throw new Error(`bad data version ${v}`);
  return `observations_as_of(${version})`;
}

/**
 * A hash of an observation set that does not depend on row ids or database: md5 over
 * "district|indicator|year|value" lines in code order, values in PostgreSQL's shortest
 * exact text form.
 */
export async function rowsHash(conn: Sql, source = 'observations'): Promise<{ hash: string; rows: number }> {
  await conn.query(`SET LOCAL extra_float_digits = 1`); // the shortest exact form (call inside a transaction)
  const { rows } = await conn.query(
    `SELECT md5(coalesce(string_agg(d.code || '|' || i.code || '|' || o.year || '|' || o.value::text, E'\\n'
                 ORDER BY d.code COLLATE "C", i.code COLLATE "C", o.year), '')) AS hash, count(*)::int AS n
       FROM ${source} o JOIN districts d ON d.id = o.district_id JOIN indicators i ON i.id = o.indicator_id`,
  );
  return { hash: rows[0].hash, rows: rows[0].n };
}
