/**
 * Staging: the parsed rows of one upload in an unlogged table of its own, filled by COPY,
 * plus the districts the file names. Kept after a preview so the analyst can commit it
 * later without sending the file again; dropped on commit, on failure and after a day.
 */
import { randomBytes } from 'node:crypto';
import { from as copyFrom } from 'pg-copy-streams';
import type { PoolClient } from 'pg';
import type { Writable } from 'node:stream';
import type { DistrictSeen } from './parse/upload-reader';
import { ident, type Sql } from '../db/connection';

export const STAGING_SCHEMA = 'upload_staging';
/** Previews keep their staged rows this long. */
export const STAGING_TTL_HOURS = 24;

export interface StagingNames {
  rows: string;
  districts: string;
}

export function newStagingName(now = new Date()): string {
  return `s_${Math.floor(now.getTime() / 1000)}_${randomBytes(6).toString('hex')}`;
}

export function stagingTables(name: string): StagingNames {
  return { rows: `${STAGING_SCHEMA}.${ident(name)}`, districts: `${STAGING_SCHEMA}.${ident(`${name}_d`)}` };
}

export async function createStaging(conn: Sql, name: string): Promise<StagingNames> {
  const t = stagingTables(name);
  await conn.query(`CREATE UNLOGGED TABLE ${t.rows} (
    line integer NOT NULL, col integer NOT NULL, district text NOT NULL,
    indicator_id integer NOT NULL, year integer NOT NULL, value double precision NOT NULL)`);
  await conn.query(`CREATE UNLOGGED TABLE ${t.districts} (
    code text PRIMARY KEY, first_line integer NOT NULL, rows integer NOT NULL, name text, name_line integer,
    name_refused boolean NOT NULL)`);
  return t;
}

/** A writable stream of COPY text rows into the staging rows table. */
export function copyRowsStream(conn: PoolClient, t: StagingNames): Writable {
  return conn.query(copyFrom(`COPY ${t.rows} (line, col, district, indicator_id, year, value) FROM STDIN`));
}

export async function saveDistrictsSeen(conn: Sql, t: StagingNames, districts: DistrictSeen[]): Promise<void> {
  if (districts.length === 0) return;
  await conn.query(
    `INSERT INTO ${t.districts} (code, first_line, rows, name, name_line, name_refused)
     SELECT * FROM unnest($1::text[], $2::int[], $3::int[], $4::text[], $5::int[], $6::boolean[])`,
    [
      districts.map((d) => d.code),
      districts.map((d) => d.firstLine),
      districts.map((d) => d.rows),
      districts.map((d) => d.name),
      districts.map((d) => d.nameLine),
      districts.map((d) => d.nameRefused),
    ],
  );
}

/** The line where each (district, indicator, year) first appears among the staged rows. */
export async function firstLines(
  conn: Sql,
  t: StagingNames,
  keys: { district: string; indicatorId: number; year: number }[],
): Promise<Map<string, number>> {
  const out = new Map<string, number>();
  if (keys.length === 0) return out;
  const { rows } = await conn.query<{ district: string; indicator_id: number; year: number; line: number }>(
    `SELECT s.district, s.indicator_id, s.year, min(s.line) AS line
       FROM ${t.rows} s
       JOIN unnest($1::text[], $2::int[], $3::int[]) AS k(district, indicator_id, year)
         ON (s.district, s.indicator_id, s.year) = (k.district, k.indicator_id, k.year)
      GROUP BY 1, 2, 3`,
    [keys.map((k) => k.district), keys.map((k) => k.indicatorId), keys.map((k) => k.year)],
  );
  for (const r of rows) out.set(`${r.district}|${r.indicator_id}|${r.year}`, r.line);
  return out;
}

export async function dropStaging(conn: Sql, name: string): Promise<void> {
  const t = stagingTables(name);
  await conn.query(`DROP TABLE IF EXISTS ${t.rows}, ${t.districts}`);
}

/**
 * Drops staging tables that no preview needs any more: those of uploads no longer
 * previewed, those older than the TTL, and leftovers of a request that died half-way.
 * Returns the names of the previews that expired.
 */
export async function pruneStaging(conn: Sql, now = new Date()): Promise<string[]> {
  const cutoff = Math.floor(now.getTime() / 1000) - STAGING_TTL_HOURS * 3600;
  const { rows } = await conn.query<{ name: string; live: boolean }>(
    `SELECT c.relname AS name,
            EXISTS (SELECT 1 FROM uploads u WHERE u.staging_table = c.relname AND u.status = 'previewed') AS live
       FROM pg_class c JOIN pg_namespace n ON n.oid = c.relnamespace
      WHERE n.nspname = $1 AND c.relkind = 'r' AND c.relname ~ '^s_[0-9]+_[0-9a-f]+$'`,
    [STAGING_SCHEMA],
  );
  const expired: string[] = [];
  for (const r of rows) {
    const made = Number(r.name.split('_')[1]);
    // A table without a preview row is either finished or still being filled: give it an hour.
    const stale = r.live ? made < cutoff : made < Math.floor(now.getTime() / 1000) - 3600;
    if (!stale) continue;
    await dropStaging(conn, r.name);
    if (r.live) expired.push(r.name);
  }
  if (expired.length) {
    await conn.query(`UPDATE uploads SET staging_table = NULL WHERE staging_table = ANY($1)`, [expired]);
  }
  return expired;
}
