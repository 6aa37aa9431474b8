/** Runs, their chunks and estimates: the only place their SQL lives. */
import { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import type { Knex } from 'knex';
import { estimateListRows, type EstimateListRow } from '../db/estimate-list-rows';

import type { PoolClient } from 'pg';
import { from as copyFrom } from 'pg-copy-streams';
import type { ModelSpec } from '../estimation';
import type { EstimateRecord, Variant } from './estimate-record';
import { ESTIMATE_COPY_COLUMNS, estimatesCopyText } from './estimate-copy';
import type { Selection } from './data-store';
import { PooledCurveSchema, type PooledCurve } from '../../contracts/estimates';
import { parse } from '../../contracts/kit';

export type { EstimateListRow };
export { estimatesCopyText };

export type RunState = 'queued' | 'running' | 'in_review' | 'published' | 'discarded' | 'failed';

/** What a run records of its spec: the saved spec it came from, the series and the model. */
export interface RunSpec {
  savedSpecId: number;
  name: string;
  selection: Selection;
  model: ModelSpec;
}

export interface RunRow {
  id: number;
  /** the track the run re-estimates */
  trackId: number;
  specId: number;
  spec: RunSpec;
  state: RunState;
  trigger: string;
  reproducesRunId: number | null;
  dataVersion: number | null;
  dataHash: string | null;
  dataRows: number | null;
  softwareVersion: string;
  requestedBy: number | null;
  reviewedBy: number | null;
  chunksTotal: number | null;
  districtsTotal: number | null;
  /** the regional pooled curve as fitted (null until the run has fitted it) */
  pooled: PooledCurve | null;
  timings: Record<string, number> | null;
  error: string | null;
  attempts: number;
  createdAt: string;
  startedAt: string | null;
  finishedAt: string | null;
  publishedAt: string | null;
  discardedAt: string | null;
}

const iso = (v: unknown) => (v ? new Date(v as string).toISOString() : null);
const num = (v: unknown) => (v === null || v === undefined ? null : Number(v));

function toRun(r: Record<string, unknown>): RunRow {
  return {
    id: Number(r.id),
    trackId: Number(r.track_id),
    specId: Number(r.spec_id),
    spec: r.spec as RunSpec,
    state: r.state as RunState,
    trigger: String(r.trigger),
    reproducesRunId: num(r.reproduces_run_id),
    dataVersion: num(r.data_version),
    dataHash: (r.data_hash as string | null) ?? null,
    dataRows: num(r.data_rows),
    softwareVersion: String(r.software_version),
    requestedBy: num(r.requested_by),
    reviewedBy: num(r.reviewed_by),
    chunksTotal: num(r.chunks_total),
    districtsTotal: num(r.districts_total),
    pooled: r.pooled ? parse(PooledCurveSchema, r.pooled) : null,
    timings: (r.timings as Record<string, number> | null) ?? null,
    error: (r.error as string | null) ?? null,
    attempts: Number(r.attempts),
    createdAt: iso(r.created_at)!,
    startedAt: iso(r.started_at),
    finishedAt: iso(r.finished_at),
    publishedAt: iso(r.published_at),
    discardedAt: iso(r.discarded_at),
  };
}

export async function insertRun(
  db: Knex,
  r: {
    trackId: number;
    specId: number;
    spec: RunSpec;
    trigger: string;
    requestedBy: number | null;
    softwareVersion: string;
    reproducesRunId?: number | null;
    dataVersion?: number | null;
    dataHash?: string | null;
  },
): Promise<RunRow> {
  const [row] = await db('runs')
    .insert({
      track_id: r.trackId,
      spec_id: r.specId,
      spec: JSON.stringify(r.spec),
      trigger: r.trigger,
      requested_by: r.requestedBy,
      software_version: r.softwareVersion,
      reproduces_run_id: r.reproducesRunId ?? null,
      data_version: r.dataVersion ?? null,
      data_hash: r.dataHash ?? null,
    })
    .returning('*');
  return toRun(row);
}

export async function findRun(db: Knex, id: number, forUpdate = false): Promise<RunRow | null> {
  const q = db('runs').where({ id }).first();
  if (forUpdate) q.forUpdate();
  const r = await q;
  return r ? toRun(r) : null;
}

export async function listRuns(db: Knex, limit: number, trackId?: number): Promise<RunRow[]> {
  const q = db('runs').orderBy('id', 'desc').limit(limit);
  if (trackId !== undefined) q.where({ track_id: trackId });
  return (await q.select('*')).map(toRun);
}

export async function update(db: Knex, id: number, patch: Record<string, unknown>): Promise<void> {
  await db('runs').where({ id }).update(patch);
}

/** Sets state only when the run is in one of `from`; returns whether it did. */
export async function transition(
  db: Knex,
  id: number,
  from: RunState[],
  to: RunState,
  extra: Record<string, unknown> = {},
): Promise<boolean> {
  const n = await db('runs')
    .where({ id })
    .whereIn('state', from)
    .update({ state: to, ...extra });
  return n > 0;
}

export async function clearRunOutput(db: Knex, id: number): Promise<void> {
  await db('run_estimates').where({ run_id: id }).del();
  await db('run_chunks').where({ run_id: id }).del();
}

export interface EstimateRow {
  districtId: number;
  record: EstimateRecord;
}

/**
 * Writes a chunk's estimates with COPY. Idempotent: a retried chunk first deletes its own
 * rows. Call inside a transaction (a Knex transaction hands COPY its own connection), so
 * the delete and the copy land together.
 */
export async function writeEstimates(db: Knex, runId: number, rows: EstimateRow[]): Promise<void> {
  if (!rows.length) return;
  await writeEstimatesText(
    db,
    runId,
    rows.map((r) => r.districtId),
    [estimatesCopyText(runId, rows)],
  );
}

/**
 * Writes a chunk's estimates from COPY text made elsewhere (a compute-pool thread, see
 * estimate-copy.ts): one COPY stream, fed each part in order as soon as it resolves, so
 * the rows of the first districts travel while later districts are still being fitted.
 * Idempotent like writeEstimates: the chunk's districts lose their earlier rows first.
 * Call inside a transaction.
 */
export async function writeEstimatesText(
  db: Knex,
  runId: number,
  districtIds: number[],
  parts: Iterable<string | Promise<string>>,
): Promise<void> {
  if (!districtIds.length) return;
  await db.raw(`DELETE FROM run_estimates WHERE run_id = ? AND district_id = ANY(?::int[])`, [
    runId,
    [...new Set(districtIds)],
  ]);
  const client = db.client as {
    acquireConnection(): Promise<PoolClient>;
    releaseConnection(c: PoolClient): Promise<void>;
  };
  const conn = await client.acquireConnection();
  try {
    await pipeline(
      Readable.from(
        (async function* () {
          for (const part of parts) {
            const text = await part;
            if (text) yield text;
          }
        })(),
      ),
      conn.query(copyFrom(`COPY run_estimates (${ESTIMATE_COPY_COLUMNS}) FROM STDIN`)),
    );
  } finally {
    await client.releaseConnection(conn);
  }
}

/** Records a finished chunk; returns how many of the run's chunks are done. */
export async function markChunkDone(db: Knex, runId: number, chunk: number): Promise<number> {
  await db('run_chunks').insert({ run_id: runId, chunk }).onConflict(['run_id', 'chunk']).ignore();
  const [{ count }] = await db('run_chunks').where({ run_id: runId }).count<{ count: string }[]>({ count: '*' });
  return Number(count);
}

export async function chunksDone(db: Knex, runId: number): Promise<number> {
  const [{ count }] = await db('run_chunks').where({ run_id: runId }).count<{ count: string }[]>({ count: '*' });
  return Number(count);
}

/** The summary columns of a run's estimates for one variant, in district-code order. */
export function listEstimateRows(db: Knex, runId: number, variant: Variant = 'main'): Promise<EstimateListRow[]> {
  return estimateListRows(db, runId, variant);
}

/** Full records of a run for the given districts (all variants). */
export async function estimateRecords(db: Knex, runId: number, districtId: number): Promise<EstimateRecord[]> {
  const rows = await db('run_estimates').where({ run_id: runId, district_id: districtId }).select('result');
  return rows.map((r: { result: EstimateRecord }) => r.result);
}

/** Every main record of a run with district code and name (briefs, exports). */
export async function mainRecords(
  db: Knex,
  runId: number,
): Promise<(EstimateRecord & { code: string; name: string })[]> {
  const rows = await db('run_estimates as e')
    .join('districts as d', 'd.id', 'e.district_id')
    .where({ 'e.run_id': runId, 'e.variant': 'main' })
    .orderBy('d.code')
    .select('e.result', 'd.code', 'd.name');
  return rows.map((r: { result: EstimateRecord; code: string; name: string }) => ({
    ...r.result,
    code: r.code,
    name: r.name,
  }));
}

/** The latest published run of a track (any track when `trackId` is null), or the latest before a publish time. */
export async function latestPublished(
  db: Knex,
  trackId: number | null,
  before?: { publishedAt: string },
): Promise<RunRow | null> {
  const q = db('runs')
    .where({ state: 'published' })
    .orderBy([
      { column: 'published_at', order: 'desc' },
      { column: 'id', order: 'desc' },
    ])
    .first();
  if (trackId !== null) q.where({ track_id: trackId });
  if (before) q.where('published_at', '<', before.publishedAt);
  const r = await q;
  return r ? toRun(r) : null;
}

export async function activeRunForTrack(db: Knex, trackId: number): Promise<RunRow | null> {
  const r = await db('runs').where({ track_id: trackId }).whereIn('state', ['queued', 'running']).first();
  return r ? toRun(r) : null;
}

export async function upsertNote(
  db: Knex,
  runId: number,
  districtId: number,
  note: string,
  author: { id: number; email: string },
): Promise<void> {
  await db('run_notes')
    .insert({
      run_id: runId,
      district_id: districtId,
      note,
      author_id: author.id,
      author_email: author.email,
      updated_at: db.fn.now(),
    })
    .onConflict(['run_id', 'district_id'])
    .merge();
}

export async function notesFor(
  db: Knex,
  runId: number,
): Promise<Map<number, { note: string; authorEmail: string | null; updatedAt: string }>> {
  const rows = await db('run_notes').where({ run_id: runId }).select('*');
  return new Map(
    rows.map((r: Record<string, unknown>) => [
      Number(r.district_id),
      { note: String(r.note), authorEmail: (r.author_email as string | null) ?? null, updatedAt: iso(r.updated_at)! },
    ]),
  );
}

/** `column + 1` inside an update (a retried start counts its attempts). */
export function incremented(db: Knex, column: string): Knex.Raw {
  return db.raw('?? + 1', [column]);
}

/** Adds one chunk's phase times to the run's running totals (ms). */
export async function addChunkTimings(
  db: Knex,
  runId: number,
  t: { chunkReadMs: number; fitMs: number; writeMs: number },
): Promise<void> {
  await db('runs')
    .where({ id: runId })
    .update({
      timings: db.raw(
        `coalesce(timings, '{}'::jsonb) || jsonb_build_object('chunkReadMs', coalesce((timings->>'chunkReadMs')::float8, 0) + ?::float8, 'fitMs', coalesce((timings->>'fitMs')::float8, 0) + ?::float8, 'writeMs', coalesce((timings->>'writeMs')::float8, 0) + ?::float8)`,
        [t.chunkReadMs, t.fitMs, t.writeMs],
      ),
    });
}

/** Estimates of a reproduction that differ from its original's (district × variant), or exist on one side only. */
export async function countDifferences(db: Knex, originalRunId: number, runId: number): Promise<number> {
  const diff = await db.raw(
    `SELECT count(*)::int AS n FROM run_estimates a FULL JOIN run_estimates b
       ON b.run_id = ? AND a.district_id = b.district_id AND a.variant = b.variant
      WHERE a.run_id = ? AND (b.result IS NULL OR a.result IS DISTINCT FROM b.result)`,
    [originalRunId, runId],
  );
  return Number(diff.rows[0].n);
}
