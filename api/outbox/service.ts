/**
 * Queuing e-mail: other features hand the outbox whole messages (one row per recipient
 * and dedupe key) inside their own transaction, so a message exists only if the change
 * that caused it committed. Delivery is `sender.ts`.
 */
import type { Knex } from 'knex';
import type { OutboxMessage } from './sender';
import * as store from './store';

export interface QueuedMail {
  /** Unique per message: the same key queued twice is sent once. */
  dedupeKey: string;
  userId: number;
  /** the run the message is about (null: a notice about a run that never started) */
  runId: number | null;
  to: string;
  message: OutboxMessage;
}

/** Queues the messages in `trx`; returns how many were new (not already queued). */
export function enqueue(trx: Knex.Transaction, mails: QueuedMail[]): Promise<number> {
  return store.insertMessages(
    trx,
    mails.map((m) => ({
      dedupeKey: m.dedupeKey,
      userId: m.userId,
      runId: m.runId,
      toAddress: m.to,
      message: m.message,
    })),
  );
}
