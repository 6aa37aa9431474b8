/**
 * The usual API-test setup in one call: a fresh database (optionally with the demo region),
 * the demo accounts, the app listening on a loopback port, and an agent signed in as one
 * of the demo accounts.
 */
import type { Server } from 'node:http';
import type TestAgent from 'supertest/lib/agent';
import type { CrestwatchApp } from '../../api/app';
import type { Config } from '../../api/config';
import { seedDemoIfEmpty } from '../../api/demo/seed';
import { ensureDemoAccounts } from '../../api/people/service';
import { closeServer, DEMO, listen, signInAs } from './auth';
import { testApp } from './test-app';
import { freshDatabase, type TestDatabase } from './test-db';

export interface SignedInApp {
  t: TestDatabase;
  app: CrestwatchApp;
  server: Server;
  agent: TestAgent;
  close(): Promise<void>;
}

export async function signedInApp(
  opts: { as?: keyof typeof DEMO; seed?: boolean; config?: Partial<Config> } = {},
): Promise<SignedInApp> {
  const t = await freshDatabase();
  if (opts.seed ?? true) await seedDemoIfEmpty(t.db);
  await ensureDemoAccounts(t.db);
  const app = testApp(t.db, opts.config);
  const server = await listen(app);
  const agent = (await signInAs(server, DEMO[opts.as ?? 'official'])).agent;
  return {
    t,
    app,
    server,
    agent,
    async close() {
      await closeServer(server, app);
      await t.drop();
    },
  };
}
