/** The outbox's SQL: queued e-mails, one row each, claimed with SKIP LOCKED. */
import type { Knex } from 'knex';

export interface NewOutboxRow {
  dedupeKey: string;
  userId: number;
  runId: number | null;
  toAddress: string;
  /** The message as JSON: subject, text, attachments by kind. */
  message: unknown;
}

export interface OutboxRow {
  id: number;
  dedupeKey: string;
  toAddress: string;
  message: unknown;
  attempts: number;
}

/** Queues messages; a dedupe key already queued is skipped. Returns how many were new. */
export async function insertMessages(db: Knex, rows: NewOutboxRow[]): Promise<number> {
  if (!rows.length) return 0;
  const inserted = await db('outbox')
    .insert(
      rows.map((r) => ({
        dedupe_key: r.dedupeKey,
        user_id: r.userId,
        run_id: r.runId,
        to_address: r.toAddress,
        message: JSON.stringify(r.message),
      })),
    )
    .onConflict('dedupe_key')
    .ignore()
    .returning('id');
  return inserted.length;
}

/** Locks the oldest message that is due (skipping rows another worker holds), inside `trx`. */
export async function claimNextDue(trx: Knex.Transaction): Promise<OutboxRow | null> {
  const row = await trx('outbox')
    .where('status', 'pending')
    .where('next_attempt_at', '<=', trx.fn.now())
    .orderBy('id')
    .forUpdate()
    .skipLocked()
    .first('id', 'dedupe_key', 'to_address', 'message', 'attempts');
  return row
    ? {
        id: Number(row.id),
        dedupeKey: String(row.dedupe_key),
        toAddress: String(row.to_address),
        message: row.message,
        attempts: Number(row.attempts),
      }
    : null;
}

export async function markSent(trx: Knex.Transaction, id: number, attempts: number): Promise<void> {
  await trx('outbox').where({ id }).update({ status: 'sent', sent_at: trx.fn.now(), attempts, last_error: null });
}

/** Records a failed attempt: pending again after `delaySeconds`, or failed for good. */
export async function markAttemptFailed(
  trx: Knex.Transaction,
  id: number,
  p: { attempts: number; error: string; giveUp: boolean; delaySeconds: number },
): Promise<void> {
  await trx('outbox')
    .where({ id })
    .update({
      attempts: p.attempts,
      last_error: p.error,
      status: p.giveUp ? 'failed' : 'pending',
      next_attempt_at: trx.raw(`now() + make_interval(secs => ?)`, [p.delaySeconds]),
    });
}
