/** The uploads table: rows in, camelCased records out. */
import type { Knex } from 'knex';
import type { Problem } from './problems';
import type { Sql } from '../db/connection';

export type UploadKind = 'file' | 'seed' | 'revert' | 'derivation' | 'boundaries';
export type UploadStatus = 'previewed' | 'committed' | 'reverted' | 'failed';

export interface UploadCounts {
  rowsRead: number;
  values: number;
  insert: number;
  change: number;
  unchanged: number;
  remove: number;
  derived: number;
  errors: number;
  warnings: number;
}

export interface UploadRecord {
  id: number;
  kind: UploadKind;
  status: UploadStatus;
  fileName: string | null;
  checksum: string | null;
  byteSize: number | null;
  format: 'long' | 'wide' | null;
  options: Record<string, unknown>;
  userId: number | null;
  userEmail: string | null;
  note: string | null;
  createdAt: Date;
  committedAt: Date | null;
  version: number | null;
  revertsUploadId: number | null;
  revertedByUploadId: number | null;
  revertedAt: Date | null;
  counts: UploadCounts;
  preview: unknown;
  problems: Problem[] | null;
  stagingTable: string | null;
}

export interface NewUpload {
  kind: UploadKind;
  status: UploadStatus;
  fileName?: string | null;
  checksum?: string | null;
  byteSize?: number | null;
  format?: 'long' | 'wide' | null;
  options?: Record<string, unknown>;
  userId?: number | null;
  userEmail?: string | null;
  note?: string | null;
  version?: number | null;
  revertsUploadId?: number | null;
  counts?: Partial<UploadCounts>;
  preview?: unknown;
  problems?: Problem[] | null;
  stagingTable?: string | null;
}

const COLUMNS = `id, kind, status, file_name, checksum, byte_size, format, options, user_id, user_email, note,
  created_at, committed_at, version, reverts_upload_id, reverted_by_upload_id, reverted_at,
  rows_read, value_count, insert_count, change_count, unchanged_count, remove_count, derived_count,
  error_count, warning_count, staging_table`;

function toRecord(r: Record<string, any>, withDetail: boolean): UploadRecord {
  return {
    id: r.id,
    kind: r.kind,
    status: r.status,
    fileName: r.file_name,
    checksum: r.checksum,
    byteSize: r.byte_size === null ? null : Number(r.byte_size),
    format: r.format,
    options: r.options ?? {},
    userId: r.user_id,
    userEmail: r.user_email,
    note: r.note,
    createdAt: r.created_at,
    committedAt: r.committed_at,
    version: r.version,
    revertsUploadId: r.reverts_upload_id,
    revertedByUploadId: r.reverted_by_upload_id,
    revertedAt: r.reverted_at,
    counts: {
      rowsRead: r.rows_read,
      values: r.value_count,
      insert: r.insert_count,
      change: r.change_count,
      unchanged: r.unchanged_count,
      remove: r.remove_count,
      derived: r.derived_count,
      errors: r.error_count,
      warnings: r.warning_count,
    },
    preview: withDetail ? (r.preview ?? null) : undefined,
    problems: withDetail ? (r.problems ?? null) : null,
    stagingTable: r.staging_table,
  };
}

function toRow(u: NewUpload): Record<string, unknown> {
  const c = u.counts ?? {};
  return {
    kind: u.kind,
    status: u.status,
    file_name: u.fileName ?? null,
    checksum: u.checksum ?? null,
    byte_size: u.byteSize ?? null,
    format: u.format ?? null,
    options: JSON.stringify(u.options ?? {}),
    user_id: u.userId ?? null,
    user_email: u.userEmail ?? null,
    note: u.note ?? null,
    version: u.version ?? null,
    reverts_upload_id: u.revertsUploadId ?? null,
    rows_read: c.rowsRead ?? 0,
    value_count: c.values ?? 0,
    insert_count: c.insert ?? 0,
    change_count: c.change ?? 0,
    unchanged_count: c.unchanged ?? 0,
    remove_count: c.remove ?? 0,
    derived_count: c.derived ?? 0,
    error_count: c.errors ?? 0,
    warning_count: c.warnings ?? 0,
    preview: u.preview === undefined ? null : JSON.stringify(u.preview),
    problems: u.problems == null ? null : JSON.stringify(u.problems),
    staging_table: u.stagingTable ?? null,
  };
}

/** Inserts an upload row on a raw connection (inside the pipeline's transaction). */
export async function insertUpload(conn: Sql, u: NewUpload): Promise<UploadRecord> {
  const row = toRow(u);
  const keys = Object.keys(row);
  const { rows } = await conn.query(
    `INSERT INTO uploads (${keys.join(', ')}, committed_at) VALUES (${keys.map((_, i) => `$${i + 1}`).join(', ')},
       CASE WHEN $${keys.indexOf('version') + 1}::int IS NULL THEN NULL ELSE now() END)
     RETURNING ${COLUMNS}`,
    keys.map((k) => row[k]),
  );
  return toRecord(rows[0], false);
}

/** The next data version; call it holding the observations lock (sql.ts), so versions are dense and ordered. */
export async function nextVersion(conn: Sql): Promise<number> {
  const { rows } = await conn.query(`SELECT coalesce(max(version), 0) + 1 AS v FROM uploads`);
  return rows[0].v;
}

