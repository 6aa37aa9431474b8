/**
 * npm run bench:run — a full run over 3,000 invented districts × 40 years (one control,
 * Newey–West): read, fit (every variant), write, then publish (compare with the previous
 * published run, alerts). Timed with one worker process and with two, from the moment a
 * worker picks the run up, then once over 10,000 districts with one worker. Prints the
 * share of each phase (fits, reads, writes), the load average beside every figure, and a
 * yardstick measured just before each run on the same machine: the same district fits in
 * this process alone, with no database (the floor a run could reach on one core).
 *
 * Environment: BENCH_DISTRICTS (default 3000), BENCH_LARGE_DISTRICTS (default 10000;
 * 0 skips the large run).
 */
import { createComputePool } from '../api/compute/pool';
import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import { loadConfig } from '../api/config';
import type { AppContext } from '../api/context';
import { createDb } from '../api/db';
import { DEMO_INDICATORS } from '../api/demo/catalogue';
import { startJobs } from '../api/jobs/boss';
import { createMailer } from '../api/mail/mailer';
import os from 'node:os';
import { loadSeries } from '../api/runs/data-store';
import { fitDistrict } from '../api/runs/district-fit';
import { fitPooled } from '../api/runs/jobs';
import { publishRun, startRun } from '../api/runs/service';
import * as runStore from '../api/runs/store';
import { dropDatabase, ensureDatabase } from '../scripts/database';
import * as pg from '../scripts/pg';
import { prepareTestTemplate } from '../scripts/test-template';
import { insertSyntheticDistricts } from '../tests/support/synthetic';
import { TEMPLATE_DB, TEST_CLUSTER, testDatabaseUrl } from '../tests/support/test-cluster';

const DISTRICTS = Number(process.env.BENCH_DISTRICTS ?? 3000);
const LARGE = Number(process.env.BENCH_LARGE_DISTRICTS ?? 10000);
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

/** The yardstick: every district fit of the run's spec in this process, no database (series read untimed). */
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

async function timedRun(ctx: AppContext, workers: number): Promise<Record<string, number>> {
  const procs = await startWorkers(workers, ctx.config.databaseUrl);
  try {
    const run = await startRun(ctx, null, {});
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
    const published = await publishRun(
      ctx,
      { id: 0, email: 'bench@crestwatch.example', name: 'bench', role: 'analyst', active: true } as never,
      run.id,
    ).catch(async (err) => {
      throw err;
    });
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
      readMs: t.readMs + t.chunkReadMs,
      startReadMs: t.readMs,
      chunkReadMs: t.chunkReadMs,
      writeMs: t.writeMs,
    };
  } finally {
    for (const p of procs) p.kill('SIGTERM');
  }
}

async function main(): Promise<void> {
  pg.start(TEST_CLUSTER);
  await prepareTestTemplate();
  await dropDatabase(TEST_CLUSTER.port, DB);
  await ensureDatabase(TEST_CLUSTER.port, DB, TEMPLATE_DB);
  const url = testDatabaseUrl(DB);
  const config = { ...loadConfig({ CRESTWATCH_MODE: 'test' }), databaseUrl: url };
  const db = createDb(url);
  const jobs = await startJobs({
    databaseUrl: url,
    expireInSeconds: 300,
    pollingIntervalSeconds: 0.5,
    maintenanceIntervalSeconds: 30,
    schedule: false,
  });
  const ctx: AppContext = {
    db,
    config,
    log: () => {},
    mailer: createMailer(config),
    jobs,
    compute: createComputePool(config.computePoolSize),
  };
  try {
    await db('indicators').insert(
      DEMO_INDICATORS.map((i) => ({
        code: i.code,
        name: i.name,
        unit: i.unit,
        description: i.description,
        must_be_positive: i.mustBePositive,
      })),
    );
    await db('users').insert({ id: 0, email: 'bench@crestwatch.example', name: 'bench', role: 'analyst' });
    const l0 = performance.now();
    await insertSyntheticDistricts(db, DISTRICTS, { years: YEARS, seed: 42, prefix: 'B' });
    console.log(
      `loaded ${DISTRICTS} districts × ${YEARS} years in ${((performance.now() - l0) / 1000).toFixed(1)} s (load ${load().toFixed(2)}, ${os.cpus().length} cores)`,
    );
    // A first published run, so the timed runs compare with a previous one.
    const first = await timedRun(ctx, 1);
    const results: [string, Record<string, number>][] = [];
    for (const w of [1, 2]) {
      const yard = await fitsAlone(ctx, first.runId);
      results.push([`${DISTRICTS}, ${w} worker${w > 1 ? 's' : ''}`, { ...(await timedRun(ctx, w)), yardMs: yard }]);
    }
    if (LARGE > DISTRICTS) {
      await insertSyntheticDistricts(db, LARGE - DISTRICTS, { years: YEARS, seed: 43, prefix: 'L' });
      await timedRun(ctx, 1); // the previous published run at this size
      const yard = await fitsAlone(ctx, first.runId);
      const large = await timedRun(ctx, 1);
      results.push([`${LARGE}, 1 worker`, { ...large, yardMs: yard }]);
    }
    const sec = (ms: number) => `${(ms / 1000).toFixed(2)} s`;
    console.log(
      `\nfull runs × ${YEARS} years, 5 variants each (main, no controls, cubic, last 20 years, level); phases summed over chunks`,
    );
    console.log(
      'districts, workers   run→review  publish   total   | fits         reads        writes       pooled  | yardstick: fits alone  run/yardstick  load',
    );
    for (const [k, v] of results) {
      const share = (x: number) => `${sec(x)} ${`(${((100 * x) / v.runToReviewMs).toFixed(0)}%)`.padStart(6)}`;
      console.log(
        `${k.padEnd(20)} ${sec(v.runToReviewMs).padStart(9)} ${sec(v.publishMs).padStart(8)} ${sec(v.totalMs).padStart(8)} | ${share(v.fitMs)} ${share(v.readMs)} ${share(v.writeMs)} ${sec(v.pooledMs)} | ${sec(v.yardMs).padStart(10)}            ${(v.runToReviewMs / v.yardMs).toFixed(2).padStart(5)}×       ${v.load.toFixed(2)}`,
      );
    }
    for (const [k, v] of results)
      console.log(
        `${k}: start read ${v.startReadMs.toFixed(0)} ms, chunk reads ${v.chunkReadMs.toFixed(0)} ms, writes ${v.writeMs.toFixed(0)} ms`,
      );
    console.log('(phases are summed over chunks, so with two workers they can exceed the wall time)');
    const one = results[0][1];
    console.log(
      `goal: total ≤ 2 s with one worker at ${DISTRICTS} districts — ${one.totalMs <= 2000 ? 'met' : 'not met'} (${sec(one.totalMs)} at load ${one.load.toFixed(2)})`,
    );
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
