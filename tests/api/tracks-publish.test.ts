/**
 * Two tracks over the demo region: the CO2 track (the headline, the demo's emissions per
 * person) and a PM2.5 track on an invented fine-particle series added to the test's
 * catalogue. Publishing PM2.5 runs leaves what officials see for CO2 unchanged, raises no
 * alert on the CO2 track, compares PM2.5 only with PM2.5, and e-mails only the people whose
 * subscriptions cover PM2.5. The card carries a row per shown track. The quarterly schedule
 * starts one run per active track and none for a paused one.
 */
import type { Server } from 'node:http';
import type TestAgent from 'supertest/lib/agent';
import type { CrestwatchApp } from '../../api/app';
import { seedDemoIfEmpty } from '../../api/demo/seed';
import type { Jobs } from '../../api/jobs/boss';
import { allHandlers } from '../../api/jobs/handlers';
import { QUEUES } from '../../api/common/queues';
import { ensureDemoAccounts } from '../../api/people/service';
import { DEFAULT_SPEC } from '../../api/specs/schema';
import { AlertFeedResponseSchema, DistrictAlertsResponseSchema } from '../../contracts/alerts';
import { DistrictEstimateResponseSchema, RegionResponseSchema } from '../../contracts/estimates';
import { PublishAnswerSchema, RunListResponseSchema, RunStartedSchema } from '../../contracts/runs';
import { TrackAnswerSchema, TracksResponseSchema } from '../../contracts/tracks';
import { closeServer, DEMO, listen, signInAs } from '../support/auth';
import { parseAnswer } from '../support/contract';
import { testJobs, until, workIn } from '../support/jobs';
import { testApp } from '../support/test-app';
import { freshDatabase, type TestDatabase } from '../support/test-db';

jest.setTimeout(240_000);

let t: TestDatabase;
let app: CrestwatchApp;
let server: Server;
let jobs: Jobs;
let admin: TestAgent;
let analyst: TestAgent;
let official: TestAgent;

/**
 * An invented PM2.5 series (µg/m³, annual mean) for every district and year that has
 * income: a rise-then-fall in log income whose turn differs by district, plus a small
 * deterministic wobble. Invented for this test; no published dataset.
 */
async function addPm25Series(db: TestDatabase['db'], shiftFor: (code: string) => number = () => 0): Promise<void> {
  const [{ id: pm25 }] = await db('indicators')
    .insert({
      code: 'pm25',
      name: 'Fine particles (PM2.5), annual mean',
      unit: 'µg/m³',
      description: 'Invented test series',
      source: 'Test catalogue (invented)',
      licence: 'CC0',
    })
    .onConflict('code')
    .merge()
    .returning('id');
  await writePm25(db, Number(pm25), shiftFor);
}

async function writePm25(db: TestDatabase['db'], pm25: number, shiftFor: (code: string) => number): Promise<void> {
  const rows: { district_id: number; code: string; year: number; value: number }[] = await db('observations as o')
    .join('indicators as i', 'i.id', 'o.indicator_id')
    .join('districts as d', 'd.id', 'o.district_id')
    .where('i.code', 'income_pc')
    .select('o.district_id', 'd.code', 'o.year', 'o.value');
  const turnOf = (code: string) => 9.6 + (code.charCodeAt(code.length - 1) % 7) * 0.12 + shiftFor(code);
  await db('observations')
    .insert(
      rows.map((r) => {
        const u = Math.log(r.value) - turnOf(r.code);
        const wobble = 0.15 * Math.sin(r.year * 1.7 + r.district_id);
        return {
          district_id: r.district_id,
          indicator_id: pm25,
          year: r.year,
          value: Math.max(1, 22 - 9 * u * u + wobble),
        };
      }),
    )
    .onConflict(['district_id', 'indicator_id', 'year'])
    .merge();
}

async function runToReview(agent: TestAgent, track: string): Promise<number> {
  const res = await agent.post('/api/runs').send({ track });
  expect(res.status).toBe(202);
  const started = parseAnswer(RunStartedSchema, res);
  expect(started.track).toBe(track);
  await until(`run ${started.id} in review`, async () => {
    const r = (await agent.get(`/api/runs/${started.id}`)).body;
    if (r.state === 'failed') throw new Error(`run failed: ${r.error}`);
    return r.state === 'in_review';
  });
  return started.id;
}

