/**
 * Retention: the scheduled job prunes expired sessions, finished mail older than
 * `sentMailRetentionDays` and unread alerts older than `unreadAlertRetentionDays`, and
 * nothing else; an admin's settings change moves the cut-off.
 *
 * The rows are inserted with chosen ages; every expected count below follows from the rows
 * this file inserts and the defaults in api/settings/schema.ts (90 and 365 days).
 */
import type { Server } from 'node:http';
import type { CrestwatchApp } from '../../api/app';
import { QUEUES, type Jobs } from '../../api/jobs/boss';
import { registerSchedules, RETENTION_CRON } from '../../api/jobs/handlers';
import { ensureDemoAccounts } from '../../api/people/service';
import { pruneExpired } from '../../api/retention/service';
import { closeServer, DEMO, listen, signInAs, type SignedIn } from '../support/auth';
import { testJobs, until, workIn } from '../support/jobs';
import { testApp } from '../support/test-app';
import { freshDatabase, type TestDatabase } from '../support/test-db';

jest.setTimeout(120_000);

const DAY = 24 * 60 * 60 * 1000;
const NOW = Date.now();
const ago = (days: number) => new Date(NOW - days * DAY);

let t: TestDatabase;
let app: CrestwatchApp;
let server: Server;
let admin: SignedIn;
let ids: Record<string, number>;

async function userId(email: string): Promise<number> {
  return Number((await t.db('users').where({ email }).first('id')).id);
}

async function insertMail(
  key: string,
  status: string,
  createdDaysAgo: number,
  sentDaysAgo: number | null,
): Promise<number> {
  const [r] = await t
    .db('outbox')
    .insert({
      dedupe_key: key,
      user_id: await userId(DEMO.official),
      to_address: DEMO.official,
      message: JSON.stringify({ subject: key, text: key }),
      status,
      created_at: ago(createdDaysAgo),
      sent_at: sentDaysAgo === null ? null : ago(sentDaysAgo),
    })
    .returning('id');
  return Number(r.id);
}

async function insertAlert(districtId: number, runId: number, kind: string, createdDaysAgo: number): Promise<number> {
  const [r] = await t
    .db('alerts')
    .insert({
      run_id: runId,
      district_id: districtId,
      kind,
      details: JSON.stringify({}),
      created_at: ago(createdDaysAgo),
    })
    .returning('id');
  return Number(r.id);
}

async function exists(table: string, id: number): Promise<boolean> {
  return Boolean(await t.db(table).where({ id }).first('id'));
}

beforeAll(async () => {
  t = await freshDatabase();
  await ensureDemoAccounts(t.db);
  app = testApp(t.db);
  server = await listen(app);
  admin = await signInAs(server, DEMO.admin);

  const [spec] = await t
    .db('model_specs')
    .insert({
      name: 'retention test',
      emissions_indicator: 'co2',
      driver_indicator: 'gdp',
      form: 'quadratic',
      transform: 'log',
      covariance: 'hc1',
    })
    .returning('id');
  const [track] = await t
    .db('tracks')
    .insert({ code: 'retention', name: 'retention test', emissions_indicator: 'co2', spec_id: spec.id })
    .returning('id');
  const [run] = await t
    .db('runs')
    .insert({
      track_id: track.id,
      spec_id: spec.id,
      spec: JSON.stringify({}),
      state: 'published',
      software_version: 'test',
      published_at: ago(400),
    })
    .returning('id');
  const [district] = await t.db('districts').insert({ code: 'R01', name: 'Retention Reach' }).returning('id');
  const d = Number(district.id);
  const r = Number(run.id);

  ids = {
    sentOld: await insertMail('sent-100d', 'sent', 101, 100),
    sentRecent: await insertMail('sent-10d', 'sent', 10, 10),
    failedOld: await insertMail('failed-120d', 'failed', 120, null),
    pendingOld: await insertMail('pending-200d', 'pending', 200, null),
    alertOldUnread: await insertAlert(d, r, 'crossing', 400),
    alertOldRead: await insertAlert(d, r, 'threshold_shift', 400),
    alertRecentUnread: await insertAlert(d, r, 'shape_change', 30),
  };
  await t.db('alert_reads').insert({ alert_id: ids.alertOldRead, user_id: await userId(DEMO.official) });
  await t.db('session').insert([
    { sid: 'expired-yesterday', sess: JSON.stringify({ cookie: {}, passport: { user: '1' } }), expire: ago(1) },
    { sid: 'valid-tomorrow', sess: JSON.stringify({ cookie: {}, passport: { user: '1' } }), expire: ago(-1) },
  ]);
});

