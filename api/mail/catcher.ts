/**
 * The local mail catcher for demo and test mode: an SMTP server on 127.0.0.1 that parses
 * each message (mailparser) and stores it in `caught_mail`, where the mailbox screen reads it.
 */
import type { Knex } from 'knex';
import { simpleParser } from 'mailparser';
import type { AddressInfo } from 'node:net';
import { SMTPServer } from 'smtp-server';
import { insertCaughtMail } from './store';

export interface MailCatcher {
  port: number;
  stop(): Promise<void>;
}

export async function startMailCatcher(db: Knex, port = 0, host = '127.0.0.1'): Promise<MailCatcher> {
  const server = new SMTPServer({
    disabledCommands: ['STARTTLS', 'AUTH'],
    allowInsecureAuth: true,
    authOptional: true,
    logger: false,
    size: 30 * 1024 * 1024,
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (c: Buffer) => chunks.push(c));
      stream.on('end', async () => {
        try {
          const raw = Buffer.concat(chunks);
          const mail = await simpleParser(raw);
          await insertCaughtMail(db, {
            from: session.envelope.mailFrom ? session.envelope.mailFrom.address : null,
            to: session.envelope.rcptTo.map((r) => r.address),
            subject: mail.subject ?? '',
            text: mail.text ?? '',
            html: typeof mail.html === 'string' ? mail.html : null,
            attachments: mail.attachments.map((a) => ({
              filename: a.filename ?? null,
              contentType: a.contentType,
              size: a.size,
            })),
            messageId: mail.messageId ?? null,
            sizeBytes: raw.length,
          });
          callback();
        } catch (err) {
          callback(err as Error);
        }
      });
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, host, () => resolve());
  });
  const actual = (server.server.address() as AddressInfo).port;
  return { port: actual, stop: () => new Promise<void>((resolve) => server.close(() => resolve())) };
}
