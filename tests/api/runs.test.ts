/**
 * Runs end to end over the demo region: start, review, publish, a data revision that
 * moves a district across its threshold band, alerts in the feed and in the mail catcher
 * exactly once, an unchanged republish that sends nothing, reproduction to the last digit,
 * and mail held while SMTP is down.
 */
import fs from 'node:fs';
import type { Server } from 'node:http';
import path from 'node:path';
import type TestAgent from 'supertest/lib/agent';
import type { CrestwatchApp } from '../../api/app';
import { loadConfig } from '../../api/config';
import { seedDemoIfEmpty } from '../../api/demo/seed';
import type { Jobs } from '../../api/jobs/boss';
import { startMailCatcher, type MailCatcher } from '../../api/mail/catcher';
import { createMailer } from '../../api/mail/mailer';
import { deliverOutbox } from '../../api/outbox/sender';
import { ensureDemoAccounts } from '../../api/people/service';
import { getSpec } from '../../api/specs/service';
import { headlineTrack } from '../../api/tracks/service';
import {
  AlertFeedResponseSchema,
  DistrictAlertsResponseSchema,
  SubscriptionAnswerSchema,
  SubscriptionsResponseSchema,
} from '../../contracts/alerts';
import { DistrictListResponseSchema } from '../../contracts/districts';
import {
  DistrictEstimateResponseSchema,
  DistrictHistoryResponseSchema,
  RegionResponseSchema,
} from '../../contracts/estimates';
import {
  DistrictReviewSchema,
  PublishAnswerSchema,
  ReviewResponseSchema,
  RunListResponseSchema,
  RunStartedSchema,
  RunViewSchema,
} from '../../contracts/runs';
import { SpecsResponseSchema } from '../../contracts/settings';
import { RevertAnswerSchema, UploadAnswerSchema, UploadListResponseSchema } from '../../contracts/uploads';
import { closeServer, DEMO, listen, signInAs } from '../support/auth';
import { parseAnswer } from '../support/contract';
import { startRunAndWait, testJobs, until, workIn } from '../support/jobs';
import { testApp } from '../support/test-app';
import { freshDatabase, type TestDatabase } from '../support/test-db';

jest.setTimeout(180_000);

let t: TestDatabase;
let app: CrestwatchApp;
let server: Server;
let jobs: Jobs;
let catcher: MailCatcher;
let analyst: TestAgent;
let official: TestAgent;

beforeAll(async () => {
  t = await freshDatabase();
  await seedDemoIfEmpty(t.db);
  await ensureDemoAccounts(t.db);
  catcher = await startMailCatcher(t.db, 0);
  const config = { ...loadConfig({ CRESTWATCH_MODE: 'test' }), mailCatcherPort: catcher.port, mailRetrySeconds: 1 };
  jobs = await testJobs(t.url);
  app = testApp(t.db, { mailCatcherPort: catcher.port, mailRetrySeconds: 1 }, createMailer(config));
  app.locals.ctx.jobs = jobs;
  await workIn(app.locals.ctx, jobs);
  server = await listen(app);
  analyst = (await signInAs(server, DEMO.analyst)).agent;
  official = (await signInAs(server, DEMO.official)).agent;
});
afterAll(async () => {
  await jobs?.stop();
  await closeServer(server, app);
  await catcher?.stop();
  await t.drop();
});

async function runToReview(): Promise<number> {
  const { status, start, run } = await startRunAndWait(analyst);
  expect(status).toBe(202);
  expect(start.state).toBe('queued');
  expect(run.dataHash).toMatch(/^[0-9a-f]{64}$/);
  expect(run.softwareVersion).toBeTruthy();
  return run.id;
}

const mailsTo = async (email: string) =>
  (await t.db('caught_mail').whereRaw('? = ANY(envelope_to)', [email]).select('*')) as {
    subject: string;
    text_body: string;
    message_id: string | null;
  }[];

