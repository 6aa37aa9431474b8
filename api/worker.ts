/**
 * npm run worker: a process that only works jobs (runs, chunks, mail) from the same
 * PostgreSQL-backed queue as the server, so more processes or machines can share a run.
 */
import { createComputePool } from './compute/pool';
import { warmUp } from './compute/warm-up';
import os from 'node:os';
import { loadConfig, type Config } from './config';
import type { AppContext } from './context';
import { createDb } from './db';
import { startJobs } from './jobs/boss';
import { allHandlers } from './jobs/handlers';
import { createMailer } from './mail/mailer';

/**
 * A worker process answers no reader, so unless COMPUTE_POOL_SIZE says otherwise its pool
 * has a thread per core (the server keeps one core for its event loop): a run's fits use
 * every core while this thread streams their rows to PostgreSQL.
 */
function workerPoolSize(config: Config): number {
  return process.env.COMPUTE_POOL_SIZE === undefined ? os.availableParallelism() : config.computePoolSize;
}

export async function startWorker(config = loadConfig()) {
  const db = createDb(config.databaseUrl);
  const jobs = await startJobs({
    databaseUrl: config.databaseUrl,
    expireInSeconds: config.jobExpireSeconds,
    pollingIntervalSeconds: config.jobPollSeconds,
    maintenanceIntervalSeconds: config.jobMaintenanceSeconds,
    schedule: false,
  });
  const ctx: AppContext = {
    db,
    config,
    log: (m) => process.stderr.write(`${m}\n`),
    mailer: createMailer(config),
    jobs,
    compute: createComputePool(workerPoolSize(config), { warm: true }),
  };
  // Threads that have loaded the engine and fitted a little run a first run at full speed.
  await warmUp(ctx.compute);
  await jobs.work(allHandlers(ctx));
  return {
    async close() {
      await jobs.stop();
      ctx.mailer.close();
      await ctx.compute.close();
      await db.destroy();
    },
  };
}

if (require.main === module) {
  startWorker().then(
    (w) => {
      console.log(`Crestwatch worker ${process.pid} is working jobs`);
      const stop = () => w.close().then(() => process.exit(0));
      process.once('SIGINT', stop);
      process.once('SIGTERM', stop);
    },
    (err: Error) => {
      console.error(`worker could not start: ${err.message}`);
      process.exit(1);
    },
  );
}
