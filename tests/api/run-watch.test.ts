/**
 * The scheduled-run watch: a failed scheduled run, one still queued an hour after its time,
 * a schedule that passed with no run of an active track, and a run in review longer than
 * the reviewWaitDays setting each become one notice in GET /api/runs/notices (staff only)
 * and one e-mail per staff member through the outbox, queued by the `run-watch` job and
 * never twice. Runs are written straight into the tables at chosen times (the watch reads
 * times, not the engine's work).
 */
import type { Server } from 'node:http';
import type { CrestwatchApp } from '../../api/app';
import { QUEUES } from '../../api/common/queues';
import type { Jobs } from '../../api/jobs/boss';
import { ensureDemoAccounts } from '../../api/people/service';
import { lastScheduledTime, mailRunNotices, runNotices } from '../../api/run-watch/service';
import { RunNoticesResponseSchema } from '../../contracts/run-watch';
import { closeServer, DEMO, listen, signInAs } from '../support/auth';
import { parseAnswer } from '../support/contract';
import { testJobs, until, workIn } from '../support/jobs';
import { testApp } from '../support/test-app';
import { freshDatabase, type TestDatabase } from '../support/test-db';

jest.setTimeout(120_000);

let t: TestDatabase;
let app: CrestwatchApp;
let server: Server;
let specId: number;
const tracks: Record<string, number> = {};

/** 2026-10-01 06:00 UTC: the default quarterly schedule's start (settings: '0 6 1 1,4,7,10 *', UTC). */
const SCHEDULED = new Date('2026-10-01T06:00:00Z');
const at = (minutesAfter: number) => new Date(SCHEDULED.getTime() + minutesAfter * 60_000);

async function run(track: string, fields: Record<string, unknown>): Promise<number> {
  const [{ id }] = await t
    .db('runs')
    .insert({
      spec_id: specId,
      track_id: tracks[track],
      spec: JSON.stringify({ name: 'watch test' }),
      software_version: 'test',
      trigger: 'schedule',
      ...fields,
    })
    .returning('id');
  return id;
}

beforeAll(async () => {
  t = await freshDatabase();
  await ensureDemoAccounts(t.db);
  [{ id: specId }] = await t
    .db('model_specs')
    .insert({
      name: 'watch test',
      emissions_indicator: 'emissions_pc',
      driver_indicator: 'income_pc',
      form: 'quadratic',
      transform: 'log',
      covariance: 'hc1',
    })
    .returning('id');
  for (const [code, state] of [
    ['co2', 'active'],
    ['pm25', 'active'],
    ['so2', 'active'],
    ['nox', 'paused'],
    ['old', 'archived'],
    ['late', 'active'],
  ]) {
    const [{ id }] = await t
      .db('tracks')
      .insert({
        code,
        name: `${code.toUpperCase()} per person`,
        emissions_indicator: 'emissions_pc',
        spec_id: specId,
        state,
        // 'late' was created after the schedule fired: it owes no run for it.
        created_at: code === 'late' ? at(10) : new Date('2026-01-01T00:00:00Z'),
      })
      .returning('id');
    tracks[code] = id;
  }
  app = testApp(t.db);
  server = await listen(app);
});
afterAll(async () => {
  await closeServer(server, app);
  await t.drop();
});

it('finds the latest scheduled time of the cron in the region time zone', () => {
  // Cron semantics (common practice): '0 6 1 1,4,7,10 *' fires at 06:00 on the first day of each quarter.
  expect(lastScheduledTime('0 6 1 1,4,7,10 *', 'UTC', at(90))?.toISOString()).toBe('2026-10-01T06:00:00.000Z');
  // 06:00 in Lisbon on 1 October 2026 is 05:00 UTC (summer time, UTC+1; from memory).
  expect(lastScheduledTime('0 6 1 1,4,7,10 *', 'Europe/Lisbon', at(90))?.toISOString()).toBe(
    '2026-10-01T05:00:00.000Z',
  );
  expect(lastScheduledTime('not a cron', 'UTC', at(90))).toBeNull();
});

