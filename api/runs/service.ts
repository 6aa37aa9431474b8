/**
 * Runs: start (by hand, on schedule, or to reproduce one), follow, review against the last
 * published run, publish (which is what officials see and what raises alerts), discard.
 */
import type { Knex } from 'knex';
import { createAlertsForPublish } from '../alerts/service';
import { districtChange } from '../alerts/compare';
import * as audit from '../audit/service';
import type { AppContext } from '../context';
import { lockForTransaction } from '../db/locks';
import { districtByCode } from '../districts/service';
import { AppError, NotFoundError } from '../http/errors';
import type { Caller } from '../http/routes';
import { QUEUES } from '../common/queues';
import { getSettings } from '../settings/service';
import { resolveTrack, trackById, trackRef, tracksById } from '../tracks/service';
import { answerChanges, type AnswerChange } from './corrections';
import { loadSeries } from './data-store';
import { fitDistrict } from './district-fit';
import type { EstimateRecord } from './estimate-record';
import * as store from './store';

export { reproduceRun, startRun, startRuns } from './start';

async function mustFind(db: Knex, id: number): Promise<store.RunRow> {
  const run = await store.findRun(db, id);
  if (!run) throw new NotFoundError(`No run ${id}`, { id });
  return run;
}

const VISIBLE: store.RunState[] = ['in_review', 'published', 'discarded'];

export async function runView(db: Knex, id: number) {
  const run = await mustFind(db, id);
  const done = await store.chunksDone(db, id);
  const estimatesVisible = VISIBLE.includes(run.state);
  const rows = estimatesVisible ? await store.listEstimateRows(db, id) : [];
  const counts: Record<string, number> = {};
  for (const r of rows) counts[r.standing] = (counts[r.standing] ?? 0) + 1;
  const pooled = run.pooled;
  let reproduction: {
    of: number;
    identical: boolean | null;
    differences: number;
    softwareChanged: boolean;
    originalSoftware: string | null;
    changedAnswers: AnswerChange[];
  } | null = null;
  if (run.reproducesRunId && estimatesVisible) {
    const n = await store.countDifferences(db, run.reproducesRunId, id);
    const original = await store.findRun(db, run.reproducesRunId);
    const changedAnswers =
      n === 0 ? [] : answerChanges(await store.mainRecords(db, run.reproducesRunId), await store.mainRecords(db, id));
    reproduction = {
      of: run.reproducesRunId,
      identical: n === 0,
      differences: n,
      softwareChanged: original !== null && original.softwareVersion !== run.softwareVersion,
      originalSoftware: original ? original.softwareVersion : null,
      changedAnswers,
    };
  }
  return {
    id: run.id,
    state: run.state,
    trigger: run.trigger,
    track: await trackRef(db, await trackById(db, run.trackId)),
    spec: run.spec,
    specId: run.specId,
    dataVersion: run.dataVersion,
    dataHash: run.dataHash,
    dataRows: run.dataRows,
    softwareVersion: run.softwareVersion,
    createdAt: run.createdAt,
    startedAt: run.startedAt,
    finishedAt: run.finishedAt,
    publishedAt: run.publishedAt,
    discardedAt: run.discardedAt,
    error: run.error,
    progress: { chunksDone: done, chunksTotal: run.chunksTotal, districts: run.districtsTotal },
    timings: run.timings,
    standingCounts: estimatesVisible ? counts : null,
    pooled: !pooled
      ? null
      : pooled.status === 'ok'
        ? {
            status: pooled.status,
            shape: pooled.shape.shape,
            threshold: pooled.turningPoints[0] ?? null,
            n: pooled.n,
            districts: pooled.districts,
          }
        : { status: pooled.status, shape: null, threshold: null, n: pooled.n, districts: null },
    reproduction,
  };
}

/** Recent runs, newest first; of one track when its code is given. */
export async function listRuns(db: Knex, limit: number, track?: string) {
  const trackId = track ? (await resolveTrack(db, track)).id : undefined;
  const [runs, tracks] = await Promise.all([store.listRuns(db, limit, trackId), tracksById(db)]);
  return runs.map((r) => ({
    id: r.id,
    state: r.state,
    trigger: r.trigger,
    track: tracks.get(r.trackId)!.code,
    trackName: tracks.get(r.trackId)!.name,
    specName: r.spec.name,
    createdAt: r.createdAt,
    finishedAt: r.finishedAt,
    publishedAt: r.publishedAt,
    districts: r.districtsTotal,
    error: r.error,
  }));
}

function visibleOrThrow(run: store.RunRow) {
  if (!VISIBLE.includes(run.state))
    throw new AppError(
      409,
      'run_not_ready',
      `Run #${run.id} is ${run.state}: its estimates appear when it reaches review.`,
    );
}

/** Per district: this run against the last published run (before it). */
export async function reviewRows(db: Knex, id: number) {
  const run = await mustFind(db, id);
  visibleOrThrow(run);
  const previous = await previousPublishedFor(db, run);
  const [rows, prevRows, notes, settings] = await Promise.all([
    store.listEstimateRows(db, id),
    previous ? store.listEstimateRows(db, previous.id) : Promise.resolve([]),
    store.notesFor(db, id),
    getSettings(db),
  ]);
  const prevById = new Map(prevRows.map((p) => [p.districtId, p]));
  return {
    runId: id,
    track: await trackRef(db, await trackById(db, run.trackId)),
    previousRunId: previous?.id ?? null,
    thresholdShiftPercent: settings.thresholdShiftPercent,
    districts: rows.map((r) => {
      const p = prevById.get(r.districtId) ?? null;
      const { districtId, ...current } = r;
      return {
        ...current,
        previous: p
          ? { standing: p.standing, shape: p.shape, threshold: p.threshold, uTestRejects: p.uTestRejects }
          : null,
        change: districtChange(p, r),
        note: notes.get(districtId)?.note ?? null,
      };
    }),
  };
}

