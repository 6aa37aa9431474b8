/**
 * npm run bench:run — three tracks (CO2 per person, PM2.5, SO2 per person) over 3,000
 * invented districts × 40 years (one control, Newey–West): per track one run with one
 * worker process and one with two, each read, fitted (every variant), written and
 * published (a track's first publish compares with nothing, so raises no alerts); then
 * 7,000 more districts and the CO2 track again over all 10,000, one and two workers.
 * Prints per run the time from the moment a worker picks the run up to review, the
 * publish, the share of each phase (the start's read, the pooled fit, the chunks' fits,
 * their writes, and the rest: queue and bookkeeping), the load average beside every
 * figure, and a yardstick measured just before each track: the same district fits in
 * this process alone, one thread, no database. PM2.5 and SO2 are the CO2 series bent
 * per district and year (deterministic), so each track fits series of its own.
 *
 * Chunks' phases are summed over chunks; a chunk's fits and its write overlap (the COPY
 * streams finished slices while later ones fit), so "writes" is what the write added
 * after the last fit of its chunk. A worker process works two chunks at once (the next
 * one fits while the last one writes), and two workers run theirs side by side, so the
 * summed phases exceed the wall time and "queue, rest" (the wall time less the others)
 * reads 0: it is what the overlap hid.
 *
 * Through the server: the region grown to 6,452 districts, the server (api/server.ts) and
 * one worker each in a process of their own, an analyst signed in through the OAuth
 * stand-in starts the CO2 track's run with POST /api/runs and polls GET /api/runs/:id
 * every 50 ms; the figure is the time from sending the start to seeing "in review", then
 * the publish through POST /api/runs/:id/publish.
 *
 * Environment: BENCH_DISTRICTS (default 3000), BENCH_SERVER_DISTRICTS (default 6452; 0
 * skips the run through the server), BENCH_LARGE (default 10000; 0 skips the large run),
 * BENCH_WORKERS (default "1,2").
 */
import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import { loadConfig } from '../api/config';
import type { AppContext } from '../api/context';
import { insertDemoIndicators } from '../api/demo/seed-store';
import os from 'node:os';
import { currentDataVersion, loadSeries } from '../api/runs/data-store';
import { fitDistrict } from '../api/runs/district-fit';
import { fitPooled } from '../api/runs/jobs';
import { publishRun, startRun } from '../api/runs/service';
import { DEFAULT_SPEC } from '../api/specs/schema';
import { createSpec } from '../api/specs/service';
import { createTrack, patchTrack, resolveTrack } from '../api/tracks/service';
import * as runStore from '../api/runs/store';
import { dropDatabase, ensureDatabase } from '../scripts/database';
import * as pg from '../scripts/pg';
import { prepareTestTemplate } from '../scripts/test-template';
import { insertSyntheticDistricts } from '../tests/support/synthetic';
import { benchContext, freePort, signIn, spawnReady } from './bench-db';
import { ensureDemoAccounts } from '../api/people/service';
import fs from 'node:fs';
import { TEMPLATE_DB, TEST_CLUSTER, testDatabaseUrl } from '../tests/support/test-cluster';

const DISTRICTS = Number(process.env.BENCH_DISTRICTS ?? 3000);
const LARGE = Number(process.env.BENCH_LARGE ?? 10000);
const WORKERS = (process.env.BENCH_WORKERS ?? '1,2').split(',').map(Number);
const THROUGH_SERVER = Number(process.env.BENCH_SERVER_DISTRICTS ?? 6452);
const YEARS = 40;
const root = path.resolve(__dirname, '..');
const DB = 'cw_bench_run';

function startWorkers(n: number, url: string): Promise<ChildProcess[]> {
  return Promise.all(
    Array.from(
      { length: n },
      () =>
        new Promise<ChildProcess>((resolve, reject) => {
          const child = spawn(process.execPath, ['--import', 'tsx', path.join(root, 'api', 'worker.ts')], {
            cwd: root,
            env: { ...process.env, CRESTWATCH_MODE: 'test', DATABASE_URL: url, LOG_REQUESTS: '0' },
            stdio: ['ignore', 'pipe', 'inherit'],
          });
          child.stdout!.on('data', (b: Buffer) => {
            if (b.toString().includes('is working jobs')) resolve(child);
          });
          child.once('exit', (code) => reject(new Error(`worker exited ${code}`)));
        }),
    ),
  );
}

