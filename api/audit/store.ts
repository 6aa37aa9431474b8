/** The audit log: who did what, when, with the state before and after. */
import type { Knex } from 'knex';
import type { PoolClient } from 'pg';

export interface AuditEntry {
  actorId: number | null;
  actorEmail: string | null;
  action: string;
  targetType: string;
  targetId?: string | number | null;
  before?: unknown;
  after?: unknown;
}

export interface AuditRow extends Required<Omit<AuditEntry, 'targetId'>> {
  id: number;
  at: string;
  targetId: string | null;
}

function columnsOf(e: AuditEntry) {
  return {
    actor_id: e.actorId,
    actor_email: e.actorEmail,
    action: e.action,
    target_type: e.targetType,
    target_id: e.targetId === undefined || e.targetId === null ? null : String(e.targetId),
    before: e.before === undefined ? null : JSON.stringify(e.before),
    after: e.after === undefined ? null : JSON.stringify(e.after),
  };
}

export async function record(db: Knex, e: AuditEntry): Promise<void> {
  await db('audit_log').insert(columnsOf(e));
}

/** A pooled pg connection in the middle of a transaction (BEGIN … COMMIT written by hand). */
export type PgConnection = Pick<PoolClient, 'query'>;

/** The same row as `record`, written on a raw pg connection inside its open transaction. */
export async function recordOn(conn: PgConnection, e: AuditEntry): Promise<void> {
  const c = columnsOf(e);
  await conn.query(
    `INSERT INTO audit_log (actor_id, actor_email, action, target_type, target_id, before, after)
     VALUES ($1, $2, $3, $4, $5, $6, $7)`,
    [c.actor_id, c.actor_email, c.action, c.target_type, c.target_id, c.before, c.after],
  );
}

export interface AuditFilter {
  action?: string;
  actor?: string;
  targetType?: string;
  since?: string;
  until?: string;
  limit: number;
  beforeId?: number;
}

export async function list(db: Knex, f: AuditFilter): Promise<AuditRow[]> {
  const q = db('audit_log').orderBy('id', 'desc').limit(f.limit);
  if (f.action) q.where('action', f.action);
  if (f.actor) q.whereRaw('lower(actor_email) like lower(?)', [`%${f.actor}%`]);
  if (f.targetType) q.where('target_type', f.targetType);
  if (f.since) q.where('at', '>=', f.since);
  if (f.until) q.where('at', '<', f.until);
  if (f.beforeId) q.where('id', '<', f.beforeId);
  const rows = await q.select('*');
  return rows.map((r: Record<string, unknown>) => ({
    id: Number(r.id),
    at: new Date(r.at as string).toISOString(),
    actorId: r.actor_id === null ? null : Number(r.actor_id),
    actorEmail: (r.actor_email as string | null) ?? null,
    action: String(r.action),
    targetType: String(r.target_type),
    targetId: (r.target_id as string | null) ?? null,
    before: r.before ?? null,
    after: r.after ?? null,
  }));
}
