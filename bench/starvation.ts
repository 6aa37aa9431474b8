/**
 * Benchmark (not part of the test run): `npm run bench:starvation`.
 *
 * Ten people each post a maximal estimate (1,000 rows, 8 controls, Newey–West lag 999) at
 * once; meanwhile a district card (`GET /api/districts/D01`) and the health check are
 * asked for in a loop until the last heavy one answers. Printed: card and health latency
 * (median, 95th percentile, max) and when the heavy answers came, with
 *   - fits inline on the event loop (COMPUTE_POOL_SIZE=0: the behaviour before the pool),
 *   - fits in the compute pool (the configured size; default cores − 1),
 * and the load average before and after. Uses the test cluster and the OAuth stand-in
 * (started here as the jest global setup does).
 */
import { loadavg } from 'node:os';
import { loadConfig } from '../api/config';
import { signInAs } from '../tests/support/auth';
import globalSetup from '../tests/support/global-setup';
import globalTeardown from '../tests/support/global-teardown';
import { signedInApp } from '../tests/support/signed-in-app';
import { describeTimings, readersUnderLoad } from '../tests/support/starvation';

const load = () =>
  loadavg()
    .map((l) => l.toFixed(2))
    .join(' ');

async function measure(label: string, computePoolSize: number): Promise<void> {
  const s = await signedInApp({ as: 'official', config: { computePoolSize } });
  try {
    const emails = Array.from({ length: 10 }, (_, i) => `bench-heavy${i + 1}@crestwatch.example`);
    await s.t.db('users').insert(emails.map((email, i) => ({ email, name: `Bench user ${i + 1}`, role: 'analyst' })));
    const people = [];
    for (const email of emails) people.push((await signInAs(s.server, email)).agent);
    // Warm up: one fit (loads the worker thread and the engine), one card, one health.
    await people[0].post('/api/estimate').send({
      model: { form: 'quadratic', transform: 'log', covariance: 'hc1' },
      rows: Array.from({ length: 12 }, (_, i) => ({ year: 2000 + i, x: 1000 + 100 * i, y: 5 + i - 0.05 * i * i })),
    });
    await s.agent.get('/api/districts/D01');
    await s.agent.get('/api/health');
    const idle = await readersUnderLoad([], s.agent, () => true);
    const t = await readersUnderLoad(people, s.agent, () => true);
    if (t.heavy.some((h) => h.status !== 200))
      throw new Error(`a heavy estimate answered ${t.heavy.map((h) => h.status).join(',')}`);
    console.log(`${label}`);
    console.log(
      `  idle:   card ${idle.readers.find((r) => r.what === 'card')!.ms.toFixed(0)} ms, health ${idle.readers.find((r) => r.what === 'health')!.ms.toFixed(0)} ms`,
    );
    console.log(`  loaded: ${describeTimings(t)}`);
    console.log(`  load average (1, 5, 15 min): ${load()}`);
  } finally {
    await s.close();
  }
}

async function main(): Promise<void> {
  await globalSetup();
  try {
    console.log(`load average before (1, 5, 15 min): ${load()}`);
    await measure('fits inline on the event loop (COMPUTE_POOL_SIZE=0, before the pool)', 0);
    const size =
      loadConfig({ CRESTWATCH_MODE: 'test', COMPUTE_POOL_SIZE: process.env.COMPUTE_POOL_SIZE }).computePoolSize || 1;
    await measure(`fits in the compute pool (COMPUTE_POOL_SIZE=${size})`, size);
  } finally {
    await globalTeardown();
  }
}

main().then(
  () => process.exit(0),
  (err: Error) => {
    console.error(err.stack ?? err.message);
    process.exit(1);
  },
);
