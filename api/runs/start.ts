/**
 * Starting runs: each run re-estimates one track with the track's current spec (a snapshot
 * of it is kept with the run). By hand for one track (default: the headline) or for every
 * active track; the schedule starts one run per active track; at most one queued or running
 * run per track (a unique index); a reproduction re-executes a run of the same track.
 */
import type { Knex } from 'knex';
import * as audit from '../audit/service';
import type { AppContext } from '../context';
import { ModelSpec } from '../estimation';
import { AppError, NotFoundError } from '../http/errors';
import type { Caller } from '../http/routes';
import { QUEUES } from '../common/queues';
import { getSettings } from '../settings/service';
import type { SavedSpec } from '../specs/schema';
import { getSpec } from '../specs/service';
import { activeTracks, resolveTrack, trackById, type TrackRow } from '../tracks/service';
import { SOFTWARE_VERSION } from '../version';
import * as store from './store';

async function snapshot(db: Knex, spec: SavedSpec): Promise<store.RunSpec> {
  const settings = await getSettings(db);
  return {
    savedSpecId: spec.id,
    name: spec.name,
    selection: {
      emissions: spec.emissionsIndicator,
      driver: spec.driverIndicator,
      controls: spec.controls,
      firstYear: spec.firstYear,
      lastYear: spec.lastYear,
    },
    model: ModelSpec.parse({
      form: spec.form,
      transform: spec.transform,
      covariance: spec.covariance,
      lag: spec.lag,
      intervalMethod: spec.intervalMethod,
      levelControls: spec.levelControls,
      controls: spec.controls,
      minYears: spec.minYears ?? undefined,
      level: settings.confidenceLevel,
      alpha: settings.alpha,
    }),
  };
}

function jobsOf(ctx: AppContext) {
  if (!ctx.jobs) throw new AppError(503, 'jobs_unavailable', 'The job queue is not running on this server.');
  return ctx.jobs;
}

async function insertQueued(
  ctx: AppContext,
  args: Parameters<typeof store.insertRun>[1],
  caller: Caller | null,
  trackCode: string,
): Promise<store.RunRow> {
  const jobs = jobsOf(ctx);
  let run: store.RunRow;
  try {
    run = await ctx.db.transaction(async (trx) => {
      const r = await store.insertRun(trx, args);
      await audit.record(trx, {
        actorId: caller?.id ?? null,
        actorEmail: caller?.email ?? null,
        action: args.trigger === 'reproduce' ? 'run.reproduce' : 'run.start',
        targetType: 'run',
        targetId: r.id,
        after: { specId: r.specId, trigger: r.trigger, track: trackCode },
      });
      return r;
    });
  } catch (err) {
    if ((err as { code?: string }).code === '23505') {
      const active = await store.activeRunForTrack(ctx.db, args.trackId);
      throw new AppError(
        409,
        'run_in_progress',
        `Run #${active?.id ?? '?'} of track "${trackCode}" is still ${active?.state ?? 'active'}; wait for it to finish.`,
        { runId: active?.id, track: trackCode },
      );
    }
    throw err;
  }
  await jobs.send(QUEUES.runStart, { runId: run.id });
  jobs.notify(QUEUES.runStart);
  return run;
}

async function startForTrack(
  ctx: AppContext,
  caller: Caller | null,
  track: TrackRow,
  trigger: 'manual' | 'schedule',
): Promise<store.RunRow> {
  if (track.state === 'archived')
    throw new AppError(409, 'track_archived', `Track "${track.code}" is archived: it gets no new runs.`, {
      track: track.code,
    });
  const spec = await getSpec(ctx.db, track.specId);
  if (spec.archived) throw new AppError(409, 'spec_archived', `Spec "${spec.name}" is archived.`);
  return insertQueued(
    ctx,
    {
      trackId: track.id,
      specId: spec.id,
      spec: await snapshot(ctx.db, spec),
      trigger,
      requestedBy: caller?.id ?? null,
      softwareVersion: SOFTWARE_VERSION,
    },
    caller,
    track.code,
  );
}

/** Queues one run of a track (default: the headline track). */
export async function startRun(
  ctx: AppContext,
  caller: Caller | null,
  input: { track?: string; trigger?: 'manual' | 'schedule' },
): Promise<store.RunRow> {
  const track = await resolveTrack(ctx.db, input.track);
  return startForTrack(ctx, caller, track, input.trigger ?? 'manual');
}

/**
 * Queues runs: of one track, or with `'all'` one per active track (paused and archived ones
 * get none). A track whose run is still going is left out of 'all' (the schedule must not
 * fail because one track is slow); when none could start, the first refusal is thrown.
 */
export async function startRuns(
  ctx: AppContext,
  caller: Caller | null,
  input: { track?: string; trigger?: 'manual' | 'schedule' },
): Promise<store.RunRow[]> {
  if (input.track !== 'all') return [await startRun(ctx, caller, input)];
  const tracks = await activeTracks(ctx.db);
  if (!tracks.length) throw new AppError(409, 'no_active_track', 'No track is active: resume one first.');
  const started: store.RunRow[] = [];
  let refusal: unknown = null;
  for (const t of tracks) {
    try {
      started.push(await startForTrack(ctx, caller, t, input.trigger ?? 'manual'));
    } catch (err) {
      if ((err as { code?: string }).code !== 'run_in_progress') throw err;
      refusal ??= err;
    }
  }
  if (!started.length) throw refusal;
  return started;
}

/** Re-executes a run from its recorded spec, data version and data hash (same track). */
export async function reproduceRun(ctx: AppContext, caller: Caller, runId: number): Promise<store.RunRow> {
  const original = await store.findRun(ctx.db, runId);
  if (!original) throw new NotFoundError(`No run ${runId}`, { id: runId });
  if (original.dataVersion === null || !original.dataHash)
    throw new AppError(409, 'not_reproducible', `Run #${runId} never read its data.`);
  return insertQueued(
    ctx,
    {
      trackId: original.trackId,
      specId: original.specId,
      spec: original.spec,
      trigger: 'reproduce',
      requestedBy: caller.id,
      softwareVersion: SOFTWARE_VERSION,
      reproducesRunId: original.id,
      dataVersion: original.dataVersion,
      dataHash: original.dataHash,
    },
    caller,
    (await trackById(ctx.db, original.trackId)).code,
  );
}
