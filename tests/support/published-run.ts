/**
 * Publishes one run of the default spec over whatever districts the database holds, for
 * browser tests and the web bench: start it through the runs service, let pg-boss workers
 * in this process fit the districts, wait for review, publish as the demo analyst.
 */
import type { CrestwatchApp } from '../../api/app';
import type { Caller } from '../../api/http/routes';
import { publishRun, startRun } from '../../api/runs/service';
import { DEMO } from './auth';
import { testJobs, until, workIn } from './jobs';

/** Runs and publishes; returns the published run's id. Stops its workers before returning. */
export async function publishDefaultRun(
  app: CrestwatchApp,
  databaseUrl: string,
  opts: { timeoutMs?: number } = {},
): Promise<number> {
  const { ctx } = app.locals;
  const db = ctx.db;
  const row = await db('users')
    .whereRaw('lower(email) = ?', [DEMO.analyst])
    .first('id', 'email', 'name', 'role', 'active');
  if (!row) throw new Error('publishDefaultRun: the demo analyst is missing (call ensureDemoAccounts first)');
  const analyst: Caller = {
    id: Number(row.id),
    email: row.email,
    name: row.name ?? '',
    role: row.role,
    active: row.active,
  };
  const jobs = await testJobs(databaseUrl);
  const previousJobs = ctx.jobs;
  ctx.jobs = jobs;
  try {
    await workIn(ctx, jobs);
    const run = await startRun(ctx, analyst, {});
    await until(
      `run ${run.id} in review`,
      async () => {
        const r = await db('runs').where({ id: run.id }).first('state', 'error');
        if (r?.state === 'failed') throw new Error(`run ${run.id} failed: ${r.error}`);
        return r?.state === 'in_review';
      },
      opts.timeoutMs ?? 120_000,
    );
    await publishRun(ctx, analyst, run.id);
    return run.id;
  } finally {
    ctx.jobs = previousJobs;
    await jobs.stop();
  }
}
