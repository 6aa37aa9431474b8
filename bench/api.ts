/**
 * npm run bench:api — read throughput of the server under load (not part of the test run).
 *
 * Builds a 3,000-district database on the test cluster (the synthetic generator of
 * bench:run, 40 years each) with one published run, starts the server in a process of its
 * own (api/server.ts, test mode, so autocannon never shares its event loop), signs an
 * official in through the OAuth stand-in, then drives each target with autocannon at 100
 * and 200 connections: a small static file of the same server (the yardstick), health,
 * the signed-in person (/api/me), the region, the district list and one district's card.
 * Prints requests per second, p50/p99 latency, errors and non-2xx answers, the ratios to
 * the static file measured at the same connection count, and the load average beside
 * every figure. Before each target the bench waits for the server to answer promptly
 * again, so one target's backlog is not charged to the next.
 *
 * Environment: BENCH_API_SECONDS (default 30 per target), BENCH_API_CONNECTIONS
 * (default "100,200"), BENCH_DISTRICTS (default 3000), BENCH_API_TARGETS (paths to drive besides
 * the static file, comma-separated; default all).
 */
import type { ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import autocannon from 'autocannon';
import { buildDatabase, freePort, signIn, spawnReady } from './bench-db';
import { dropDatabase, ensureDatabase } from '../scripts/database';
import * as pg from '../scripts/pg';
import { prepareTestTemplate } from '../scripts/test-template';
import { TEMPLATE_DB, TEST_CLUSTER, testDatabaseUrl } from '../tests/support/test-cluster';

const SECONDS = Number(process.env.BENCH_API_SECONDS ?? 30);
const CONNECTIONS = (process.env.BENCH_API_CONNECTIONS ?? '100,200').split(',').map(Number);
const DISTRICTS = Number(process.env.BENCH_DISTRICTS ?? 3000);
const ONLY = process.env.BENCH_API_TARGETS?.split(',');
const DB = 'cw_bench_api';
const OFFICIAL = 'official@crestwatch.example';
const load = () => os.loadavg()[0];

interface Figure {
  rps: number;
  p50: number;
  p99: number;
  errors: number;
  non2xx: number;
  load: number;
  bytes: number;
}

async function drive(url: string, connections: number, cookie: string): Promise<Figure> {
  const r = await autocannon({ url, connections, duration: SECONDS, headers: { cookie } });
  return {
    rps: r.requests.average,
    p50: r.latency.p50,
    p99: r.latency.p99,
    errors: r.errors + r.timeouts,
    non2xx: r.non2xx,
    load: load(),
    bytes: r.requests.total ? r.throughput.total / r.requests.total : 0,
  };
}

/**
 * Waits until the server answers the static file and health again within a second: a
 * target that outran the server leaves a backlog (autocannon gives up on a request after
 * 10 s, the server still finishes it), which must not be charged to the next target.
 */
async function drain(base: string): Promise<number> {
  const t0 = performance.now();
  while (performance.now() - t0 < 180_000) {
    const s = performance.now();
    const ok = await Promise.all(
      ['/static.txt', '/api/health'].map((p) =>
        fetch(`${base}${p}`, { signal: AbortSignal.timeout(5000) }).then(
          (r) => r.ok,
          () => false,
        ),
      ),
    );
    if (ok.every(Boolean) && performance.now() - s < 1000) break;
    await new Promise((r) => setTimeout(r, 500));
  }
  return performance.now() - t0;
}

async function main(): Promise<void> {
  pg.start(TEST_CLUSTER);
  await prepareTestTemplate();
  await dropDatabase(TEST_CLUSTER.port, DB);
  await ensureDatabase(TEST_CLUSTER.port, DB, TEMPLATE_DB);
  const url = testDatabaseUrl(DB);
  const webDir = fs.mkdtempSync(path.join(os.tmpdir(), 'crestwatch-bench-api-'));
  const procs: ChildProcess[] = [];
  try {
    const t0 = performance.now();
    await buildDatabase(url, DISTRICTS);
    console.log(
      `built ${DISTRICTS} districts × 40 years with one published run in ${((performance.now() - t0) / 1000).toFixed(1)} s (load ${load().toFixed(2)}, ${os.cpus().length} cores)`,
    );
    // The yardstick: a small static file served by the same server's static route.
    fs.writeFileSync(path.join(webDir, 'index.html'), '<!doctype html><title>bench</title>');
    fs.writeFileSync(path.join(webDir, 'static.txt'), 'x'.repeat(512));
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
    const base = `http://127.0.0.1:${port}`;
    const { cookie } = await signIn(base, OFFICIAL);
    const targets: [string, string][] = [
      ['static file (yardstick)', '/static.txt'],
      ['GET /api/health', '/api/health'],
      ['GET /api/me', '/api/me'],
      ['GET /api/region', '/api/region'],
      ['GET /api/districts', '/api/districts'],
      ['GET /api/districts/B0001/estimate', '/api/districts/B0001/estimate'],
    ].filter(([, p], i) => i === 0 || !ONLY || ONLY.includes(p)) as [string, string][];
    console.log(
      `\nautocannon, ${SECONDS} s per target; the server in its own process; ratios to the static file at the same connection count`,
    );
    console.log(
      'target                              conn    req/s   ×static   p50 ms  p99 ms  ×static p99  errors  non-2xx   bytes/answer  load',
    );
    let errorsAt200 = 0;
    for (const connections of CONNECTIONS) {
      let yard: Figure | null = null;
      for (const [name, p] of targets) {
        const waited = await drain(base);
        if (waited > 1500)
          console.log(
            `  (waited ${(waited / 1000).toFixed(1)} s for the server to finish the previous target's backlog)`,
          );
        const f = await drive(`${base}${p}`, connections, cookie);
        yard ??= f;
        if (connections >= 200) errorsAt200 += f.errors + f.non2xx;
        console.log(
          `${name.padEnd(35)} ${String(connections).padStart(4)} ${f.rps.toFixed(0).padStart(8)} ${`${((100 * f.rps) / yard.rps).toFixed(0)}%`.padStart(8)} ${String(f.p50).padStart(8)} ${String(f.p99).padStart(7)} ${`${(f.p99 / Math.max(1, yard.p99)).toFixed(2)}×`.padStart(11)} ${String(f.errors).padStart(7)} ${String(f.non2xx).padStart(8)} ${f.bytes.toFixed(0).padStart(14)}  ${f.load.toFixed(2)}`,
        );
      }
    }
    await drain(base); // the last target's backlog, before the server is stopped
    console.log(
      `goals: card ≥ 60% of the static file's req/s with p99 ≤ 2× its p99; health ≥ 80%; 0 errors at 200 connections (${errorsAt200 === 0 ? 'met' : `${errorsAt200} errors or non-2xx`})`,
    );
  } finally {
    // Stopped before the database is dropped, so no pooled connection holds it.
    await Promise.all(
      procs.map(
        (p) =>
          new Promise<void>((resolve) => {
            if (p.exitCode !== null) return resolve();
            const t = setTimeout(() => (p.kill('SIGKILL'), resolve()), 10_000);
            p.once('exit', () => (clearTimeout(t), resolve()));
            p.kill('SIGTERM');
          }),
      ),
    );
    fs.rmSync(webDir, { recursive: true, force: true });
    await dropDatabase(TEST_CLUSTER.port, DB).catch(() => {});
  }
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
