/**
 * npm run bench:answers — how large the phone's list answers are: GET /api/districts and
 * GET /api/region at BENCH_DISTRICTS (default 3,000) districts with one published run,
 * raw JSON and gzipped (zlib's default level, as the server's `compression` sends it), with
 * the load average. Goals: each ≤ 150 KB gzipped at 3,000 districts.
 *
 * The answers are built by the services the routes call and serialised as the routes send
 * them (JSON.stringify), so no HTTP is timed here (bench:api does that). BENCH_KEEP_DB=1
 * reuses the database of an earlier run (the build takes a minute on two cores).
 */
import os from 'node:os';
import zlib from 'node:zlib';
import { createDb } from '../api/db';
import { listDistricts, region } from '../api/estimates/service';
import { dropDatabase, ensureDatabase } from '../scripts/database';
import * as pg from '../scripts/pg';
import { prepareTestTemplate } from '../scripts/test-template';
import { TEMPLATE_DB, TEST_CLUSTER, testDatabaseUrl } from '../tests/support/test-cluster';
import { buildDatabase } from './bench-db';

const DISTRICTS = Number(process.env.BENCH_DISTRICTS ?? 3000);
const KEEP = process.env.BENCH_KEEP_DB === '1';
const DB = `cw_bench_answers_${DISTRICTS}`;
const GOAL = 150 * 1024;

const kb = (n: number) => `${(n / 1024).toFixed(1)} KB`;

async function main(): Promise<void> {
  pg.start(TEST_CLUSTER);
  await prepareTestTemplate();
  const url = testDatabaseUrl(DB);
  if (!KEEP) await dropDatabase(TEST_CLUSTER.port, DB);
  await ensureDatabase(TEST_CLUSTER.port, DB, TEMPLATE_DB);
  const db = createDb(url);
  const built = Number((await db('districts').count({ n: '*' }))[0].n) >= DISTRICTS;
  if (!built) {
    const t0 = performance.now();
    await buildDatabase(url, DISTRICTS);
    console.log(
      `built ${DISTRICTS} districts × 40 years with one published run in ${((performance.now() - t0) / 1000).toFixed(1)} s`,
    );
  }
  try {
    console.log(
      `answer sizes at ${DISTRICTS} districts (load ${os.loadavg()[0].toFixed(2)}, ${os.cpus().length} cores)`,
    );
    console.log('answer                 raw          gzip        goal ≤ 150 KB gz');
    const answers: [string, () => Promise<unknown>][] = [
      ['GET /api/districts', () => listDistricts(db)],
      ['GET /api/region', () => region(db)],
    ];
    for (const [name, build] of answers) {
      const body = Buffer.from(JSON.stringify(await build()));
      const gz = zlib.gzipSync(body).length;
      console.log(
        `${name.padEnd(20)} ${kb(body.length).padStart(10)} ${kb(gz).padStart(12)}        ${gz <= GOAL ? 'met' : 'not met'}`,
      );
    }
    console.log(
      `load average after: ${os
        .loadavg()
        .map((l) => l.toFixed(2))
        .join(' ')}`,
    );
  } finally {
    await db.destroy();
    if (!KEEP) await dropDatabase(TEST_CLUSTER.port, DB).catch(() => {});
  }
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
