/**
 * The tracks migration over a database of the previous schema holding data: two saved
 * specs (CO2 per person, the default; PM2.5), published runs of both, a run in review,
 * alerts, a subscription and an analyst's note. After migrating: one track per emissions
 * indicator, each run on its indicator's track, the headline is the default spec's
 * indicator, the subscription follows all tracks, and published history, alerts and notes
 * still read. Then the migration rolls back to the previous schema with the data kept.
 * Every row is invented for this test.
 */
import { randomBytes } from 'node:crypto';
import type { Knex } from 'knex';
import { createDb } from '../../api/db';
import { feed } from '../../api/alerts/service';
import { districtEstimate, districtHistory } from '../../api/estimates/service';
import { listTracks } from '../../api/tracks/service';
import { dropDatabase, ensureDatabase, migrationsDir } from '../../scripts/database';
import { TEST_CLUSTER, testDatabaseUrl } from '../support/test-cluster';

jest.setTimeout(120_000);

const PREVIOUS = '20261204120100_observations_natural_key.ts';
const TRACKS = '20261205000000_create_tracks.ts';
const dir = { directory: migrationsDir, loadExtensions: ['.ts'] };

const name = `cw_migr_${process.pid}_${randomBytes(4).toString('hex')}`;
let db: Knex;

beforeAll(async () => {
  await ensureDatabase(TEST_CLUSTER.port, name);
  db = createDb(testDatabaseUrl(name), { pool: { min: 0, max: 3 } });
  // Up to the last migration before tracks, one at a time.
  for (;;) {
    const [, applied] = await db.migrate.up(dir);
    if ((applied as string[]).includes(PREVIOUS)) break;
    if (!(applied as string[]).length) throw new Error(`never reached ${PREVIOUS}`);
  }
});
afterAll(async () => {
  await db?.destroy();
  await dropDatabase(TEST_CLUSTER.port, name);
});

const record = (standing: string, level: number) => ({
  variant: 'main',
  status: 'ok',
  standing: { standing, intervalBounded: true, intervalMethod: 'fieller', levelLo: level - 1, levelHi: level + 1 },
  shape: { shape: 'inverted_u' },
  threshold: { level, extrapolated: false, fieller: { kind: 'bounded' } },
  gapPercent: 12,
  lastYear: 2022,
  range: { levelNow: level - 2 },
});

const specRow = (name: string, emissions: string, isDefault: boolean) => ({
  name,
  emissions_indicator: emissions,
  driver_indicator: 'income_pc',
  form: 'quadratic',
  transform: 'log',
  covariance: 'newey_west',
  is_default: isDefault,
});

const snapshot = (specId: number, name: string, emissions: string) =>
  JSON.stringify({ savedSpecId: specId, name, selection: { emissions, driver: 'income_pc', controls: [] }, model: {} });

let ids: {
  user: number;
  district: number;
  co2Runs: number[];
  pm25Run: number;
  reviewRun: number;
};

it('holds data in the previous schema', async () => {
  await db('indicators').insert([
    { code: 'emissions_pc', name: 'CO2 per person', unit: 't CO₂ per person' },
    { code: 'income_pc', name: 'Real income per person', unit: 'currency units per person' },
    { code: 'pm25', name: 'Fine particles (PM2.5)', unit: 'µg/m³' },
  ]);
  const [{ id: district }] = await db('districts').insert({ code: 'D01', name: 'Test Vale' }).returning('id');
  const [{ id: user }] = await db('users').insert({ email: 'official@test.example', role: 'official' }).returning('id');
  const [{ id: co2Spec }] = await db('model_specs')
    .insert(specRow('CO2 default', 'emissions_pc', true))
    .returning('id');
  const [{ id: pmSpec }] = await db('model_specs')
    .insert(specRow('PM2.5 spec', 'pm25', false))
    .returning('id');
  const run = async (specId: number, name: string, emissions: string, state: string, publishedAt: string | null) =>
    Number(
      (
        await db('runs')
          .insert({
            spec_id: specId,
            spec: snapshot(specId, name, emissions),
            state,
            software_version: 'test',
            data_version: 1,
            published_at: publishedAt,
          })
          .returning('id')
      )[0].id,
    );
  const co2a = await run(co2Spec, 'CO2 default', 'emissions_pc', 'published', '2026-01-10T00:00:00Z');
  const pm = await run(pmSpec, 'PM2.5 spec', 'pm25', 'published', '2026-02-10T00:00:00Z');
  const co2b = await run(co2Spec, 'CO2 default', 'emissions_pc', 'published', '2026-03-10T00:00:00Z');
  const review = await run(co2Spec, 'CO2 default', 'emissions_pc', 'in_review', null);
  const estimate = (runId: number, standing: string, level: number) => ({
    run_id: runId,
    district_id: district,
    variant: 'main',
    status: 'ok',
    standing,
    shape: 'inverted_u',
    threshold: level,
    result: JSON.stringify(record(standing, level)),
  });
  await db('run_estimates').insert([
    estimate(co2a, 'approaching', 10),
    estimate(pm, 'past_turn', 20),
    estimate(co2b, 'at_turn', 11),
    estimate(review, 'at_turn', 11),
  ]);
  await db('run_notes').insert({ run_id: co2b, district_id: district, note: 'Checked with the district office.' });
  await db('alerts').insert({
    run_id: co2b,
    previous_run_id: co2a,
    district_id: district,
    kind: 'crossing',
    details: JSON.stringify({ from: 'approaching', to: 'at_turn', districtCode: 'D01', districtName: 'Test Vale' }),
  });
  await db('subscriptions').insert({ user_id: user, scope: 'region', kinds: ['crossing', 'threshold_shift'] });
  ids = { user: Number(user), district: Number(district), co2Runs: [co2a, co2b], pm25Run: pm, reviewRun: review };
});

