/** The demo mail catcher's table: what it stores and what the mailbox screen reads. */
import type { Knex } from 'knex';

export interface CaughtMailInput {
  from: string | null;
  to: string[];
  subject: string;
  text: string;
  html: string | null;
  attachments: { filename: string | null; contentType: string; size: number }[];
  messageId: string | null;
  sizeBytes: number;
}

export async function insertCaughtMail(db: Knex, m: CaughtMailInput): Promise<void> {
  await db('caught_mail').insert({
    envelope_from: m.from,
    envelope_to: m.to,
    subject: m.subject,
    text_body: m.text,
    html_body: m.html,
    attachments: JSON.stringify(m.attachments),
    message_id: m.messageId,
    size_bytes: m.sizeBytes,
  });
}

/** Caught messages, newest first, optionally only those addressed to `to` (lower-cased). */
export async function listCaughtMail(db: Knex, q: { to?: string; limit: number }) {
  const query = db('caught_mail').orderBy('id', 'desc').limit(q.limit);
  if (q.to) query.whereRaw('? = ANY(envelope_to)', [q.to.toLowerCase()]);
  const rows = await query.select('*');
  return rows.map((r: Record<string, unknown>) => ({
    id: Number(r.id),
    receivedAt: new Date(r.received_at as string).toISOString(),
    from: r.envelope_from,
    to: r.envelope_to,
    subject: r.subject,
    text: r.text_body,
    attachments: r.attachments,
  }));
}
