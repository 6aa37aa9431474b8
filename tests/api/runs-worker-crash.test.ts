/**
 * A worker process killed with SIGKILL in the middle of a run: its lost chunk job expires
 * and is retried by another worker, no estimate is visible before the run reaches review,
 * every district ends with exactly one row per variant, and publishing raises no
 * duplicate alerts. (Invented districts: plumbing, not a correctness check.)
 */
import { spawn, type ChildProcess } from 'node:child_process';
import type { Server } from 'node:http';
import path from 'node:path';
import type TestAgent from 'supertest/lib/agent';
import type { CrestwatchApp } from '../../api/app';
import { seedDemoIfEmpty } from '../../api/demo/seed';
import type { Jobs } from '../../api/jobs/boss';
import { ensureDemoAccounts } from '../../api/people/service';
import { closeServer, DEMO, listen, signInAs } from '../support/auth';
import { testJobs, until, workIn } from '../support/jobs';
import { insertSyntheticDistricts } from '../support/synthetic';
import { testApp } from '../support/test-app';
import { freshDatabase, type TestDatabase } from '../support/test-db';

jest.setTimeout(180_000);

const root = path.resolve(__dirname, '..', '..');
let t: TestDatabase;
let app: CrestwatchApp;
let server: Server;
let jobs: Jobs;
let analyst: TestAgent;
let worker: ChildProcess | null = null;

beforeAll(async () => {
  t = await freshDatabase();
  await seedDemoIfEmpty(t.db);
  await ensureDemoAccounts(t.db);
  await insertSyntheticDistricts(t.db, 400, { years: 40 });
  jobs = await testJobs(t.url, { expireInSeconds: 3 });
  app = testApp(t.db, { runChunkSize: 10 });
  app.locals.ctx.jobs = jobs; // this process only queues until the worker is gone
  server = await listen(app);
  analyst = (await signInAs(server, DEMO.analyst)).agent;
});
afterAll(async () => {
  worker?.kill('SIGKILL');
  await jobs?.stop();
  await closeServer(server, app);
  await t.drop();
});

function startWorkerProcess(): ChildProcess {
  return spawn(process.execPath, ['--import', 'tsx', path.join(root, 'api', 'worker.ts')], {
    cwd: root,
    env: {
      ...process.env,
      CRESTWATCH_MODE: 'test',
      DATABASE_URL: t.url,
      RUN_CHUNK_SIZE: '10',
      JOB_EXPIRE_SECONDS: '3',
      JOB_MAINTENANCE_SECONDS: '1',
    },
    stdio: ['ignore', 'ignore', 'inherit'],
  });
}

it('survives a worker killed mid-run', async () => {
  worker = startWorkerProcess();
  const start = await analyst.post('/api/runs').send({});
  expect(start.status).toBe(202);
  const id = start.body.id;
  await until(
    'some chunks done',
    async () => {
      const [{ count }] = await t.db('run_chunks').where({ run_id: id }).count<{ count: string }[]>({ count: '*' });
      return Number(count) >= 3;
    },
    60_000,
    25,
  );
  worker.kill('SIGKILL');
  await new Promise((r) => worker!.once('exit', r));
  worker = null;

  const mid = (await analyst.get(`/api/runs/${id}`)).body;
  expect(mid.state).toBe('running');
  expect(mid.progress.chunksDone).toBeLessThan(mid.progress.chunksTotal);
  expect(mid.standingCounts).toBeNull();
  const hidden = await analyst.get(`/api/runs/${id}/review`);
  expect(hidden.status).toBe(409);
  expect(hidden.body.error.code).toBe('run_not_ready');

  // Another worker (here, this process) takes over; the lost job comes back after it expires.
  await workIn(app.locals.ctx, jobs);
  const done = await until(
    'run in review after the crash',
    async () => {
      const r = (await analyst.get(`/api/runs/${id}`)).body;
      if (r.state === 'failed') throw new Error(r.error);
      return r.state === 'in_review' ? r : null;
    },
    120_000,
    500,
  );
  expect(done.progress.chunksDone).toBe(done.progress.chunksTotal);

  const counts = await t.db.raw(
    `SELECT count(*)::int AS rows, count(DISTINCT (district_id, variant))::int AS keys, count(DISTINCT district_id)::int AS districts FROM run_estimates WHERE run_id = ?`,
    [id],
  );
  expect(counts.rows[0]).toEqual({ rows: 424 * 5, keys: 424 * 5, districts: 424 });

  const pub = await analyst.post(`/api/runs/${id}/publish`);
  expect(pub.status).toBe(200);
  const dupes = await t.db.raw(
    `SELECT count(*)::int AS n FROM (SELECT run_id, district_id, kind FROM alerts GROUP BY 1, 2, 3 HAVING count(*) > 1) x`,
  );
  expect(dupes.rows[0].n).toBe(0);
});