afterAll(async () => {
  await closeServer(server, app);
  await t.drop();
});

describe('retention settings', () => {
  it('has documented defaults an admin sees and may change within bounds', async () => {
    const res = await admin.agent.get('/api/settings');
    // Defaults from api/settings/schema.ts.
    expect(res.body.settings).toMatchObject({ sentMailRetentionDays: 90, unreadAlertRetentionDays: 365 });
    const bad = await admin.agent.patch('/api/settings').send({ sentMailRetentionDays: 0 });
    expect(bad.status).toBe(400);
    expect(JSON.stringify(bad.body.error)).toContain('sentMailRetentionDays');
    const tooShort = await admin.agent.patch('/api/settings').send({ unreadAlertRetentionDays: 3 });
    expect(tooShort.status).toBe(400);
  });
});

describe('the retention job', () => {
  let jobs: Jobs;
  afterAll(async () => {
    await jobs?.stop();
  });

  it('is scheduled nightly with the other cron jobs', async () => {
    jobs = await testJobs(t.url);
    app.locals.ctx.jobs = jobs;
    await registerSchedules(app.locals.ctx, jobs);
    const schedules = await jobs.boss.getSchedules();
    const retention = schedules.find((s) => s.name === QUEUES.retention);
    expect(retention).toMatchObject({ cron: RETENTION_CRON, timezone: 'UTC' });
  });

  it('when run from the queue, prunes what is past its retention and keeps the rest', async () => {
    await workIn(app.locals.ctx, jobs);
    await jobs.send(QUEUES.retention, {});
    jobs.notify(QUEUES.retention);
    await until(
      'the retention job',
      async () => Boolean(await t.db('audit_log').where({ action: 'retention.prune' }).first('id')),
      30_000,
    );

    expect(await t.db('session').where({ sid: 'expired-yesterday' }).first()).toBeUndefined();
    expect(await t.db('session').where({ sid: 'valid-tomorrow' }).first()).toBeDefined();
    // 90 days for finished mail: 100-day sent and 120-day failed go; 10-day sent and any pending stay.
    expect(await exists('outbox', ids.sentOld)).toBe(false);
    expect(await exists('outbox', ids.failedOld)).toBe(false);
    expect(await exists('outbox', ids.sentRecent)).toBe(true);
    expect(await exists('outbox', ids.pendingOld)).toBe(true);
    // 365 days for unread alerts: the 400-day unread one goes; the read one and the 30-day one stay.
    expect(await exists('alerts', ids.alertOldUnread)).toBe(false);
    expect(await exists('alerts', ids.alertOldRead)).toBe(true);
    expect(await exists('alerts', ids.alertRecentUnread)).toBe(true);

    const entry = await t.db('audit_log').where({ action: 'retention.prune' }).first('actor_id', 'after');
    expect(entry.actor_id).toBeNull();
    expect(entry.after).toMatchObject({
      sessions: 1,
      mail: 2,
      alerts: 1,
      sentMailRetentionDays: 90,
      unreadAlertRetentionDays: 365,
    });
  });

  it('a second pass finds nothing more and writes no audit entry', async () => {
    expect(await pruneExpired(t.db, new Date(NOW))).toEqual({ sessions: 0, mail: 0, alerts: 0 });
    const [{ n }] = await t.db('audit_log').where({ action: 'retention.prune' }).count<{ n: string }[]>({ n: '*' });
    expect(Number(n)).toBe(1);
  });

  it('follows a shorter setting an admin saves', async () => {
    const res = await admin.agent
      .patch('/api/settings')
      .send({ sentMailRetentionDays: 5, unreadAlertRetentionDays: 7 });
    expect(res.status).toBe(200);
    // 10-day sent mail is now past 5 days; the 30-day unread alert past 7; the read alert stays.
    expect(await pruneExpired(t.db, new Date(NOW))).toEqual({ sessions: 0, mail: 1, alerts: 1 });
    expect(await exists('outbox', ids.sentRecent)).toBe(false);
    expect(await exists('alerts', ids.alertRecentUnread)).toBe(false);
    expect(await exists('alerts', ids.alertOldRead)).toBe(true);
    expect(await exists('outbox', ids.pendingOld)).toBe(true);
  });
});
