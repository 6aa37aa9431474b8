/**
 * GET /api/published: the latest published run id, which an open app asks on focus and once
 * a minute to learn of a publish made elsewhere. Never cached; null before the first publish.
 */
import type { Server } from 'node:http';
import request from 'supertest';
import type { CrestwatchApp } from '../../api/app';
import { seedDemoIfEmpty } from '../../api/demo/seed';
import type { Jobs } from '../../api/jobs/boss';
import { ensureDemoAccounts } from '../../api/people/service';
import { closeServer, DEMO, listen, signInAs } from '../support/auth';
import { startRunAndWait, testJobs, workIn } from '../support/jobs';
import { testApp } from '../support/test-app';
import { freshDatabase, type TestDatabase } from '../support/test-db';

jest.setTimeout(180_000);

let t: TestDatabase;
let app: CrestwatchApp;
let server: Server;
let jobs: Jobs;

beforeAll(async () => {
  t = await freshDatabase();
  await seedDemoIfEmpty(t.db);
  await ensureDemoAccounts(t.db);
  jobs = await testJobs(t.url);
  app = testApp(t.db);
  app.locals.ctx.jobs = jobs;
  await workIn(app.locals.ctx, jobs);
  server = await listen(app);
});
afterAll(async () => {
  await jobs?.stop();
  await closeServer(server, app);
  await t.drop();
});

it('answers null before any publish, then the published run, and is never cached', async () => {
  const official = (await signInAs(server, DEMO.official)).agent;
  const analyst = (await signInAs(server, DEMO.analyst)).agent;
  const first = await official.get('/api/published');
  expect(first.status).toBe(200);
  expect(first.headers['cache-control']).toBe('no-store');
  expect(first.body).toEqual({ runId: null });

  const { run } = await startRunAndWait(analyst);
  // In review is not published: officials still see nothing new.
  expect((await official.get('/api/published')).body).toEqual({ runId: null });
  const publish = await analyst.post(`/api/runs/${run.id}/publish`).send({});
  expect(publish.status).toBe(200);
  expect((await official.get('/api/published')).body).toEqual({ runId: run.id });
});

it('is for signed-in people only', async () => {
  expect((await request(server).get('/api/published')).status).toBe(401);
});
