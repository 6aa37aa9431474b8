/**
 * The benches' database: synthetic districts (the generator of bench:run, 40 years each),
 * the demo people and one published run fitted by a worker process. Shared by bench:api
 * and bench:answers.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import net from 'node:net';
import path from 'node:path';
import { loadConfig } from '../api/config';
import { createComputePool } from '../api/compute/pool';
import type { AppContext } from '../api/context';
import { createDb } from '../api/db';
import { insertDemoIndicators } from '../api/demo/seed-store';
import { startJobs } from '../api/jobs/boss';
import { createMailer } from '../api/mail/mailer';
import { ensureDemoAccounts } from '../api/people/service';
import { publishRun, startRun } from '../api/runs/service';
import * as runStore from '../api/runs/store';
import { insertSyntheticDistricts } from '../tests/support/synthetic';

const root = path.resolve(__dirname, '..');

/** A free loopback port (the bench servers' and stand-ins'). */
export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = net.createServer();
    s.once('error', reject);
    s.listen(0, '127.0.0.1', () => {
      const { port } = s.address() as net.AddressInfo;
      s.close(() => resolve(port));
    });
  });
}

/**
 * Signs `email` in through the stand-in with plain HTTP; returns the cookie header and the
 * CSRF token that state-changing calls send.
 */
export async function signIn(base: string, email: string): Promise<{ cookie: string; csrfToken: string }> {
  const jar = new Map<string, string>();
  const keep = (res: Response) => {
    for (const c of res.headers.getSetCookie()) {
      const [pair] = c.split(';');
      const i = pair.indexOf('=');
      jar.set(pair.slice(0, i), pair.slice(i + 1));
    }
  };
  const cookie = () => [...jar].map(([k, v]) => `${k}=${v}`).join('; ');
  const start = await fetch(`${base}/api/auth/google?login_hint=${encodeURIComponent(email)}`, {
    redirect: 'manual',
  });
  keep(start);
  const authorize = await fetch(start.headers.get('location')!, { redirect: 'manual' });
  const back = new URL(authorize.headers.get('location')!);
  const cb = await fetch(`${base}${back.pathname}${back.search}`, {
    redirect: 'manual',
    headers: { cookie: cookie() },
  });
  keep(cb);
  const me = await fetch(`${base}/api/me`, { headers: { cookie: cookie() } });
  if (me.status !== 200) throw new Error(`sign-in failed: /api/me answered ${me.status}`);
  return { cookie: cookie(), csrfToken: ((await me.json()) as { csrfToken: string }).csrfToken };
}

/** Spawns a tsx script and resolves once its stdout shows `ready`. */
export function spawnReady(
  script: string,
  args: string[],
  env: NodeJS.ProcessEnv,
  ready: string,
): Promise<ChildProcess> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, ['--import', 'tsx', path.join(root, script), ...args], {
      cwd: root,
      env,
      stdio: ['ignore', 'pipe', 'inherit'],
    });
    child.stdout!.on('data', (b: Buffer) => {
      if (b.toString().includes(ready)) resolve(child);
    });
    child.once('exit', (code) => reject(new Error(`${script} exited with code ${code}`)));
  });
}

/** An app context on a bench database: its own job queue (no schedule) and a compute pool of the given size. */
export async function benchContext(
  url: string,
  poolSize: number,
): Promise<AppContext & { jobs: NonNullable<AppContext['jobs']> }> {
  const config = { ...loadConfig({ CRESTWATCH_MODE: 'test' }), databaseUrl: url };
  const jobs = await startJobs({
    databaseUrl: url,
    expireInSeconds: 300,
    pollingIntervalSeconds: 0.5,
    maintenanceIntervalSeconds: 30,
    schedule: false,
  });
  return {
    db: createDb(url),
    config,
    log: () => {},
    mailer: createMailer(config),
    jobs,
    compute: createComputePool(poolSize),
  };
}

/** Builds the database: districts, demo people, one published run (worked by a worker process). */
export async function buildDatabase(url: string, districts: number): Promise<void> {
  // Starting a run fits nothing here (the worker process does): an inline pool of size 0 is enough.
  const ctx = await benchContext(url, 0);
  const { db, jobs } = ctx;
  const worker = await spawnReady(
    'api/worker.ts',
    [],
    { ...process.env, CRESTWATCH_MODE: 'test', DATABASE_URL: url, LOG_REQUESTS: '0' },
    'is working jobs',
  );
  try {
    await insertDemoIndicators(db);
    await ensureDemoAccounts(db);
    await insertSyntheticDistricts(db, districts, { years: 40, seed: 42, prefix: 'B' });
    const run = await startRun(ctx, null, {});
    for (;;) {
      const r = (await runStore.findRun(db, run.id))!;
      if (r.state === 'failed') throw new Error(r.error ?? 'run failed');
      if (r.state === 'in_review') break;
      await new Promise((res) => setTimeout(res, 100));
    }
    const analyst = await db('users').where({ role: 'analyst' }).first();
    await publishRun(
      ctx,
      { id: analyst.id, email: analyst.email, name: analyst.name, role: 'analyst', active: true } as never,
      run.id,
    );
    await db.raw('VACUUM ANALYZE');
  } finally {
    worker.kill('SIGTERM');
    await jobs.stop();
    ctx.mailer.close();
    await db.destroy();
  }
}