describe('with runs at chosen times', () => {
  let failed: number;
  let queued: number;
  let overdue: number;

  beforeAll(async () => {
    // co2: failed at 06:20, nothing after it. pm25: still queued since 06:01. so2: no run at all.
    failed = await run('co2', { state: 'failed', created_at: at(0), finished_at: at(20), error: 'Chunk 3 failed' });
    queued = await run('pm25', { state: 'queued', created_at: at(1) });
    // Last quarter's so2 run has waited in review since 2026-07-02 (91 days before at(90)).
    overdue = await run('so2', {
      state: 'in_review',
      created_at: new Date('2026-07-01T06:00:00Z'),
      finished_at: new Date('2026-07-02T06:00:00Z'),
    });
    // Not notices: a failed manual run, a failed scheduled run followed by a newer run of its
    // track, a run in review for 3 days, a failed run of an archived track.
    await run('nox', { state: 'failed', trigger: 'manual', created_at: at(-50_000), finished_at: at(-49_990) });
    await run('late', { state: 'failed', created_at: at(-60_000), finished_at: at(-59_000) });
    await run('late', { state: 'published', created_at: at(-58_000), finished_at: at(-57_000) });
    await run('co2', { state: 'in_review', created_at: at(-4400), finished_at: at(-4320) });
    await run('old', { state: 'failed', created_at: at(0), finished_at: at(5) });
  });

  it('lists each problem once, oldest first, with its track and a page to open', async () => {
    const { notices, reviewWaitDays } = await runNotices(t.db, at(90));
    // The setting's default (issue 14: default 7 days).
    expect(reviewWaitDays).toBe(7);
    expect(notices.map((n) => [n.kind, n.track.code, n.runId])).toEqual([
      ['review_overdue', 'so2', overdue],
      ['not_started', 'so2', null],
      ['not_started', 'pm25', queued],
      ['failed', 'co2', failed],
    ]);
    const missed = notices.find((n) => n.runId === null)!;
    expect(missed.since).toBe(SCHEDULED.toISOString());
    expect(missed.href).toBe('/runs?track=so2');
    expect(notices.find((n) => n.kind === 'failed')!.message).toContain('Chunk 3 failed');
    expect(notices.find((n) => n.kind === 'review_overdue')!.message).toContain('91 days');
  });

  it('waits an hour before calling a start missed', async () => {
    // At 06:50 the queued pm25 run and the missing so2 run are still within their hour.
    const early = await runNotices(t.db, at(50));
    expect(early.notices.map((n) => n.kind).sort()).toEqual(['failed', 'review_overdue']);
  });

  it('follows the reviewWaitDays setting', async () => {
    await t.db('settings').insert({ key: 'reviewWaitDays', value: JSON.stringify(2) });
    const { notices } = await runNotices(t.db, at(90));
    await t.db('settings').where({ key: 'reviewWaitDays' }).del();
    // Oldest first: so2's run has waited since July, co2's for 3 days.
    expect(notices.filter((n) => n.kind === 'review_overdue').map((n) => n.track.code)).toEqual(['so2', 'co2']);
  });

  it('answers staff in the app and refuses officials', async () => {
    const analyst = (await signInAs(server, DEMO.analyst)).agent;
    const res = await analyst.get('/api/runs/notices');
    expect(res.status).toBe(200);
    const body = parseAnswer(RunNoticesResponseSchema, res);
    // The clock is now (after 2026-10-01): at least the failed and the overdue run are listed.
    expect(body.notices.map((n) => n.runId)).toEqual(expect.arrayContaining([failed, overdue]));
    const official = (await signInAs(server, DEMO.official)).agent;
    expect((await official.get('/api/runs/notices')).status).toBe(403);
  });

  it('queues one e-mail per notice and staff member, once', async () => {
    const staff = await t.db('users').where({ active: true }).whereIn('role', ['admin', 'analyst']).select('id');
    expect(staff.length).toBeGreaterThanOrEqual(2);
    const first = await mailRunNotices({ db: t.db, config: app.locals.ctx.config }, at(90));
    expect(first).toEqual({ notices: 4, queued: 4 * staff.length });
    const again = await mailRunNotices({ db: t.db, config: app.locals.ctx.config }, at(100));
    expect(again).toEqual({ notices: 4, queued: 0 });
    const mail = await t.db('outbox').where('dedupe_key', 'like', `run-watch:failed:run-${failed}:%`).first('message');
    expect(mail.message.subject).toBe(`Crestwatch · CO2 per person: scheduled run failed (#${failed})`);
    expect(mail.message.text).toContain(`/runs/${failed}`);
    const official = await t.db('users').where({ role: 'official' }).pluck('id');
    expect(await t.db('outbox').whereIn('user_id', official).where('dedupe_key', 'like', 'run-watch:%')).toEqual([]);
  });
});

describe('the run-watch job', () => {
  let jobs: Jobs;
  beforeAll(async () => {
    jobs = await testJobs(t.url);
    app.locals.ctx.jobs = jobs;
    await workIn(app.locals.ctx, jobs);
  });
  afterAll(async () => {
    app.locals.ctx.jobs = null;
    await jobs?.stop();
  });

  it('queues the mail of a new problem when it runs', async () => {
    const broken = await run('pm25', { state: 'failed', created_at: new Date(), finished_at: new Date(), error: 'x' });
    await jobs.send(QUEUES.runWatch, {});
    jobs.notify(QUEUES.runWatch);
    const rows = await until('the watch to queue mail', async () => {
      const r = await t.db('outbox').where('dedupe_key', 'like', `run-watch:failed:run-${broken}:%`);
      return r.length ? r : null;
    });
    expect(rows.every((r: { run_id: number }) => r.run_id === broken)).toBe(true);
  });
});
