/**
 * The job queue: pg-boss on the app's own PostgreSQL. The server starts it with workers;
 * `npm run worker` starts more workers in another process (or machine) on the same queue.
 * Queues are created before use; handlers get an array of jobs.
 */
import PgBoss from 'pg-boss';

import { QUEUES, type Handler, type QueueName } from '../common/queues';

export { QUEUES, type Handler, type QueueName };

export interface JobsOptions {
  databaseUrl: string;
  /** Seconds before an active job is considered lost (its worker died) and retried. */
  expireInSeconds: number;
  /** How often workers poll (pg-boss's floor is 0.5 s). */
  pollingIntervalSeconds: number;
  /** Maintenance (expiry, retention) interval; small in tests so lost jobs come back fast. */
  maintenanceIntervalSeconds: number;
  /** Run the cron scheduler in this process. */
  schedule: boolean;
}

export interface Jobs {
  boss: PgBoss;
  send(queue: QueueName, data: object, options?: PgBoss.SendOptions): Promise<string | null>;
  insert(queue: QueueName, items: object[], options?: Omit<PgBoss.JobInsert, 'name' | 'data'>): Promise<void>;
  /** Start workers for the given handlers in this process. */
  work(handlers: Partial<Record<QueueName, Handler>>): Promise<void>;
  /** Wake this process's workers of a queue now instead of at their next poll. */
  notify(queue: QueueName): void;
  schedule(cron: string, tz: string, enabled: boolean): Promise<void>;
  stop(): Promise<void>;
}

const RETRIES: Record<QueueName, { retryLimit: number; retryDelay: number; retryBackoff: boolean }> = {
  'run-start': { retryLimit: 2, retryDelay: 2, retryBackoff: true },
  'run-chunk': { retryLimit: 3, retryDelay: 1, retryBackoff: true },
  'outbox-send': { retryLimit: 5, retryDelay: 5, retryBackoff: true },
  'run-scheduled': { retryLimit: 1, retryDelay: 30, retryBackoff: false },
  'retention-prune': { retryLimit: 2, retryDelay: 60, retryBackoff: true },
  'run-watch': { retryLimit: 1, retryDelay: 60, retryBackoff: false },
};

/**
 * Workers per queue in one process. Two for a run's chunks: the next chunk's fits start
 * while the previous one's rows are still being written and committed, so the fitting
 * threads are not idle through every chunk's write, bookkeeping and job hand-over.
 */
const WORKERS_PER_PROCESS: Partial<Record<QueueName, number>> = { 'run-chunk': 2 };

export async function startJobs(o: JobsOptions): Promise<Jobs> {
  const boss = new PgBoss({
    connectionString: o.databaseUrl,
    schema: 'pgboss',
    max: 4,
    schedule: o.schedule,
    supervise: true,
    maintenanceIntervalSeconds: o.maintenanceIntervalSeconds,
    monitorStateIntervalSeconds: Math.max(1, o.maintenanceIntervalSeconds),
    cronMonitorIntervalSeconds: 30,
  });
  boss.on('error', (err) => process.stderr.write(`[jobs] ${err.message}\n`));
  await boss.start();
  for (const name of Object.values(QUEUES)) {
    const existing = await boss.getQueue(name);
    if (!existing)
      await boss.createQueue(name, { name, policy: 'standard', expireInSeconds: o.expireInSeconds, ...RETRIES[name] });
  }
  const workerIds = new Map<QueueName, string[]>();
  return {
    boss,
    send: (queue, data, options) =>
      boss.send(queue, data, { expireInSeconds: o.expireInSeconds, ...RETRIES[queue], ...options }),
    insert: (queue, items, options) =>
      boss.insert(
        items.map((data) => ({ name: queue, data, expireInSeconds: o.expireInSeconds, ...RETRIES[queue], ...options })),
      ),
    async work(handlers) {
      for (const [queue, handler] of Object.entries(handlers) as [QueueName, Handler][]) {
        for (let n = 0; n < (WORKERS_PER_PROCESS[queue] ?? 1); n++) {
          // pg-boss waits out the rest of its polling interval after a job that ended early,
          // even when more are queued (a run's chunks lost ~0.2 s each that way): a worker
          // that just worked a job wakes itself, so it asks for the next one at once and
          // waits only when the queue is empty.
          let self: string | null = null;
          const id = await boss.work<Record<string, unknown>>(
            queue,
            { pollingIntervalSeconds: o.pollingIntervalSeconds, batchSize: 1, includeMetadata: true },
            async (jobs) => {
              for (const job of jobs)
                await handler(job.data, { retryCount: job.retryCount, retryLimit: job.retryLimit, id: job.id });
              if (jobs.length > 0 && self) boss.notifyWorker(self);
            },
          );
          self = id;
          workerIds.set(queue, [...(workerIds.get(queue) ?? []), id]);
        }
      }
    },
    notify(queue) {
      for (const id of workerIds.get(queue) ?? []) boss.notifyWorker(id);
    },
    async schedule(cron, tz, enabled) {
      if (enabled) await boss.schedule(QUEUES.scheduledRun, cron, {}, { tz });
      else await boss.unschedule(QUEUES.scheduledRun);
    },
    async stop() {
      await boss.stop({ graceful: true, timeout: 10_000, wait: true });
    },
  };
}