const load = () => os.loadavg()[0];

/** The yardstick: every district fit of a run's spec in this process, no database (series read untimed). */
async function fitsAlone(ctx: AppContext, runId: number): Promise<number> {
  const run = (await runStore.findRun(ctx.db, runId))!;
  const series = await loadSeries(ctx.db, run.dataVersion!, run.spec.selection);
  const pooledFit = fitPooled(series, run.spec);
  const pooled = pooledFit.status === 'ok' ? (pooledFit as Exclude<typeof pooledFit, { status: 'failed' }>) : null;
  const model = { spec: run.spec.model, controls: run.spec.selection.controls };
  const t0 = performance.now();
  for (const s of series) fitDistrict(model, s.data, pooled as never);
  return performance.now() - t0;
}

const BENCH_CALLER = {
  id: 0,
  email: 'bench@crestwatch.example',
  name: 'bench',
  role: 'analyst',
  active: true,
} as never;

/** The other two tracks: their series are the CO2 series bent per district and year. */
const OTHER_TRACKS = [
  { code: 'pm25', name: 'PM2.5', indicator: 'pm25', scale: 3.1, bend: 0.08 },
  { code: 'so2', name: 'SO2 per person', indicator: 'so2_pc', scale: 1.7, bend: 0.12 },
] as const;

/** The yardstick for a track before its run: a throwaway run row gives the spec snapshot and data version. */
async function yardstick(ctx: AppContext, track: string): Promise<number> {
  const probe = await startRun({ ...ctx, jobs: { ...ctx.jobs!, send: async () => null, notify: () => {} } }, null, {
    track,
  });
  await ctx
    .db('runs')
    .where({ id: probe.id })
    .update({ data_version: await currentDataVersion(ctx.db) });
  try {
    return await fitsAlone(ctx, probe.id);
  } finally {
    await ctx.db('runs').where({ id: probe.id }).del();
  }
}

async function timedRun(ctx: AppContext, workers: number, track?: string): Promise<Record<string, number>> {
  const procs = await startWorkers(workers, ctx.config.databaseUrl);
  try {
    const run = await startRun(ctx, null, { track });
    let r = run;
    for (;;) {
      r = (await runStore.findRun(ctx.db, run.id))!;
      if (r.state === 'in_review' || r.state === 'failed') break;
      await new Promise((res) => setTimeout(res, 20));
    }
    if (r.state === 'failed') throw new Error(r.error ?? 'run failed');
    const finished = new Date(r.finishedAt!).getTime();
    const t = r.timings!;
    const p0 = performance.now();
    const published = await publishRun(ctx, BENCH_CALLER, run.id);
    const publishMs = performance.now() - p0;
    return {
      runId: run.id,
      load: load(),
      runToReviewMs: finished - t.pickedAt,
      publishMs,
      totalMs: finished - t.pickedAt + publishMs,
      fitMs: t.fitMs,
      dbMs: t.readMs + t.chunkReadMs + t.writeMs,
      pooledMs: t.pooledMs,
      alerts: published.alerts,
      workers,
      readMs: t.readMs + t.chunkReadMs,
      startReadMs: t.readMs,
      chunkReadMs: t.chunkReadMs,
      writeMs: t.writeMs,
    };
  } finally {
    for (const p of procs) p.kill('SIGTERM');
  }
}

