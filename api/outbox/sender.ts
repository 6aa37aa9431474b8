/**
 * Delivers the outbox: each row is one e-mail (an alert to one subscriber, or one digest
 * per publish and subscriber), keyed by a unique dedupe key, so it is written once and
 * sent once. A failed send keeps the row pending and retries later with a doubling delay;
 * nothing is lost while SMTP is down. The Message-ID is derived from the row, so a mail
 * client also sees a repeat as the same message.
 */
import type { AppContext } from '../context';
import { renderAttachment, type AttachmentSpec } from './attachments';
import * as store from './store';

export interface OutboxMessage {
  subject: string;
  text: string;
  attachments?: AttachmentSpec[];
}

const MAX_ATTEMPTS = 12;

/** Sends what is due; returns counts. Safe to run in several workers at once (SKIP LOCKED). */
export async function deliverOutbox(ctx: AppContext, limit = 100): Promise<{ sent: number; failed: number }> {
  let sent = 0;
  let failed = 0;
  for (let i = 0; i < limit; i++) {
    const outcome = await ctx.db.transaction(async (trx) => {
      const row = await store.claimNextDue(trx);
      if (!row) return 'empty' as const;
      const message = row.message as OutboxMessage;
      try {
        const attachments = [];
        for (const spec of message.attachments ?? []) attachments.push(await renderAttachment(ctx, spec));
        await ctx.mailer.send({
          to: row.toAddress,
          subject: message.subject,
          text: message.text,
          attachments,
          headers: {
            'Message-ID': `<outbox-${row.id}-${row.dedupeKey.replace(/[^A-Za-z0-9.-]/g, '-')}@crestwatch.example>`,
          },
        });
        await store.markSent(trx, row.id, row.attempts + 1);
        return 'sent' as const;
      } catch (err) {
        const attempts = row.attempts + 1;
        await store.markAttemptFailed(trx, row.id, {
          attempts,
          error: String((err as Error).message).slice(0, 1000),
          giveUp: attempts >= MAX_ATTEMPTS,
          delaySeconds: Math.min(ctx.config.mailRetrySeconds * 2 ** (attempts - 1), 3600),
        });
        return 'failed' as const;
      }
    });
    if (outcome === 'empty') break;
    if (outcome === 'sent') sent++;
    else failed++;
  }
  return { sent, failed };
}
