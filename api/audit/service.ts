/**
 * The audit log as other features use it: record a change (inside the caller's transaction,
 * so the row commits or rolls back with the change it records) and read the log.
 */
import type { Knex } from 'knex';
import * as store from './store';

export type { AuditEntry, AuditFilter, AuditRow, PgConnection } from './store';

/** Writes one audit row with `db`; pass the change's transaction so both commit together. */
export function record(db: Knex, entry: store.AuditEntry): Promise<void> {
  return store.record(db, entry);
}

/**
 * Writes one audit row on a raw pg connection, inside the transaction the caller opened on
 * it (the upload pipeline's and the indicator catalogue's writes run that way).
 */
export function recordOn(conn: store.PgConnection, entry: store.AuditEntry): Promise<void> {
  return store.recordOn(conn, entry);
}

export function list(db: Knex, filter: store.AuditFilter): Promise<store.AuditRow[]> {
  return store.list(db, filter);
}