/** Marks a previewed upload committed (same row), with the counts of what it wrote. */
export async function markCommitted(
  conn: Sql,
  id: number,
  version: number,
  counts: Partial<UploadCounts>,
  preview: unknown,
  problems: Problem[],
): Promise<UploadRecord> {
  const { rows } = await conn.query(
    `UPDATE uploads SET status = 'committed', version = $2, committed_at = now(), staging_table = NULL,
            insert_count = $3, change_count = $4, unchanged_count = $5, remove_count = $6, derived_count = $7,
            error_count = $8, warning_count = $9, preview = $10, problems = $11
      WHERE id = $1 RETURNING ${COLUMNS}`,
    [
      id,
      version,
      counts.insert ?? 0,
      counts.change ?? 0,
      counts.unchanged ?? 0,
      counts.remove ?? 0,
      counts.derived ?? 0,
      counts.errors ?? 0,
      counts.warnings ?? 0,
      JSON.stringify(preview),
      JSON.stringify(problems),
    ],
  );
  return toRecord(rows[0], false);
}

export async function markFailed(
  conn: Sql,
  id: number,
  errors: number,
  warnings: number,
  problems: Problem[],
): Promise<void> {
  await conn.query(
    `UPDATE uploads SET status = 'failed', staging_table = NULL, error_count = $2, warning_count = $3, problems = $4 WHERE id = $1`,
    [id, errors, warnings, JSON.stringify(problems)],
  );
}

export async function markReverted(conn: Sql, id: number, byUploadId: number): Promise<void> {
  await conn.query(
    `UPDATE uploads SET status = 'reverted', reverted_by_upload_id = $2, reverted_at = now() WHERE id = $1`,
    [id, byUploadId],
  );
}

export async function findUpload(db: Knex | Sql, id: number, { forUpdate = false } = {}): Promise<UploadRecord | null> {
  const sql = `SELECT ${COLUMNS}, preview, problems FROM uploads WHERE id = $1${forUpdate ? ' FOR UPDATE' : ''}`;
  const rows = isKnex(db) ? (await db.raw(sql.replace('$1', '?'), [id])).rows : (await db.query(sql, [id])).rows;
  return rows.length ? toRecord(rows[0], true) : null;
}

export async function findCommittedByChecksum(conn: Sql, checksum: string): Promise<UploadRecord | null> {
  const { rows } = await conn.query(
    `SELECT ${COLUMNS} FROM uploads WHERE kind = 'file' AND status = 'committed' AND checksum = $1`,
    [checksum],
  );
  return rows.length ? toRecord(rows[0], false) : null;
}

export async function listUploads(
  db: Knex,
  q: { limit: number; before?: number; status?: UploadStatus },
): Promise<UploadRecord[]> {
  const rows = await db('uploads')
    .select(db.raw(COLUMNS))
    .modify((b) => {
      if (q.before) b.where('id', '<', q.before);
      if (q.status) b.where('status', q.status);
    })
    .orderBy('id', 'desc')
    .limit(q.limit);
  return rows.map((r: Record<string, unknown>) => toRecord(r, false));
}

/** The last change set applied: the data version (its number and upload). */
export async function latestVersion(
  db: Knex | Sql,
): Promise<{ version: number; uploadId: number; committedAt: Date } | null> {
  const sql = `SELECT version, id, committed_at FROM uploads WHERE version IS NOT NULL ORDER BY version DESC LIMIT 1`;
  const rows = isKnex(db) ? (await db.raw(sql)).rows : (await db.query(sql)).rows;
  return rows.length ? { version: rows[0].version, uploadId: rows[0].id, committedAt: rows[0].committed_at } : null;
}

function isKnex(db: Knex | Sql): db is Knex {
  return typeof (db as Knex).raw === 'function';
}

/** Every stored district code (the reader counts the codes of a file that are not among them). */
export async function districtCodes(conn: Sql): Promise<Set<string>> {
  const { rows } = await conn.query<{ code: string }>(`SELECT code FROM districts`);
  return new Set(rows.map((r) => r.code));
}

/** The indicator catalogue as the upload reader needs it (code → id, derivation, positivity). */
export async function readerCatalogue(
  conn: Sql,
): Promise<{ id: number; code: string; derivation: unknown; mustBePositive: boolean }[]> {
  const { rows } = await conn.query(`SELECT id, code, derivation, must_be_positive FROM indicators ORDER BY id`);
  return rows.map((r: { id: number; code: string; derivation: unknown; must_be_positive: boolean }) => ({
    id: r.id,
    code: r.code,
    derivation: r.derivation,
    mustBePositive: r.must_be_positive,
  }));
}

/** Codes (and names, when asked) of these districts, for a preview's lists. */
export async function districtsById(conn: Sql, ids: number[]): Promise<{ id: number; code: string; name: string }[]> {
  const { rows } = await conn.query(`SELECT id, code, name FROM districts WHERE id = ANY($1)`, [ids]);
  return rows;
}

/** Every indicator's id, code and name, for a preview's words. */
export async function indicatorNames(conn: Sql): Promise<{ id: number; code: string; name: string }[]> {
  const { rows } = await conn.query(`SELECT id, code, name FROM indicators`);
  return rows;
}
