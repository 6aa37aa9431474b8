/**
 * Demo mode's first start: with data but no run, the demo's three tracks are set up (CO2
 * per person as the headline, PM2.5, SO2 per person), one run per track is queued, fitted
 * by the workers, and published in the first admin's name, with a note in the audit log; a
 * second start (a run exists) does nothing. The card of D13 then shows the tracks disagree.
 */
import type { CrestwatchApp } from '../../api/app';
import { publishInitialDemoRuns } from '../../api/demo/initial-run';
import { seedDemoIfEmpty } from '../../api/demo/seed';
import type { Jobs } from '../../api/jobs/boss';
import { ensureDemoAccounts } from '../../api/people/service';
import { closeServer, DEMO, listen, signInAs } from '../support/auth';
import { parseAnswer } from '../support/contract';
import { DistrictEstimateResponseSchema } from '../../contracts/estimates';
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
  expect(await publishInitialDemoRuns(app.locals.ctx, null)).toBeNull();
  expect(await publishInitialDemoRuns(app.locals.ctx, 'nobody@crestwatch.example')).toBeNull();
  expect(await t.db('runs').count<{ n: string }[]>({ n: '*' })).toEqual([{ n: '0' }]);
});

it('publishes one run per track in the admin’s name once, and not again when a run exists', async () => {
  const runIds = await publishInitialDemoRuns(app.locals.ctx, DEMO.admin);
  expect(runIds).toHaveLength(3);
  const admin = await t.db('users').whereRaw('lower(email) = ?', [DEMO.admin]).first('id');
  const runs = await t
    .db('runs as r')
    .join('tracks as t', 't.id', 'r.track_id')
    .whereIn('r.id', runIds!)
    .orderBy('r.id')
    .select('t.code', 't.name', 't.emissions_indicator', 'r.state', 'r.trigger', 'r.reviewed_by');
  expect(runs).toEqual([
    {
      code: 'emissions-pc',
      name: 'CO2 per person',
      emissions_indicator: 'emissions_pc',
      state: 'published',
      trigger: 'schedule',
      reviewed_by: admin.id,
    },
    {
      code: 'pm25',
      name: 'PM2.5',
      emissions_indicator: 'pm25',
      state: 'published',
      trigger: 'schedule',
      reviewed_by: admin.id,
    },
    {
      code: 'so2',
      name: 'SO2 per person',
      emissions_indicator: 'so2_pc',
      state: 'published',
      trigger: 'schedule',
      reviewed_by: admin.id,
    },
  ]);
  const notes = await t.db('audit_log').where({ action: 'demo.initial_publish' }).orderBy('id').pluck('target_id');
  expect(notes).toEqual(runIds!.map(String));
  // The headline stays the CO2 track (the default spec's indicator).
  expect(await t.db('settings').where({ key: 'headline_track' }).first('value')).toEqual({ value: 'emissions-pc' });

  expect(await publishInitialDemoRuns(app.locals.ctx, DEMO.admin)).toBeNull();
  expect(await t.db('runs').count<{ n: string }[]>({ n: '*' })).toEqual([{ n: '3' }]);
});

it('shows on D13’s card that the tracks disagree (approaching for CO2, past the turn for PM2.5)', async () => {
  const server = await listen(app);
  try {
    const { agent } = await signInAs(server, DEMO.official);
    const res = await agent.get('/api/districts/D13/estimate?track=pm25');
    expect(res.status).toBe(200);
    const card = parseAnswer(DistrictEstimateResponseSchema, res);
    // The demo's design (api/demo/pressures.ts; tests/api/demo-tracks.test.ts reads it with the engine).
    expect(card.track.code).toBe('pm25');
    expect(card.track.indicator.unit).toBe('µg/m³');
    expect(card.tracks.map((r) => [r.code, r.standing])).toEqual([
      ['emissions-pc', 'approaching'],
      ['pm25', 'past_turn'],
      ['so2', 'no_turn'],
    ]);
    const d07 = parseAnswer(DistrictEstimateResponseSchema, await agent.get('/api/districts/D07/estimate?track=so2'));
    expect(d07.main?.status).toBe('substitute');
  } finally {
    await closeServer(server, app);
  }
});
