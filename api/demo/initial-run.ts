/**
 * Demo mode: on the first start the region has data but no published run, so officials
 * would see no standings. Crestwatch queues one run of the default spec and publishes it
 * in the first admin's name once it reaches review, and says so in the audit log.
 */
import * as audit from '../audit/service';
import type { AppContext } from '../context';
import { callerByEmail } from '../people/service';
import { listRuns, publishRun, runView, startRun } from '../runs/service';

export async function publishInitialDemoRun(
  ctx: AppContext,
  email: string | null,
  timeoutMs = 120_000,
): Promise<number | null> {
  if (!email || (await listRuns(ctx.db, 1)).length > 0) return null;
  const caller = await callerByEmail(ctx.db, email);
  if (!caller) return null;
  const run = await startRun(ctx, null, { trigger: 'schedule' });
  const until = Date.now() + timeoutMs;
  for (;;) {
    const r = await runView(ctx.db, run.id);
    if (r.state === 'in_review') break;
    if (r.state === 'failed' || Date.now() > until)
      throw new Error(`the first demo run did not reach review (${r.state}: ${r.error ?? 'timeout'})`);
    await new Promise((res) => setTimeout(res, 250));
  }
  await publishRun(ctx, caller, run.id);
  await audit.record(ctx.db, {
    actorId: null,
    actorEmail: null,
    action: 'demo.initial_publish',
    targetType: 'run',
    targetId: run.id,
  });
  return run.id;
}
