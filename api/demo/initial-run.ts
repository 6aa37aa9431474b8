/**
 * Demo mode: on the first start the region has data but no published run, so officials
 * would see no standings. Crestwatch queues one run of the default spec and publishes it
 * in the first admin's name once it reaches review, and says so in the audit log.
 */
import * as audit from '../audit/service';
import type { AppContext } from '../context';
import * as users from '../people/store';
import { publishRun, startRun } from '../runs/service';
import * as runs from '../runs/store';

export async function publishInitialDemoRun(ctx: AppContext, email: string | null, timeoutMs = 120_000): Promise<number | null> {
  const [{ count }] = await ctx.db('runs').count<{ count: string }[]>({ count: '*' });
  if (Number(count) > 0 || !email) return null;
  const admin = await users.findByEmail(ctx.db, email);
  if (!admin) return null;
  const caller = { id: admin.id, email: admin.email, name: admin.name, role: admin.role, active: admin.active };
  const run = await startRun(ctx, null, { trigger: 'schedule' });
  const until = Date.now() + timeoutMs;
  for (;;) {
    const r = await runs.findRun(ctx.db, run.id);
    if (r?.state === 'in_review') break;
    if (!r || r.state === 'failed' || Date.now() > until) throw new Error(`the first demo run did not reach review (${r?.state ?? 'missing'}: ${r?.error ?? 'timeout'})`);
    await new Promise((res) => setTimeout(res, 250));
  }
  await publishRun(ctx, caller, run.id);
  await audit.record(ctx.db, { actorId: null, actorEmail: null, action: 'demo.initial_publish', targetType: 'run', targetId: run.id });
  return run.id;
}