async function publish(id: number) {
  const res = await analyst.post(`/api/runs/${id}/publish`);
  expect(res.status).toBe(200);
  return parseAnswer(PublishAnswerSchema, res);
}

const standingsOf = (r: { districts: { code: string; estimate: { standing: string } | null }[] }) =>
  Object.fromEntries(r.districts.map((d) => [d.code, d.estimate?.standing ?? null]));

beforeAll(async () => {
  t = await freshDatabase();
  await seedDemoIfEmpty(t.db);
  await ensureDemoAccounts(t.db);
  await addPm25Series(t.db);
  jobs = await testJobs(t.url);
  app = testApp(t.db);
  app.locals.ctx.jobs = jobs;
  await workIn(app.locals.ctx, jobs);
  server = await listen(app);
  admin = (await signInAs(server, DEMO.admin)).agent;
  analyst = (await signInAs(server, DEMO.analyst)).agent;
  official = (await signInAs(server, DEMO.official)).agent;
});
afterAll(async () => {
  await jobs?.stop();
  await closeServer(server, app);
  await t.drop();
});

describe('tracks', () => {
  let co2: string;
  let co2Run: number;
  let co2Region: Record<string, string | null>;
  let pm25First: number;

  it('publishes the headline (CO2) track, then creates a PM2.5 track from a saved PM2.5 spec', async () => {
    const tracks = parseAnswer(TracksResponseSchema, await official.get('/api/tracks')).tracks;
    expect(tracks).toHaveLength(1);
    expect(tracks[0]).toMatchObject({ headline: true, state: 'active', publishedRunId: null });
    co2 = tracks[0].code;
    expect(tracks[0].indicator.code).toBe('emissions_pc');
    co2Run = await runToReview(analyst, co2);
    expect(await publish(co2Run)).toMatchObject({ previousRunId: null, alerts: 0 });
    co2Region = standingsOf(parseAnswer(RegionResponseSchema, await official.get('/api/region')));

    const spec = await analyst
      .post('/api/specs')
      .send({ ...DEFAULT_SPEC, name: 'PM2.5 regional', emissionsIndicator: 'pm25' });
    expect(spec.status).toBe(201);
    expect(
      (await analyst.post('/api/tracks').send({ code: 'pm25', name: 'PM2.5', specId: spec.body.spec.id })).status,
    ).toBe(403);
    const created = await admin.post('/api/tracks').send({ code: 'pm25', name: 'PM2.5', specId: spec.body.spec.id });
    expect(created.status).toBe(201);
    const track = parseAnswer(TrackAnswerSchema, created).track;
    expect(track).toMatchObject({ code: 'pm25', headline: false, state: 'active', publishedRunId: null });
    expect(track.indicator).toMatchObject({ code: 'pm25', unit: 'µg/m³', source: 'Test catalogue (invented)' });
    // A CO2 spec cannot be a PM2.5 track's spec.
    const wrong = await analyst.put('/api/tracks/pm25/spec').send({ specId: tracks[0].specId });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.code).toBe('indicator_mismatch');
  });

  it('the first PM2.5 publish raises no alert and leaves the CO2 standings as they were', async () => {
    pm25First = await runToReview(analyst, 'pm25');
    const review = (await analyst.get(`/api/runs/${pm25First}/review`)).body;
    expect(review.track.code).toBe('pm25');
    // Compared with nothing: never with the CO2 run.
    expect(review.previousRunId).toBeNull();
    expect(await publish(pm25First)).toMatchObject({ previousRunId: null, alerts: 0, mails: 0 });

    const region = parseAnswer(RegionResponseSchema, await official.get('/api/region'));
    expect(region.track.code).toBe(co2);
    expect(region.run?.id).toBe(co2Run);
    expect(standingsOf(region)).toEqual(co2Region);
    const pmRegion = parseAnswer(RegionResponseSchema, await official.get('/api/region?track=pm25'));
    expect(pmRegion.run?.id).toBe(pm25First);
    expect(pmRegion.run?.units.emissions.unit).toBe('µg/m³');
    expect(pmRegion.districts).toHaveLength(24);
  });

  it('the card has a row per track and shows the chosen track below', async () => {
    const code = Object.keys(co2Region)[0];
    const card = parseAnswer(DistrictEstimateResponseSchema, await official.get(`/api/districts/${code}/estimate`));
    expect(card.track.code).toBe(co2);
    expect(card.tracks.map((r) => r.code)).toEqual([co2, 'pm25']);
    expect(card.tracks[0].runId).toBe(co2Run);
    expect(card.tracks[1].runId).toBe(pm25First);
    expect(card.tracks[0].standing).toBe(co2Region[code]);
    const pm = parseAnswer(
      DistrictEstimateResponseSchema,
      await official.get(`/api/districts/${code}/estimate?track=pm25`),
    );
    expect(pm.track.code).toBe('pm25');
    expect(pm.run?.id).toBe(pm25First);
    expect(pm.run?.units.emissions.code).toBe('pm25');
    expect((await official.get(`/api/districts/${code}/estimate?track=nope`)).status).toBe(404);
  });

  it('a revised PM2.5 publish alerts PM2.5 subscribers only; no alert on the CO2 track', async () => {
    const subscribe = (agent: TestAgent, tracks: 'all' | string[]) =>
      agent.post('/api/subscriptions').send({ scope: 'region', delivery: 'instant', tracks });
    expect((await subscribe(official, [co2])).status).toBe(201);
    expect((await subscribe(analyst, ['pm25'])).status).toBe(201);
    expect((await subscribe(admin, 'all')).status).toBe(201);
    expect((await subscribe(official, ['nope'])).status).toBe(400);

    // Half the districts' PM2.5 turns move by a quarter of a log-income unit (invented revision).
    await addPm25Series(t.db, (code) => (code.charCodeAt(code.length - 1) % 2 ? 0.25 : 0));
    const second = await runToReview(analyst, 'pm25');
    const answer = await publish(second);
    expect(answer.previousRunId).toBe(pm25First);
    expect(answer.alerts).toBeGreaterThan(0);

    const alerts: { kind: string; run_id: number; previous_run_id: number }[] = await t
      .db('alerts')
      .select('kind', 'run_id', 'previous_run_id');
    const byKind: Record<string, number> = {};
    for (const a of alerts) byKind[a.kind] = (byKind[a.kind] ?? 0) + 1;
    const mails: { user_id: number; subject: string }[] = await t
      .db('outbox')
      .where({ run_id: second })
      .select('user_id', t.db.raw(`message->>'subject' AS subject`));
    const users: { id: number; email: string }[] = await t.db('users').select('id', 'email');
    const emailOf = new Map(users.map((u) => [u.id, u.email]));
    const mailCounts: Record<string, number> = {};
    for (const m of mails) mailCounts[emailOf.get(m.user_id)!] = (mailCounts[emailOf.get(m.user_id)!] ?? 0) + 1;
    // The figures the closing note reports.
    console.log(
      `cross-track publish: ${alerts.length} alerts, all on the PM2.5 track ${JSON.stringify(byKind)}; ` +
        `CO2 track alerts 0; mails ${JSON.stringify(mailCounts)}`,
    );

    // Every alert compares the two PM2.5 runs: none names the CO2 run.
    expect(alerts.length).toBe(answer.alerts);
    for (const a of alerts) expect([a.run_id, a.previous_run_id]).toEqual([second, pm25First]);
    // Instant mails: one per alert to the PM2.5 subscriber and to the all-tracks one, none to the CO2-only one.
    expect(mailCounts[DEMO.official]).toBeUndefined();
    expect(mailCounts[DEMO.analyst]).toBe(alerts.length);
    expect(mailCounts[DEMO.admin]).toBe(alerts.length);
    for (const m of mails) expect(m.subject).toMatch(/^Crestwatch, PM2\.5: /);

    const officialFeed = parseAnswer(AlertFeedResponseSchema, await official.get('/api/alerts'));
    expect(officialFeed.alerts).toHaveLength(0);
    const analystFeed = parseAnswer(AlertFeedResponseSchema, await analyst.get('/api/alerts'));
    expect(analystFeed.alerts).toHaveLength(alerts.length);
    expect(new Set(analystFeed.alerts.map((a) => a.track))).toEqual(new Set(['pm25']));
    const code = analystFeed.alerts[0].districtCode;
    const co2Alerts = parseAnswer(
      DistrictAlertsResponseSchema,
      await official.get(`/api/districts/${code}/alerts?track=${co2}`),
    );
    expect(co2Alerts.alerts).toHaveLength(0);

    // What officials see for CO2 is what it was before any PM2.5 publish.
    const region = parseAnswer(RegionResponseSchema, await official.get(`/api/region?track=${co2}`));
    expect(region.run?.id).toBe(co2Run);
    expect(standingsOf(region)).toEqual(co2Region);
  });

  it('the schedule starts one run per active track and none for a paused one', async () => {
    const spec = await analyst
      .post('/api/specs')
      .send({ ...DEFAULT_SPEC, name: 'PM2.5 paused copy', emissionsIndicator: 'pm25' });
    const third = await admin
      .post('/api/tracks')
      .send({ code: 'pm25-paused', name: 'PM2.5 (paused)', specId: spec.body.spec.id });
    expect(third.status).toBe(201);
    const paused = await admin.patch('/api/tracks/pm25-paused').send({ state: 'paused' });
    expect(parseAnswer(TrackAnswerSchema, paused).track.state).toBe('paused');

    await allHandlers(app.locals.ctx)[QUEUES.scheduledRun]({}, { retryCount: 0, retryLimit: 1, id: 'test' });
    const runs = parseAnswer(RunListResponseSchema, await analyst.get('/api/runs')).runs.filter(
      (r) => r.trigger === 'schedule',
    );
    const pmRuns = parseAnswer(RunListResponseSchema, await analyst.get('/api/runs?track=pm25')).runs;
    expect(new Set(pmRuns.map((r) => r.track))).toEqual(new Set(['pm25']));
    // Two active tracks (CO2, PM2.5): two runs; the paused track: none.
    expect(runs.map((r) => r.track).sort()).toEqual([co2, 'pm25'].sort());
    // A second tick while they are still going starts nothing more and does not fail.
    await allHandlers(app.locals.ctx)[QUEUES.scheduledRun]({}, { retryCount: 0, retryLimit: 1, id: 'test' });
    const after = parseAnswer(RunListResponseSchema, await analyst.get('/api/runs')).runs.filter(
      (r) => r.trigger === 'schedule' && (r.state === 'queued' || r.state === 'running'),
    );
    expect(after.length).toBeLessThanOrEqual(2);
    // Archiving the headline is refused; archiving another track takes it off the list officials see.
    expect((await admin.patch(`/api/tracks/${co2}`).send({ state: 'archived' })).status).toBe(409);
    await admin.patch('/api/tracks/pm25-paused').send({ state: 'archived' });
    const code = Object.keys(co2Region)[0];
    const card = parseAnswer(DistrictEstimateResponseSchema, await official.get(`/api/districts/${code}/estimate`));
    expect(card.tracks.map((r) => r.code)).toEqual([co2, 'pm25']);
  });

  it('admins rename a track and choose the headline; reads without a track follow the headline', async () => {
    expect((await analyst.patch('/api/tracks/pm25').send({ headline: true })).status).toBe(403);
    expect((await admin.post('/api/tracks').send({ code: 'pm25', name: 'Again', specId: 1 })).status).toBe(409);
    expect((await admin.post('/api/tracks').send({ code: 'PM 2.5', name: 'Bad', specId: 1 })).status).toBe(400);
    const renamed = await admin.patch('/api/tracks/pm25').send({ name: 'Fine particles', headline: true });
    expect(parseAnswer(TrackAnswerSchema, renamed).track).toMatchObject({ name: 'Fine particles', headline: true });
    const tracks = parseAnswer(TracksResponseSchema, await official.get('/api/tracks')).tracks;
    expect(tracks[0].code).toBe('pm25');
    expect(tracks.filter((x) => x.headline)).toHaveLength(1);
    // A spec a track's next run uses cannot be archived.
    const inUse = await analyst.delete(`/api/specs/${tracks[0].specId}`);
    expect(inUse.status).toBe(409);
    expect(inUse.body.error.code).toBe('spec_in_use');
    const region = parseAnswer(RegionResponseSchema, await official.get('/api/region'));
    expect(region.track).toMatchObject({ code: 'pm25', name: 'Fine particles' });
    // The scheduled runs of the previous test finish first (one active run per track).
    await until('scheduled runs done', async () =>
      parseAnswer(RunListResponseSchema, await analyst.get('/api/runs')).runs.every(
        (r) => r.state !== 'queued' && r.state !== 'running',
      ),
    );
    const started = parseAnswer(RunStartedSchema, await analyst.post('/api/runs').send({}));
    expect(started.track).toBe('pm25');
    // Back to CO2 as the headline for whoever reads this database next.
    await admin.patch(`/api/tracks/${co2}`).send({ headline: true });
    expect(parseAnswer(RegionResponseSchema, await official.get('/api/region')).track.code).toBe(co2);
  });
});
