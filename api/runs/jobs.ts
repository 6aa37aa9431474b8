/**
 * The work of a run, as job handlers: `run-start` reads one data version (records its
 * hash), fits the pooled regional curve and fans the districts out in chunks;
 * `run-chunk` fits its districts (every variant) and writes their estimates; the chunk
 * that completes the set moves the run to in_review. Handlers are idempotent: a retried
 * start clears the run's output, a retried chunk overwrites its own rows.
 */
import { fitPanel, type FitPanelResult, type PanelRow } from '../estimation';
import type { AppContext } from '../context';
import { QUEUES, type Handler } from '../common/queues';
import {
  hashSeries,
  loadSeries,
  currentDataVersion,
  packSeries,
  unpackSeries,
  type DistrictSeries,
  type PackedSeries,
} from './data-store';
import * as store from './store';
import type { PooledCurve } from '../../contracts/estimates';

function panelRows(series: DistrictSeries[], controls: string[]): PanelRow[] {
  const rows: PanelRow[] = [];
  for (const s of series) {
    for (let i = 0; i < s.data.years.length; i++) {
      const c: Record<string, number> = {};
      for (const name of controls) c[name] = s.data.controls[name][i];
      rows.push({ district: s.code, year: s.data.years[i], y: s.data.y[i], x: s.data.x[i], controls: c });
    }
  }
  return rows;
}

/**
 * The pooled curve as the engine needs it. The run row holds the engine's own panel fit,
 * written by the pooled step of this job (a JSON round trip keeps every field); the
 * contract checks the parts answers read, so this is the one place the rest is trusted.
 */
function panelFitOf(pooled: PooledCurve | null): FitPanelResult | null {
  return pooled && pooled.status === 'ok' ? (pooled as unknown as FitPanelResult) : null;
}

export function fitPooled(
  series: DistrictSeries[],
  spec: store.RunSpec,
): FitPanelResult | { status: 'failed'; message: string } {
  try {
    return fitPanel(panelRows(series, spec.selection.controls), {
      ...spec.model,
      covariance: 'cluster',
      controls: spec.selection.controls,
    });
  } catch (err) {
    return { status: 'failed', message: (err as Error).message };
  }
}

async function failRun(ctx: AppContext, runId: number, message: string): Promise<void> {
  await store.transition(ctx.db, runId, ['queued', 'running'], 'failed', {
    error: message.slice(0, 2000),
    finished_at: ctx.db.fn.now(),
  });
}

export async function startRun(ctx: AppContext, runId: number, isLastAttempt: boolean): Promise<void> {
  const { db } = ctx;
  const run = await store.findRun(db, runId);
  if (!run || (run.state !== 'queued' && run.state !== 'running')) return;
  const pickedAt = Date.now();
  try {
    const t0 = performance.now();
    const version = run.dataVersion ?? (await currentDataVersion(db));
    const series = await loadSeries(db, version, run.spec.selection);
    const { hash, rows } = hashSeries(series, run.spec.selection);
    if (run.dataHash && run.dataHash !== hash) {
      await failRun(
        ctx,
        runId,
        `The data of version ${version} no longer hash to ${run.dataHash} (got ${hash}): history was changed.`,
      );
      return;
    }
    const t1 = performance.now();
    const pooled = fitPooled(series, run.spec);
    const t2 = performance.now();
    const size = ctx.config.runChunkSize;
    const chunks: DistrictSeries[][] = [];
    for (let i = 0; i < series.length; i += size) chunks.push(series.slice(i, i + size));
    await db.transaction(async (trx) => {
      await store.clearRunOutput(trx, runId);
      await store.update(trx, runId, {
        state: 'running',
        started_at: trx.fn.now(),
        data_version: version,
        data_hash: hash,
        data_rows: rows,
        chunks_total: chunks.length,
        districts_total: series.length,
        pooled: JSON.stringify(pooled),
        attempts: store.incremented(trx, 'attempts'),
        timings: JSON.stringify({ pickedAt, readMs: t1 - t0, pooledMs: t2 - t1 }),
      });
    });
    if (chunks.length === 0) {
      await store.transition(db, runId, ['running'], 'in_review', { finished_at: db.fn.now() });
      return;
    }
    await ctx.jobs!.insert(
      QUEUES.runChunk,
      // Each chunk carries its series: the run's data are read once, here.
      chunks.map((part, chunk) => ({
        runId,
        chunk,
        districtIds: part.map((s) => s.districtId),
        series: packSeries(part, run.spec.selection.controls),
      })),
    );
    ctx.jobs!.notify(QUEUES.runChunk);
  } catch (err) {
    if (isLastAttempt) await failRun(ctx, runId, `The run could not start: ${(err as Error).message}`);
    throw err;
  }
}

