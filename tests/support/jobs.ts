/** pg-boss against a test database, with intervals short enough for tests. */
import type { AppContext } from '../../api/context';
import { startJobs, type Jobs } from '../../api/jobs/boss';
import { allHandlers } from '../../api/jobs/handlers';

export async function testJobs(databaseUrl: string, opts: { expireInSeconds?: number } = {}): Promise<Jobs> {
  return startJobs({
    databaseUrl,
    expireInSeconds: opts.expireInSeconds ?? 60,
    pollingIntervalSeconds: 0.5,
    maintenanceIntervalSeconds: 1,
    schedule: false,
  });
}

export async function workIn(ctx: AppContext, jobs: Jobs): Promise<void> {
  await jobs.work(allHandlers(ctx));
}

export async function until<T>(what: string, probe: () => Promise<T | null | undefined | false>, timeoutMs = 60_000, everyMs = 200): Promise<T> {
  const end = Date.now() + timeoutMs;
  for (;;) {
    const v = await probe();
    if (v) return v;
    if (Date.now() > end) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, everyMs));
  }
}
