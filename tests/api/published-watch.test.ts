/**
 * The published answers' version is kept per process while nothing changed: it is read once,
 * not on every request; a change made through another connection (as by another server
 * process) shows once PostgreSQL delivers the commit's notification; a change made through
 * this process shows at once; and while the listening connection is down the version is
 * read on every request again.
 */
import type { Server } from 'node:http';
import type { Knex } from 'knex';
import { createDb } from '../../api/db';
import type { CrestwatchApp } from '../../api/app';
import { currentPublishedVersion } from '../../api/estimates/published-cache';
import * as estimates from '../../api/estimates/service';
import { ensureDemoAccounts } from '../../api/people/service';
import { closeServer, DEMO, listen, signInAs, type SignedIn } from '../support/auth';
import { testApp } from '../support/test-app';
import { freshDatabase, type TestDatabase } from '../support/test-db';

let t: TestDatabase;
let other: Knex;
let app: CrestwatchApp;
let server: Server;
let official: SignedIn;
let versionReads = 0;

beforeAll(async () => {
  t = await freshDatabase();
  await ensureDemoAccounts(t.db);
  other = createDb(t.url, { pool: { min: 0, max: 2 } });
  t.db.on('query', (q: { sql?: string }) => {
    if ((q.sql ?? '').includes('string_agg(id::text')) versionReads++;
  });
  app = testApp(t.db);
  server = await listen(app);
  official = await signInAs(server, DEMO.official);
});
afterAll(async () => {
  await other.destroy();
  await closeServer(server, app);
  await t.drop();
});

const codes = async () =>
  ((await official.agent.get('/api/districts')).body.districts as { code: string }[]).map((d) => d.code);

async function until(check: () => Promise<boolean>, ms = 5_000): Promise<void> {
  const t0 = Date.now();
  while (!(await check())) {
    if (Date.now() - t0 > ms) throw new Error(`not within ${ms} ms`);
    await new Promise((r) => setTimeout(r, 20));
  }
}

/** Waits until this process listens (the first read starts listening). */
async function listening(): Promise<void> {
  await until(async () => {
    await currentPublishedVersion(t.db);
    const before = versionReads;
    await currentPublishedVersion(t.db);
    return versionReads === before;
  });
}

it('reads the version once for many requests while nothing changes', async () => {
  await codes();
  await listening();
  const before = versionReads;
  for (let i = 0; i < 10; i++) await codes();
  expect(versionReads - before).toBe(0);
});

it('shows a district added through another connection once the notification arrives', async () => {
  await listening();
  await other('districts').insert({ code: 'W01', name: 'Watch Fold' });
  await until(async () => (await codes()).includes('W01'));
});

it('shows a change made through this process at once', async () => {
  await listening();
  await codes();
  await t.db('districts').insert({ code: 'W02', name: 'Watch Reach' });
  expect(await codes()).toContain('W02');
});

it('reads the version on every request while the listening connection is down', async () => {
  await listening();
  const { rows } = await other.raw(
    `SELECT pg_terminate_backend(pid) FROM pg_stat_activity WHERE datname = current_database() AND query ILIKE 'LISTEN%'`,
  );
  expect(rows.length).toBe(1);
  // The lost connection is noticed, and from then on every read asks the database.
  await until(async () => {
    const before = versionReads;
    await codes();
    return versionReads > before;
  });
  await other('districts').insert({ code: 'W03', name: 'Watch Hollow' });
  expect(await codes()).toContain('W03');
});

it('builds an answer once however many ask for it at the same moment', async () => {
  await t.db('districts').insert({ code: 'W04', name: 'Watch Ridge' });
  const builds = jest.spyOn(estimates, 'listDistricts');
  try {
    const answers = await Promise.all(Array.from({ length: 12 }, () => official.agent.get('/api/districts')));
    expect(answers.every((a) => a.status === 200 && a.text === answers[0].text)).toBe(true);
    expect(answers[0].body.districts.map((d: { code: string }) => d.code)).toContain('W04');
    expect(builds).toHaveBeenCalledTimes(1);
  } finally {
    builds.mockRestore();
  }
});