it('migrates: a track per indicator, runs on their tracks, the default spec’s indicator as headline', async () => {
  const [, applied] = await db.migrate.latest(dir);
  expect(applied).toContain(TRACKS);
  // The default-spec flag gives way to the headline track.
  expect(await db.schema.hasColumn('model_specs', 'is_default')).toBe(false);
  const tracks = await db('tracks').orderBy('code').select('id', 'code', 'emissions_indicator', 'name', 'state');
  // Codes as the migration derives them from the indicator codes (lower case, `_` → `-`).
  expect(tracks.map((t) => [t.code, t.emissions_indicator, t.state])).toEqual([
    ['emissions-pc', 'emissions_pc', 'active'],
    ['pm25', 'pm25', 'active'],
  ]);
  expect(tracks.map((t) => t.name)).toEqual(['CO2 per person', 'Fine particles (PM2.5)']);
  const trackOf = new Map(
    (await db('runs').select('id', 'track_id')).map((r: { id: number; track_id: number }) => [r.id, r.track_id]),
  );
  const co2 = tracks[0].id;
  const pm = tracks[1].id;
  expect([...ids.co2Runs, ids.reviewRun].map((id) => trackOf.get(id))).toEqual([co2, co2, co2]);
  expect(trackOf.get(ids.pm25Run)).toBe(pm);
  const headline = await db('settings').where({ key: 'headline_track' }).first('value');
  expect(headline.value).toBe('emissions-pc');
  const sub = await db('subscriptions').first('all_tracks', 'track_ids');
  expect(sub).toEqual({ all_tracks: true, track_ids: [] });

  const listed = await listTracks(db);
  expect(listed.map((t) => [t.code, t.headline, t.publishedRunId])).toEqual([
    ['emissions-pc', true, ids.co2Runs[1]],
    ['pm25', false, ids.pm25Run],
  ]);
});

it('reads published history, the card with its note, and alerts per track after the migration', async () => {
  // Without a track: the headline (CO2) track's published runs only, newest first.
  const history = await districtHistory(db, 'D01');
  expect(history.history.map((h) => [h.runId, h.standing])).toEqual([
    [ids.co2Runs[1], 'at_turn'],
    [ids.co2Runs[0], 'approaching'],
  ]);
  const pmHistory = await districtHistory(db, 'D01', 'pm25');
  expect(pmHistory.history.map((h) => [h.runId, h.standing])).toEqual([[ids.pm25Run, 'past_turn']]);
  const card = await districtEstimate(db, 'D01');
  expect(card.run?.id).toBe(ids.co2Runs[1]);
  expect(card.note?.note).toBe('Checked with the district office.');
  expect(card.tracks.map((r) => [r.code, r.standing, r.runId])).toEqual([
    ['emissions-pc', 'at_turn', ids.co2Runs[1]],
    ['pm25', 'past_turn', ids.pm25Run],
  ]);
  const alerts = await feed(
    db,
    { id: ids.user, email: 'official@test.example', name: '', role: 'official', active: true },
    {
      limit: 10,
    },
  );
  expect(alerts.map((a) => [a.kind, a.track, a.runId])).toEqual([['crossing', 'emissions-pc', ids.co2Runs[1]]]);
});

it('rolls back to the previous schema with the data kept', async () => {
  for (;;) {
    const [, undone] = await db.migrate.down(dir);
    if ((undone as string[]).includes(TRACKS)) break;
    if (!(undone as string[]).length) throw new Error(`never undid ${TRACKS}`);
  }
  expect(await db.schema.hasTable('tracks')).toBe(false);
  expect(await db.schema.hasColumn('runs', 'track_id')).toBe(false);
  expect(await db.schema.hasColumn('subscriptions', 'all_tracks')).toBe(false);
  const [{ count }] = await db('runs').count<{ count: string }[]>({ count: '*' });
  expect(Number(count)).toBe(4);
  expect(await db('settings').where({ key: 'headline_track' }).first()).toBeUndefined();
  // The default-spec flag came back with the headline track's (CO2) spec as the default.
  const defaults = await db('model_specs').where({ is_default: true }).select('emissions_indicator');
  expect(defaults.map((r: { emissions_indicator: string }) => r.emissions_indicator)).toEqual(['emissions_pc']);
  const { rows } = await db.raw(`SELECT indexname FROM pg_indexes WHERE tablename = 'runs' ORDER BY indexname`);
  expect(rows.map((r: { indexname: string }) => r.indexname)).toEqual(
    expect.arrayContaining(['runs_one_active_per_spec', 'runs_published']),
  );
});