describe('runs', () => {
  let firstRun: number;
  let secondRun: number;
  let crossing: { code: string; from: string; to: string };

  it('refuses a second run of the same track while one is active, and hides estimates until review', async () => {
    // A run that stays queued (no job is sent for it, so no worker can pick it up) makes
    // the refusal deterministic: the second start must be 409, whatever the workers do.
    const track = await headlineTrack(t.db);
    const spec = await getSpec(t.db, track.specId);
    const [held] = await t
      .db('runs')
      .insert({
        track_id: track.id,
        spec_id: spec.id,
        spec: JSON.stringify({ savedSpecId: spec.id, name: spec.name }),
        trigger: 'manual',
        software_version: 'test',
      })
      .returning('id');
    const refused = await analyst.post('/api/runs').send({});
    expect(refused.status).toBe(409);
    expect(refused.body.error.code).toBe('run_in_progress');
    expect(refused.body.error.details.runId).toBe(held.id);
    await t.db('runs').where({ id: held.id }).update({ state: 'discarded' });

    const a = await analyst.post('/api/runs').send({});
    expect(a.status).toBe(202);
    const early = await analyst.get(`/api/runs/${a.body.id}/review`);
    if ((await analyst.get(`/api/runs/${a.body.id}`)).body.state !== 'in_review') expect(early.status).toBe(409);
    await until(
      'first run in review',
      async () => (await analyst.get(`/api/runs/${a.body.id}`)).body.state === 'in_review',
    );
    firstRun = a.body.id;
  });

  it('fits every district with its sensitivity variants and the regional substitute for short series', async () => {
    const view = parseAnswer(RunViewSchema, await analyst.get(`/api/runs/${firstRun}`));
    expect(view.progress.districts).toBe(24);
    expect(view.pooled?.status).toBe('ok');
    const review = parseAnswer(ReviewResponseSchema, await analyst.get(`/api/runs/${firstRun}/review`));
    expect(review.districts).toHaveLength(24);
    const [{ count }] = await t
      .db('run_estimates')
      .where({ run_id: firstRun })
      .count<{ count: string }[]>({ count: '*' });
    expect(Number(count)).toBe(24 * 5);
    // D10 has 2018–2025 only (8 years < k + 5 = 9): the pooled curve stands in.
    const d10 = parseAnswer(DistrictReviewSchema, await analyst.get(`/api/runs/${firstRun}/districts/D10`));
    const main = d10.records.find((r) => r.variant === 'main');
    expect(main?.status).toBe('substitute');
    expect(main?.reason?.message).toMatch(/regional pooled curve/);
    const d01 = parseAnswer(DistrictReviewSchema, await analyst.get(`/api/runs/${firstRun}/districts/D01`));
    const d01main = d01.records.find((r) => r.variant === 'main');
    expect(d01main?.status).toBe('ok');
    expect(d01main?.diagnostics?.residualsByYear).toHaveLength(31);
    expect(d01.records.map((r: { variant: string }) => r.variant).sort()).toEqual([
      'cubic',
      'last20',
      'level',
      'main',
      'no_controls',
    ]);
  });

  it('publishes the first run without alerts (nothing to compare with)', async () => {
    const res = await analyst.post(`/api/runs/${firstRun}/publish`);
    expect(res.status).toBe(200);
    expect(parseAnswer(PublishAnswerSchema, res)).toMatchObject({ previousRunId: null, alerts: 0 });
    const again = await analyst.post(`/api/runs/${firstRun}/publish`);
    expect(again.status).toBe(409);
    expect((await official.post(`/api/runs/${firstRun}/publish`)).status).toBe(403);
  });

  it('the demo income revision moves Mirefield Uplands across its band: one crossing alert, one mail per subscriber', async () => {
    const subscribed = await official.post('/api/subscriptions').send({ scope: 'region', delivery: 'instant' });
    expect(subscribed.status).toBe(201);
    expect(parseAnswer(SubscriptionAnswerSchema, subscribed).subscription).toMatchObject({
      scope: 'region',
      delivery: 'instant',
    });
    const review = (await analyst.get(`/api/runs/${firstRun}/review`)).body.districts as {
      code: string;
      standing: string;
      threshold: number;
    }[];
    // The demo region is built so that D13 has fallen back below its turn in a downturn.
    const candidate = review.find((d) => d.code === 'D13');
    expect(candidate?.standing).toBe('approaching');
    const csv = fs.readFileSync(path.join(__dirname, '..', '..', 'assets', 'demo-data', 'income-revision-2025.csv'));
    const up = await analyst.post('/api/uploads?commit=true').attach('file', csv, 'income-revision-2025.csv');
    expect(up.status).toBe(201);
    expect(parseAnswer(UploadAnswerSchema, up).noop).toBe(false);

    secondRun = await runToReview();
    const row = (await analyst.get(`/api/runs/${secondRun}/review`)).body.districts.find(
      (d: { code: string }) => d.code === candidate!.code,
    );
    expect(row.change.standingChanged).toBe(true);
    crossing = { code: candidate!.code, from: candidate!.standing, to: row.standing };
    expect(crossing).toEqual({ code: 'D13', from: 'approaching', to: 'past_turn' });

    const pub = await analyst.post(`/api/runs/${secondRun}/publish`);
    expect(pub.status).toBe(200);
    expect(pub.body.previousRunId).toBe(firstRun);
    const feed = parseAnswer(AlertFeedResponseSchema, await official.get('/api/alerts')).alerts;
    const crossings = feed.filter((a) => a.kind === 'crossing' && a.districtCode === crossing.code);
    expect(crossings).toHaveLength(1);
    expect(crossings[0].read).toBe(false);
    await until('crossing mail', async () =>
      (await mailsTo(DEMO.official)).some(
        (m) => m.text_body.includes(`(${crossing.code})`) && /threshold band/.test(m.subject),
      ),
    );
    const mails = (await mailsTo(DEMO.official)).filter(
      (m) => /threshold band/.test(m.subject) && m.text_body.includes(`(${crossing.code})`),
    );
    expect(mails).toHaveLength(1);
    expect(mails[0].text_body).toMatch(/Stop these e-mails: http:\/\/.*\/api\/subscriptions\/unsubscribe\?token=/);
    expect((await official.post(`/api/alerts/${crossings[0].id}/read`)).status).toBe(204);
    expect(
      (await official.get('/api/alerts')).body.alerts.find((a: { id: number }) => a.id === crossings[0].id).read,
    ).toBe(true);
  });

  it('explains the move as a data revision under an unchanged spec', async () => {
    const d = (await analyst.get(`/api/runs/${secondRun}/districts/${crossing.code}`)).body;
    expect(d.movement.specChanged).toBe(false);
    expect(d.movement.softwareChanged).toBe(false);
    // Same spec: all of the move is the data's; the spec's part is zero to the last digit.
    expect(d.movement.specPart).toBe(0);
    expect(d.movement.dataPart).toBeCloseTo(d.movement.current - d.movement.previous, 9);
  });

  it('a publish of an unchanged run sends nothing', async () => {
    const before = await t.db('caught_mail').count<{ count: string }[]>({ count: '*' });
    const alertsBefore = await t.db('alerts').count<{ count: string }[]>({ count: '*' });
    const third = await runToReview();
    const pub = await analyst.post(`/api/runs/${third}/publish`);
    expect(parseAnswer(PublishAnswerSchema, pub)).toMatchObject({ alerts: 0, mails: 0 });
    await deliverOutbox(app.locals.ctx);
    expect(await t.db('caught_mail').count<{ count: string }[]>({ count: '*' })).toEqual(before);
    expect(await t.db('alerts').count<{ count: string }[]>({ count: '*' })).toEqual(alertsBefore);
  });

  it('re-executes a run from its recorded spec and data hash to the same estimates, digit for digit', async () => {
    const res = await analyst.post(`/api/runs/${firstRun}/reproduce`);
    expect(res.status).toBe(202);
    expect(parseAnswer(RunStartedSchema, res).state).toBe('queued');
    const view = await until('reproduction in review', async () => {
      const r = (await analyst.get(`/api/runs/${res.body.id}`)).body;
      if (r.state === 'failed') throw new Error(r.error);
      return r.state === 'in_review' ? r : null;
    });
    const original = (await analyst.get(`/api/runs/${firstRun}`)).body;
    expect(view.dataHash).toBe(original.dataHash);
    expect(view.dataVersion).toBe(original.dataVersion);
    expect(view.reproduction).toEqual({
      of: firstRun,
      identical: true,
      differences: 0,
      softwareChanged: false,
      originalSoftware: expect.any(String),
      changedAnswers: [],
    });
    // The current data differ from the first run's (the revision): reading as of the old version matters.
    expect(view.dataVersion).toBeLessThan((await analyst.get(`/api/runs/${secondRun}`)).body.dataVersion);
  });

  it("answers the published run's readers with their contracts: region, district list, card, history, alerts, subscriptions, runs, specs", async () => {
    const region = parseAnswer(RegionResponseSchema, await official.get('/api/region'));
    const latest = Math.max(
      ...parseAnswer(RunListResponseSchema, await analyst.get('/api/runs'))
        .runs.filter((r) => r.state === 'published')
        .map((r) => r.id),
    );
    expect(region.run?.id).toBe(latest);
    expect(region.districts).toHaveLength(24);
    expect(region.districts.find((d) => d.code === crossing.code)?.estimate?.standing).toBe(crossing.to);
    const list = parseAnswer(DistrictListResponseSchema, await official.get('/api/districts'));
    expect(list.districts.find((d) => d.code === crossing.code)?.name).toBeDefined();
    const card = parseAnswer(
      DistrictEstimateResponseSchema,
      await official.get(`/api/districts/${crossing.code}/estimate`),
    );
    expect(card.main?.standing.standing).toBe(crossing.to);
    expect(card.run?.model.level).toBeGreaterThan(0);
    const history = parseAnswer(
      DistrictHistoryResponseSchema,
      await official.get(`/api/districts/${crossing.code}/history`),
    );
    expect(history.history.map((h) => h.runId)).toEqual(expect.arrayContaining([secondRun, firstRun]));
    const alerts = parseAnswer(
      DistrictAlertsResponseSchema,
      await official.get(`/api/districts/${crossing.code}/alerts`),
    );
    expect(alerts.alerts.some((a) => a.kind === 'crossing')).toBe(true);
    const subscriptions = parseAnswer(SubscriptionsResponseSchema, await official.get('/api/subscriptions'));
    expect(subscriptions.subscriptions).toHaveLength(1);
    const runs = parseAnswer(RunListResponseSchema, await analyst.get('/api/runs'));
    expect(runs.runs.map((r) => r.id)).toEqual(expect.arrayContaining([firstRun, secondRun]));
    const specs = parseAnswer(SpecsResponseSchema, await analyst.get('/api/specs'));
    expect(specs.specs.find((x) => x.id === specs.headlineSpecId)?.tracks.length).toBe(1);
  });

  it('holds mail while SMTP is down and delivers each exactly once when it is back', async () => {
    await official
      .post('/api/subscriptions')
      .send({ scope: 'districts', districtCodes: [crossing.code], delivery: 'digest' });
    const port = catcher.port;
    await catcher.stop();
    const back = await t
      .db('observations as o')
      .join('districts as d', 'd.id', 'o.district_id')
      .join('indicators as i', 'i.id', 'o.indicator_id')
      .where({ 'd.code': crossing.code, 'i.code': 'income_pc' })
      .orderBy('o.year', 'desc')
      .first('o.year');
    // Revert the revision: the district moves back.
    const uploads = parseAnswer(UploadListResponseSchema, await analyst.get('/api/uploads'));
    const revision = uploads.uploads.find((u) => u.fileName === 'income-revision-2025.csv')!;
    const reverted = await analyst.post(`/api/uploads/${revision.id}/revert`);
    expect(reverted.status).toBe(200);
    expect(parseAnswer(RevertAnswerSchema, reverted).reverted.id).toBe(revision.id);
    expect(back.year).toBeGreaterThan(2000);
    const run = await runToReview();
    const pub = await analyst.post(`/api/runs/${run}/publish`);
    expect(pub.body.mails).toBeGreaterThanOrEqual(2);
    const pending = await until('failed attempts', async () => {
      const rows = await t.db('outbox').where({ run_id: run }).select('*');
      return rows.length &&
        rows.every((r: { attempts: number; status: string }) => r.attempts >= 1 && r.status === 'pending')
        ? rows
        : null;
    });
    catcher = await startMailCatcher(t.db, port);
    await until(
      'delivery after SMTP is back',
      async () => {
        await deliverOutbox(app.locals.ctx);
        const rows = await t.db('outbox').where({ run_id: run }).select('status');
        return rows.every((r: { status: string }) => r.status === 'sent');
      },
      30_000,
      500,
    );
    await deliverOutbox(app.locals.ctx);
    // Each outbox row's Message-ID names the row: one arrival per row.
    for (const row of pending) {
      const got = (await mailsTo(row.to_address)).filter((m) => m.message_id?.startsWith(`<outbox-${row.id}-`));
      expect(got).toHaveLength(1);
    }
  });

  it('a reproduction on newer software lists the changed answers; once published, card and brief carry a dated correction', async () => {
    const latest = await t.db('runs').where({ state: 'published' }).orderBy('published_at', 'desc').first('id');
    const target = await t
      .db('run_estimates as e')
      .join('districts as d', 'd.id', 'e.district_id')
      .where({ 'e.run_id': latest.id, 'e.variant': 'main', 'e.status': 'ok' })
      .whereNotNull('e.threshold')
      .orderBy('d.code')
      .first('d.code', 'e.district_id');
    // What an older engine published: another software version and, for one district, another threshold.
    await t.db('runs').where({ id: latest.id }).update({ software_version: '0.0.1-older' });
    await t
      .db('run_estimates')
      .where({ run_id: latest.id, district_id: target.district_id, variant: 'main' })
      .update({
        result: t.db.raw(
          `jsonb_set(result, '{threshold,level}', to_jsonb((result->'threshold'->>'level')::float8 * 1.5))`,
        ),
      });
    const res = await analyst.post(`/api/runs/${latest.id}/reproduce`);
    expect(res.status).toBe(202);
    const view = await until('corrected reproduction in review', async () => {
      const r = (await analyst.get(`/api/runs/${res.body.id}`)).body;
      if (r.state === 'failed') throw new Error(r.error);
      return r.state === 'in_review' ? r : null;
    });
    expect(view.reproduction.softwareChanged).toBe(true);
    expect(view.reproduction.originalSoftware).toBe('0.0.1-older');
    expect(view.reproduction.changedAnswers.map((c: { code: string; fields: string[] }) => [c.code, c.fields])).toEqual(
      [[target.code, ['threshold']]],
    );
    // not yet published: officials see no notice
    expect((await official.get(`/api/districts/${target.code}/estimate`)).body.correction).toBeNull();
    expect((await analyst.post(`/api/runs/${res.body.id}/publish`)).status).toBe(200);
    const card = (await official.get(`/api/districts/${target.code}/estimate`)).body;
    expect(card.correction.text).toMatch(
      new RegExp(
        `^Threshold corrected in software version ${view.softwareVersion.replace(/\./g, '\\.')} on \\d{4}-\\d{2}-\\d{2} \\(first published with version 0\\.0\\.1-older\\)\\.$`,
      ),
    );
    const brief = (await official.get(`/api/briefs/district/${target.code}`)).body;
    expect(brief.correctionNotice).toBe(card.correction.text);
    const other = await t.db('districts').whereNot({ id: target.district_id }).orderBy('code').first('code');
    expect((await official.get(`/api/districts/${other.code}/estimate`)).body.correction).toBeNull();
  });
});

describe('saved specs', () => {
  it("lists the starting spec, as the headline track's, once the first track exists on a fresh database", async () => {
    const fresh = await freshDatabase();
    await ensureDemoAccounts(fresh.db);
    const a = testApp(fresh.db);
    const s = await listen(a);
    try {
      const agent = (await signInAs(s, DEMO.analyst)).agent;
      const empty = parseAnswer(SpecsResponseSchema, await agent.get('/api/specs'));
      expect(empty).toEqual({ specs: [], headlineSpecId: null });
      expect((await agent.get('/api/tracks')).status).toBe(200); // the first track is made on first use
      const res = await agent.get('/api/specs');
      expect(res.status).toBe(200);
      const answer = parseAnswer(SpecsResponseSchema, res);
      expect(answer.specs.map((x) => x.id)).toEqual([answer.headlineSpecId]);
      expect(answer.specs[0]).toMatchObject({ name: 'Regional default', tracks: [expect.any(String)] });
    } finally {
      await closeServer(s, a);
      await fresh.drop();
    }
  });
});