async function previousPublishedFor(db: Knex, run: store.RunRow) {
  return run.state === 'published' && run.publishedAt
    ? store.latestPublished(db, run.trackId, { publishedAt: run.publishedAt })
    : store.latestPublished(db, run.trackId);
}

async function districtId(db: Knex, code: string): Promise<number> {
  return (await districtByCode(db, code)).id;
}

/**
 * One district in review: every variant, the previous published estimate, and why the
 * threshold moved — the previous spec refitted on this run's data splits the change into
 * the part due to data revisions and the part due to the spec.
 */
export async function districtReview(db: Knex, id: number, code: string) {
  const run = await mustFind(db, id);
  visibleOrThrow(run);
  const did = await districtId(db, code);
  const records = await store.estimateRecords(db, id, did);
  const previous = await previousPublishedFor(db, run);
  const prevMain = previous
    ? ((await store.estimateRecords(db, previous.id, did)).find((r) => r.variant === 'main') ?? null)
    : null;
  const main = records.find((r) => r.variant === 'main') ?? null;
  let movement: null | {
    previous: number | null;
    current: number | null;
    previousSpecOnNewData: number | null;
    dataPart: number | null;
    specPart: number | null;
    softwareChanged: boolean;
    previousSoftware: string;
    specChanged: boolean;
  } = null;
  if (previous && main) {
    const series = await loadSeries(db, run.dataVersion!, previous.spec.selection, [did]);
    const refit: EstimateRecord | null = series.length
      ? fitDistrict({ spec: previous.spec.model, controls: previous.spec.selection.controls }, series[0].data, null)[0]
      : null;
    const a = prevMain?.threshold?.level ?? null;
    const b = refit?.threshold?.level ?? null;
    const c = main.threshold?.level ?? null;
    movement = {
      previous: a,
      current: c,
      previousSpecOnNewData: b,
      dataPart: a !== null && b !== null ? b - a : null,
      specPart: b !== null && c !== null ? c - b : null,
      softwareChanged: previous.softwareVersion !== run.softwareVersion,
      previousSoftware: previous.softwareVersion,
      specChanged: JSON.stringify(previous.spec) !== JSON.stringify(run.spec),
    };
  }
  const note = (await store.notesFor(db, id)).get(did) ?? null;
  return { runId: id, code, records, previousRunId: previous?.id ?? null, previous: prevMain, movement, note };
}

export async function publishRun(ctx: AppContext, caller: Caller, id: number) {
  const result = await ctx.db.transaction(async (trx) => {
    // One publish at a time, so "the previous published run" is well defined.
    await lockForTransaction(trx, 'publish');
    const run = await store.findRun(trx, id, true);
    if (!run) throw new NotFoundError(`No run ${id}`, { id });
    if (run.state !== 'in_review')
      throw new AppError(409, 'not_in_review', `Run #${id} is ${run.state}; only a run in review can be published.`);
    // Only the same track's previous publish: no alert ever compares two tracks.
    const previous = await store.latestPublished(trx, run.trackId);
    const settings = await getSettings(trx);
    await store.transition(trx, id, ['in_review'], 'published', { published_at: trx.fn.now(), reviewed_by: caller.id });
    const published = (await store.findRun(trx, id))!;
    const outcome = await createAlertsForPublish(trx, published, previous, settings.thresholdShiftPercent, ctx.config);
    await audit.record(trx, {
      actorId: caller.id,
      actorEmail: caller.email,
      action: 'run.publish',
      targetType: 'run',
      targetId: id,
      after: { previousRunId: previous?.id ?? null, ...outcome },
    });
    return { previousRunId: previous?.id ?? null, ...outcome };
  });
  if (result.mails && ctx.jobs) await ctx.jobs.send(QUEUES.outbox, { reason: `publish ${id}` });
  return result;
}

export async function discardRun(ctx: AppContext, caller: Caller, id: number) {
  await mustFind(ctx.db, id);
  const ok = await store.transition(ctx.db, id, ['in_review', 'failed', 'queued'], 'discarded', {
    discarded_at: ctx.db.fn.now(),
    reviewed_by: caller.id,
  });
  if (!ok) throw new AppError(409, 'cannot_discard', `Run #${id} can no longer be discarded.`);
  await audit.record(ctx.db, {
    actorId: caller.id,
    actorEmail: caller.email,
    action: 'run.discard',
    targetType: 'run',
    targetId: id,
  });
}

export async function addNote(db: Knex, caller: Caller, id: number, code: string, note: string) {
  const run = await mustFind(db, id);
  if (run.state === 'discarded' || run.state === 'failed')
    throw new AppError(409, 'run_closed', `Run #${id} is ${run.state}.`);
  const did = await districtId(db, code);
  await store.upsertNote(db, id, did, note, caller);
  await audit.record(db, {
    actorId: caller.id,
    actorEmail: caller.email,
    action: 'run.note',
    targetType: 'run',
    targetId: id,
    after: { code, note },
  });
}

/** The id of the newest publish of any track (null before the first): changes whenever any track publishes. */
export async function latestPublishedRunId(db: Knex): Promise<number | null> {
  return (await store.latestPublished(db, null))?.id ?? null;
}

/** The track code of each run, in order. */
export async function trackCodesOf(db: Knex, runs: { trackId: number }[]): Promise<string[]> {
  const tracks = await tracksById(db);
  return runs.map((r) => tracks.get(r.trackId)!.code);
}

/** The data a run reads, for the what-if fit of one district on the current data. */
export { currentDataVersion, loadSeries } from './data-store';