/** One run started and published through the HTTP API, as an analyst does it (see the header). */
async function throughServer(ctx: AppContext, track: string, districts: number): Promise<void> {
  await ensureDemoAccounts(ctx.db);
  const url = ctx.config.databaseUrl;
  const webDir = fs.mkdtempSync(path.join(os.tmpdir(), 'crestwatch-bench-run-'));
  fs.writeFileSync(path.join(webDir, 'index.html'), '<!doctype html><title>bench</title>');
  const procs: ChildProcess[] = [];
  try {
    const [standInPort, port] = [await freePort(), await freePort()];
    procs.push(await spawnReady('scripts/stand-in.ts', [String(standInPort)], process.env, 'stand-in ready'));
    const env = {
      ...process.env,
      CRESTWATCH_MODE: 'test',
      DATABASE_URL: url,
      PORT: String(port),
      HOST: '127.0.0.1',
      WEB_DIR: webDir,
      OAUTH_STAND_IN_PORT: String(standInPort),
      LOG_REQUESTS: '0',
    };
    procs.push(await spawnReady('api/server.ts', [], env, 'is serving'));
    procs.push(...(await startWorkers(1, url)));
    const base = `http://127.0.0.1:${port}`;
    const { cookie, csrfToken } = await signIn(base, 'analyst@crestwatch.example');
    const post = (p: string, body: unknown) =>
      fetch(`${base}${p}`, {
        method: 'POST',
        headers: { cookie, 'x-csrf-token': csrfToken, 'content-type': 'application/json' },
        body: JSON.stringify(body),
      });
    const t0 = performance.now();
    const started = await post('/api/runs', { track });
    if (started.status !== 202) throw new Error(`POST /api/runs answered ${started.status}: ${await started.text()}`);
    const { id } = (await started.json()) as { id: number };
    let state = '';
    while (state !== 'in_review') {
      await new Promise((r) => setTimeout(r, 50));
      state = ((await (await fetch(`${base}/api/runs/${id}`, { headers: { cookie } })).json()) as { state: string })
        .state;
      if (state === 'failed') throw new Error(`run ${id} failed`);
    }
    const inReview = performance.now() - t0;
    const p0 = performance.now();
    const published = await post(`/api/runs/${id}/publish`, {});
    if (!published.ok) throw new Error(`publish answered ${published.status}: ${await published.text()}`);
    const publishMs = performance.now() - p0;
    console.log(
      `through the server, ${districts} districts, CO2 track, 1 worker: POST /api/runs → in review ${(inReview / 1000).toFixed(2)} s (goal ≤ 5 s: ${inReview <= 5000 ? 'met' : 'not met'}), publish ${(publishMs / 1000).toFixed(2)} s (load ${load().toFixed(2)})`,
    );
  } finally {
    for (const p of procs.reverse()) p.kill('SIGTERM');
    fs.rmSync(webDir, { recursive: true, force: true });
  }
}

