import type { Knex } from 'knex';
import { createApp, type CrestwatchApp } from '../../api/app';
import { loadConfig, type Config } from '../../api/config';
import type { Mailer } from '../../api/mail/mailer';

/** A mailer that keeps what it would send (for tests that do not look at SMTP itself). */
export function memoryMailer(): Mailer & { sent: Parameters<Mailer['send']>[0][] } {
  const sent: Parameters<Mailer['send']>[0][] = [];
  return {
    sent,
    async send(msg) {
      sent.push(msg);
      return { messageId: `<memory-${sent.length}@crestwatch.example>` };
    },
    close() {},
  };
}

/** The exported app against a test database, quiet, with an optional web build folder. */
export function testApp(db: Knex, overrides: Partial<Config> = {}, mailer: Mailer = memoryMailer()): CrestwatchApp {
  const base = loadConfig({ CRESTWATCH_MODE: 'test' });
  // The session store opens its own pool: point it at the same test database as db.
  const c = (db.client as { connectionSettings: { user: string; host: string; port: string; database: string } })
    .connectionSettings;
  const databaseUrl = `postgres://${c.user}@${c.host}:${c.port}/${c.database}`;
  const config: Config = { ...base, databaseUrl, logRequests: false, ...overrides };
  return createApp({ db, config, log: () => {}, mailer });
}
