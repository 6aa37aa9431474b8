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

export async function until<T>(
  what: string,
  probe: () => Promise<T | null | undefined | false>,
  timeoutMs = 60_000,
  everyMs = 200,
): Promise<T> {
  const end = Date.now() + timeoutMs;
  for (;;) {
    const v = await probe();
    if (v) return v;
    if (Date.now() > end) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, everyMs));
  }
}

/** The answers an API caller sees while starting a run and waiting for its review. */
export interface RunToReview {
  start: { id: number; state: string };
  run: Record<string, unknown> & { id: number; state: string };
}

/**
 * Starts a run of the default spec through POST /api/runs and polls GET /api/runs/:id
 * until it is in review (a failed run throws with its error).
 */
export async function startRunAndWait(agent: {
  post(url: string): { send(body: object): PromiseLike<{ status: number; body: { id: number; state: string } }> };
  get(url: string): PromiseLike<{ body: RunToReview['run'] & { error?: string } }>;
}): Promise<RunToReview & { status: number }> {
  const res = await agent.post('/api/runs').send({});
  const id = res.body.id;
  const run = await until(`run ${id} in review`, async () => {
    const r = (await agent.get(`/api/runs/${id}`)).body;
    if (r.state === 'failed') throw new Error(`run failed: ${r.error}`);
    return r.state === 'in_review' ? r : null;
  });
  return { status: res.status, start: res.body, run };
}