async function main(): Promise<void> {
  pg.start(TEST_CLUSTER);
  await prepareTestTemplate();
  await dropDatabase(TEST_CLUSTER.port, DB);
  await ensureDatabase(TEST_CLUSTER.port, DB, TEMPLATE_DB);
  const url = testDatabaseUrl(DB);
  const ctx = await benchContext(url, loadConfig({ CRESTWATCH_MODE: 'test' }).computePoolSize);
  const { db, jobs } = ctx;
  try {
    await insertDemoIndicators(db);
    await db('users').insert({ id: 0, email: 'bench@crestwatch.example', name: 'bench', role: 'analyst' });
    const l0 = performance.now();
    await insertSyntheticDistricts(db, DISTRICTS, { years: YEARS, seed: 42, prefix: 'B' });
    const ids = new Map<string, number>(
      (await db('indicators').select('id', 'code')).map((r: { id: number; code: string }) => [r.code, r.id]),
    );
    for (const t of OTHER_TRACKS)
      await db.raw(
        `INSERT INTO observations (district_id, indicator_id, year, value, upload_id)
         SELECT district_id, ?, year, value * ? * exp(? * sin(district_id * 7 + year)), upload_id
           FROM observations WHERE indicator_id = ?`,
        [ids.get(t.indicator)!, t.scale, t.bend, ids.get('emissions_pc')!],
      );
    console.log(
      `loaded ${DISTRICTS} districts × ${YEARS} years × 3 pressures in ${((performance.now() - l0) / 1000).toFixed(1)} s (load ${load().toFixed(2)}, ${os.cpus().length} cores)`,
    );
    const headline = await resolveTrack(db);
    await patchTrack(db, BENCH_CALLER, headline.code, { name: 'CO2 per person' });
    const tracks: { code: string; name: string }[] = [{ code: headline.code, name: 'CO2 per person' }];
    for (const t of OTHER_TRACKS) {
      const spec = await createSpec(db, BENCH_CALLER, {
        ...DEFAULT_SPEC,
        name: `${t.name} bench`,
        emissionsIndicator: t.indicator,
      });
      await createTrack(db, BENCH_CALLER, { code: t.code, name: t.name, specId: spec.id });
      tracks.push({ code: t.code, name: t.name });
    }
    const results: [string, Record<string, number>][] = [];
    const sec = (ms: number) => `${(ms / 1000).toFixed(2)} s`;
    const print = (k: string, v: Record<string, number>) => {
      const share = (x: number) => `${sec(x)} ${`(${((100 * x) / v.runToReviewMs).toFixed(0)}%)`.padStart(6)}`;
      const rest = v.runToReviewMs - v.startReadMs - v.pooledMs - v.fitMs - v.writeMs;
      console.log(
        `${k.padEnd(16)} ${String(v.workers).padStart(2)} ${sec(v.runToReviewMs).padStart(9)} ${sec(v.publishMs).padStart(8)} ${sec(v.totalMs).padStart(8)} | ${share(v.startReadMs)} ${share(v.pooledMs)} ${share(v.fitMs)} ${share(v.writeMs)} ${share(Math.max(0, rest))} | ${sec(v.yardMs).padStart(8)}  ${(v.runToReviewMs / v.yardMs).toFixed(2).padStart(5)}×  ${String(v.alerts).padStart(5)}  ${v.load.toFixed(2)}`,
      );
    };
    const header = (districts: number) => {
      console.log(
        `\n${districts} districts × ${YEARS} years, 5 variants each (main, no controls, cubic, last 20 years, level); chunk phases summed over chunks`,
      );
      console.log(
        'track          wk run→review  publish   total   | start read     pooled fit     chunk fits     chunk writes   queue, rest    | yardstick  run/yard  alerts  load',
      );
    };
    for (const t of tracks) {
      const yard = await yardstick(ctx, t.code);
      for (const w of WORKERS) {
        const r: [string, Record<string, number>] = [t.name, { ...(await timedRun(ctx, w, t.code)), yardMs: yard }];
        results.push(r);
      }
    }
    header(DISTRICTS);
    for (const [k, v] of results) print(k, v);
    const all = results.filter(([, v]) => v.workers === WORKERS[0]).reduce((sum, [, v]) => sum + v.totalMs, 0);
    console.log(
      `three tracks, one run each with ${WORKERS[0]} worker${WORKERS[0] > 1 ? 's' : ''}: ${sec(all)} in all (load ${load().toFixed(2)} at the end)`,
    );
    let loaded = DISTRICTS;
    if (THROUGH_SERVER > DISTRICTS) {
      const l1 = performance.now();
      await insertSyntheticDistricts(db, THROUGH_SERVER - loaded, { years: YEARS, seed: 43, prefix: 'C' });
      console.log(
        `\nloaded ${THROUGH_SERVER - loaded} more districts (CO2 track only) in ${((performance.now() - l1) / 1000).toFixed(1)} s (load ${load().toFixed(2)})`,
      );
      loaded = THROUGH_SERVER;
      await throughServer(ctx, headline.code, THROUGH_SERVER);
    }
    if (LARGE > loaded) {
      const l1 = performance.now();
      await insertSyntheticDistricts(db, LARGE - loaded, { years: YEARS, seed: 44, prefix: 'E' });
      console.log(
        `\nloaded ${LARGE - loaded} more districts (CO2 track only) in ${((performance.now() - l1) / 1000).toFixed(1)} s (load ${load().toFixed(2)})`,
      );
      const yard = await yardstick(ctx, headline.code);
      header(LARGE);
      for (const w of WORKERS) print('CO2 per person', { ...(await timedRun(ctx, w, headline.code)), yardMs: yard });
    }
  } finally {
    await jobs.stop();
    ctx.mailer.close();
    await ctx.compute.close();
    await db.destroy();
    await dropDatabase(TEST_CLUSTER.port, DB);
  }
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
