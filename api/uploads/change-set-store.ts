/**
 * SQL of the change sets that do not come from a file (reverts, recomputed derived
 * series) and of the data-version view: counts of the staged kinds, the counts written
 * back on the change set's upload row, and the upload and boundary version in force at a
 * data version. Runs on the bulk pipeline's connection (api/db/connection.ts).
 */
import type { Sql } from '../db/connection';

export type StagedCounts = (kind: string) => number;

/** Rows of a staging table ('upload_restore' or 'upload_derived') per change kind. */
export async function stagedCounts(conn: Sql, table: 'upload_restore' | 'upload_derived'): Promise<StagedCounts> {
  const { rows } = await conn.query(`SELECT kind, count(*)::int AS n FROM ${table} GROUP BY kind`);
  return (k: string) => rows.find((r: { kind: string; n: number }) => r.kind === k)?.n ?? 0;
}

/** Indicators whose values a revert restores (their derived series must follow). */
export async function restoredIndicatorIds(conn: Sql): Promise<Set<number>> {
  const { rows } = await conn.query(`SELECT DISTINCT indicator_id FROM upload_restore`);
  return new Set(rows.map((r: { indicator_id: number }) => r.indicator_id));
}

export async function truncateDerived(conn: Sql): Promise<void> {
  await conn.query(`TRUNCATE upload_derived`);
}

export async function deleteUpload(conn: Sql, id: number): Promise<void> {
  await conn.query(`DELETE FROM uploads WHERE id = $1`, [id]);
}

export async function writeCounts(
  conn: Sql,
  id: number,
  c: { values: number; inserted: number; changed: number; removed: number; derived: number },
): Promise<void> {
  await conn.query(
    `UPDATE uploads SET value_count = $2, insert_count = $3, change_count = $4, remove_count = $5, derived_count = $6 WHERE id = $1`,
    [id, c.values, c.inserted, c.changed, c.removed, c.derived],
  );
}

/** A read-only snapshot, so a version number and its hash describe the same rows. */
export async function readOnlySnapshot(conn: Sql): Promise<void> {
  await conn.query('SET TRANSACTION ISOLATION LEVEL REPEATABLE READ READ ONLY');
}

/** The upload that produced data version v. */
export async function uploadAtVersion(
  conn: Sql,
  v: number,
): Promise<{ id: number; committedAt: string | null } | null> {
  const { rows } = await conn.query(`SELECT id, committed_at FROM uploads WHERE version = $1`, [v]);
  const r = rows[0];
  return r ? { id: r.id, committedAt: r.committed_at ? new Date(r.committed_at).toISOString() : null } : null;
}

/** The boundary version in force at data version v (null: none loaded then). */
export async function boundaryVersionAt(conn: Sql, v: number): Promise<number | null> {
  const { rows } = await conn.query(
    `SELECT b.id FROM boundary_versions b JOIN uploads u ON u.id = b.upload_id LEFT JOIN uploads r ON r.id = u.reverted_by_upload_id
      WHERE u.version <= $1 AND (r.version IS NULL OR r.version > $1) ORDER BY u.version DESC LIMIT 1`,
    [v],
  );
  return rows[0]?.id ?? null;
}
