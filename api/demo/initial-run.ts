/**
 * Demo mode: on the first start the region has data but no published run, so officials
 * would see no standings. Crestwatch sets up the demo's three tracks — CO2 per person (the
 * headline, on the starting spec), PM2.5 and SO2 per person (each on a copy of the starting
 * spec for its own indicator) — queues one run per track, and publishes each in the first
 * admin's name once it reaches review, saying so in the audit log.
 */
import * as audit from '../audit/service';
import type { AppContext } from '../context';
import type { Caller } from '../http/routes';
import { callerByEmail } from '../people/service';
import { listRuns, publishRun, runView, startRuns } from '../runs/service';
import { DEFAULT_SPEC } from '../specs/schema';
import { createSpec } from '../specs/service';
import { listTracks, patchTrack, resolveTrack, createTrack } from '../tracks/service';

/** The demo's tracks besides the headline (which the starting spec's indicator makes). */
export const DEMO_TRACKS = [
  { code: 'pm25', name: 'PM2.5', indicator: 'pm25', specName: 'PM2.5 regional default' },
  { code: 'so2', name: 'SO2 per person', indicator: 'so2_pc', specName: 'SO2 regional default' },
] as const;
export const DEMO_HEADLINE_NAME = 'CO2 per person';

/** The headline track (renamed for the demo) and the other demo tracks, each with its spec. */
export async function ensureDemoTracks(ctx: AppContext, caller: Caller): Promise<void> {
  const headline = await resolveTrack(ctx.db);
  if (headline.name !== DEMO_HEADLINE_NAME)
    await patchTrack(ctx.db, caller, headline.code, { name: DEMO_HEADLINE_NAME });
  const have = new Set((await listTracks(ctx.db)).map((t) => t.code));
  for (const t of DEMO_TRACKS) {
    if (have.has(t.code)) continue;
    const spec = await createSpec(ctx.db, caller, {
      ...DEFAULT_SPEC,
      name: t.specName,
      description: DEFAULT_SPEC.description,
      emissionsIndicator: t.indicator,
    });
    await createTrack(ctx.db, caller, { code: t.code, name: t.name, specId: spec.id });
  }
}

/** Publishes one run per demo track; returns their ids (null when there is nothing to do). */
export async function publishInitialDemoRuns(
  ctx: AppContext,
  email: string | null,
  timeoutMs = 180_000,
): Promise<number[] | null> {
  if (!email || (await listRuns(ctx.db, 1)).length > 0) return null;
  const caller = await callerByEmail(ctx.db, email);
  if (!caller) return null;
  await ensureDemoTracks(ctx, caller);
  const runs = await startRuns(ctx, null, { track: 'all', trigger: 'schedule' });
  const until = Date.now() + timeoutMs;
  for (const run of runs) {
    for (;;) {
      const r = await runView(ctx.db, run.id);
      if (r.state === 'in_review') break;
      if (r.state === 'failed' || Date.now() > until)
        throw new Error(`the first demo run #${run.id} did not reach review (${r.state}: ${r.error ?? 'timeout'})`);
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
  }
  return runs.map((r) => r.id);
}
