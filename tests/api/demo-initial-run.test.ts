/**
 * Demo mode's first start: with data but no run, one run of the default spec is queued,
 * fitted by the workers, and published in the first admin's name, with a note in the audit
 * log; a second start (a run exists) does nothing.
 */
import type { CrestwatchApp } from '../../api/app';
import { publishInitialDemoRun } from '../../api/demo/initial-run';
import { seedDemoIfEmpty } from '../../api/demo/seed';
import type { Jobs } from '../../api/jobs/boss';
import { ensureDemoAccounts } from '../../api/people/service';
import { DEMO } from '../support/auth';
import { testJobs, workIn } from '../support/jobs';
import { testApp } from '../support/test-app';
import { freshDatabase, type TestDatabase } from '../support/test-db';

jest.setTimeout(180_000);

let t: TestDatabase;
let app: CrestwatchApp;
let jobs: Jobs;

beforeAll(async () => {
  t = await freshDatabase();
  await seedDemoIfEmpty(t.db);
  await ensureDemoAccounts(t.db);
  jobs = await testJobs(t.url);
  app = testApp(t.db);
  app.locals.ctx.jobs = jobs;
  await workIn(app.locals.ctx, jobs);
});
afterAll(async () => {
  await jobs?.stop();
  await t.drop();
});

it('does nothing without an admin address or when that address has no account', async () => {
  expect(await publishInitialDemoRun(app.locals.ctx, null)).toBeNull();
  expect(await publishInitialDemoRun(app.locals.ctx, 'nobody@crestwatch.example')).toBeNull();
  expect(await t.db('runs').count<{ n: string }[]>({ n: '*' })).toEqual([{ n: '0' }]);
});

it('publishes the first run in the admin’s name once, and not again when a run exists', async () => {
  const runId = await publishInitialDemoRun(app.locals.ctx, DEMO.admin);
  expect(runId).not.toBeNull();
  const admin = await t.db('users').whereRaw('lower(email) = ?', [DEMO.admin]).first('id');
  const run = await t.db('runs').where({ id: runId }).first('state', 'trigger', 'reviewed_by');
  expect(run).toEqual({ state: 'published', trigger: 'schedule', reviewed_by: admin.id });
  const notes = await t.db('audit_log').where({ action: 'demo.initial_publish' }).select('target_id');
  expect(notes).toEqual([{ target_id: String(runId) }]);

  expect(await publishInitialDemoRun(app.locals.ctx, DEMO.admin)).toBeNull();
  expect(await t.db('runs').count<{ n: string }[]>({ n: '*' })).toEqual([{ n: '1' }]);
});