/** `items` cut into at most `n` runs of near-equal length, in order. */
function sliceEvenly<T>(items: T[], n: number): T[][] {
  const count = Math.min(n, items.length);
  const out: T[][] = [];
  for (let i = 0; i < count; i++)
    out.push(items.slice(Math.floor((i * items.length) / count), Math.floor(((i + 1) * items.length) / count)));
  return out;
}

export async function runChunk(
  ctx: AppContext,
  data: { runId: number; chunk: number; districtIds: number[]; series?: PackedSeries },
  isLastAttempt: boolean,
): Promise<void> {
  const { db } = ctx;
  const run = await store.findRun(db, data.runId);
  if (!run || run.state !== 'running') return;
  try {
    const t0 = performance.now();
    const series = data.series
      ? unpackSeries(data.series, run.spec.selection.controls)
      : await loadSeries(db, run.dataVersion!, run.spec.selection, data.districtIds);
    const t1 = performance.now();
    const pooled = panelFitOf(run.pooled);
    const model = { spec: run.spec.model, controls: run.spec.selection.controls };
    // The fits run in the compute pool, so a run never stalls the readers of this process:
    // the chunk is cut into slices, two per thread, so every thread fits while the COPY
    // below already streams the slices that are done; a thread returns its slice as COPY
    // text, so no record crosses the thread boundary or is serialised on this event loop.
    let fitsDone = t1;
    const slices = sliceEvenly(series, Math.max(1, ctx.compute.size) * 2);
    const parts = slices.map((part) => {
      const text = ctx.compute
        .run({
          kind: 'district-fits-copy',
          runId: run.id,
          model,
          districts: part.map((s) => ({ districtId: s.districtId, data: s.data })),
          pooled,
        })
        .then((t) => {
          fitsDone = Math.max(fitsDone, performance.now());
          return t;
        });
      // Awaited in order by the COPY; a failure is reported there, never as unhandled.
      text.catch(() => {});
      return text;
    });
    await db.transaction(async (trx) => {
      await store.writeEstimatesText(
        trx,
        run.id,
        series.map((s) => s.districtId),
        parts,
      );
      const done = await store.markChunkDone(trx, run.id, data.chunk);
      if (done >= (run.chunksTotal ?? 0)) {
        await store.transition(trx, run.id, ['running'], 'in_review', { finished_at: trx.fn.now() });
      }
    });
    const t3 = performance.now();
    // Fits and writes overlap: fitMs runs to the last slice fitted, writeMs is what the
    // write added after it (the rest of the COPY, the chunk's bookkeeping, the commit).
    const t2 = fitsDone;
    await store.addChunkTimings(db, run.id, { chunkReadMs: t1 - t0, fitMs: t2 - t1, writeMs: t3 - t2 });
  } catch (err) {
    if (isLastAttempt) await failRun(ctx, run.id, `Chunk ${data.chunk} failed: ${(err as Error).message}`);
    throw err;
  }
}

export function runHandlers(ctx: AppContext): { 'run-start': Handler; 'run-chunk': Handler } {
  return {
    'run-start': (data, meta) => startRun(ctx, Number(data.runId), meta.retryCount >= meta.retryLimit),
    'run-chunk': (data, meta) =>
      runChunk(
        ctx,
        data as unknown as { runId: number; chunk: number; districtIds: number[]; series?: PackedSeries },
        meta.retryCount >= meta.retryLimit,
      ),
  };
}
