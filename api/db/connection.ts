/**
 * One pooled connection taken from Knex for the bulk pipelines (uploads, indicators'
 * derived series, boundaries): COPY needs the raw pg client, and staging, checks and merge
 * run as plain SQL on it, in the features' stores. Database plumbing, like the named locks.
 */
import type { Knex } from 'knex';
import type { PoolClient } from 'pg';
import { LOCKS } from './locks';

export type Sql = Pick<PoolClient, 'query'>;

/** Runs fn on one connection; rolls back an open transaction if fn fails. */
export async function withConnection<T>(db: Knex, fn: (conn: PoolClient) => Promise<T>): Promise<T> {
  const client = db.client as {
    acquireConnection(): Promise<PoolClient>;
    releaseConnection(c: PoolClient): Promise<void>;
  };
  const conn = await client.acquireConnection();
  try {
    return await fn(conn);
  } catch (err) {
    await conn.query('ROLLBACK').catch(() => {});
    throw err;
  } finally {
    await client.releaseConnection(conn);
  }
}

/** BEGIN … COMMIT on conn; ROLLBACK when fn throws or returns { rollback: true }. */
export async function inTransaction<T>(conn: Sql, fn: () => Promise<T & { rollback?: boolean }>): Promise<T> {
  await conn.query('BEGIN');
  try {
    const result = await fn();
    await conn.query(result.rollback ? 'ROLLBACK' : 'COMMIT');
    return result;
  } catch (err) {
    await conn.query('ROLLBACK').catch(() => {});
    throw err;
  }
}

/** Every change to observations takes this lock first, so checks and merge see one state. */
export async function lockObservations(conn: Sql): Promise<void> {
  await conn.query('SELECT pg_advisory_xact_lock($1)', [LOCKS.observations]);
}

/** A quoted identifier for names built from our own tokens (staging tables). */
export function ident(name: string): string {
  if (!/^[a-z_][a-z0-9_]{0,62}$/.test(name)) throw new Error(`unsafe identifier ${name}`);
  return `"${name}"`;
}
