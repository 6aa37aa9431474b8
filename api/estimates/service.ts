/**
 * What officials see: the latest published run only. The region's standings, one
 * district's published estimate with its sensitivity variants, and a district's history
 * across published runs.
 */
import type { Knex } from 'knex';
import { NotFoundError } from '../http/errors';
import type { EstimateRecord } from '../runs/estimate-record';
import * as runs from '../runs/store';

export function publishedRunMeta(run: runs.RunRow) {
  return {
    id: run.id,
    publishedAt: run.publishedAt,
    specName: run.spec.name,
    model: run.spec.model,
    selection: run.spec.selection,
    dataVersion: run.dataVersion,
    dataHash: run.dataHash,
    softwareVersion: run.softwareVersion,
  };
}
export type PublishedRunMeta = ReturnType<typeof publishedRunMeta>;

/** The card-level summary of a district's main estimate. */
export function summaryOf(r: EstimateRecord) {
  return {
    status: r.status,
    standing: r.standing.standing,
    intervalBounded: r.standing.intervalBounded,
    intervalMethod: r.standing.intervalMethod,
    shape: r.shape?.shape ?? null,
    threshold: r.threshold?.level ?? null,
    thresholdLo: r.standing.levelLo,
    thresholdHi: r.standing.levelHi,
    fiellerKind: r.threshold?.fieller.kind ?? null,
    extrapolated: r.threshold?.extrapolated ?? false,
    gapPercent: r.gapPercent,
    crossingYear: r.projection?.crossingYear ?? null,
    crossingEarliest: r.projection?.earliest ?? null,
    crossingLatest: r.projection?.latest ?? null,
    projectionStatus: r.projection?.status ?? null,
    lastYear: r.lastYear,
    levelNow: r.range?.levelNow ?? null,
  };
}
export type EstimateSummary = ReturnType<typeof summaryOf>;

/** SQL's JSON null for a missing path, as summaryOf would give it (absent `extrapolated` is false). */
function nullsToDefaults(s: Record<string, unknown>): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const [k, v] of Object.entries(s)) out[k] = v === undefined ? null : v;
  if (out.extrapolated === null) out.extrapolated = false;
  return out;
}

export async function latestPublished(db: Knex): Promise<runs.RunRow | null> {
  return runs.latestPublished(db);
}

/** Code → summary of the latest published run (for the district list and the region view). */
export async function publishedSummaries(db: Knex): Promise<{ run: runs.RunRow | null; byCode: Map<string, EstimateSummary> }> {
  const run = await runs.latestPublished(db);
  if (!run) return { run: null, byCode: new Map() };
  // Built in SQL (runs/store.ts mainSummaryRows) with the same fields as summaryOf: decoding
  // every full record took over a second for 3,000 districts.
  const rows = await runs.mainSummaryRows(db, run.id);
  return { run, byCode: new Map(rows.map((r) => [r.code, nullsToDefaults(r.summary) as EstimateSummary])) };
}

export async function region(db: Knex) {
  const { run, byCode } = await publishedSummaries(db);
  const districts = await db('districts').orderBy('name').select('code', 'name');
  const counts: Record<string, number> = {};
  const rows = districts.map((d: { code: string; name: string }) => {
    const estimate = byCode.get(d.code) ?? null;
    const key = estimate?.standing ?? 'not_estimable';
    counts[key] = (counts[key] ?? 0) + 1;
    return { code: d.code, name: d.name, estimate };
  });
  const pooled = run?.pooled ?? null;
  return {
    run: run ? publishedRunMeta(run) : null,
    counts,
    pooled: pooled && pooled.status === 'ok'
      ? { shape: pooled.shape.shape, threshold: pooled.turningPoints[0]?.level ?? null, fieller: pooled.turningPoints[0]?.fieller ?? null, terms: pooled.terms, coefficients: pooled.coefficients, range: pooled.range }
      : null,
    districts: rows,
  };
}

async function districtRow(db: Knex, code: string): Promise<{ id: number; code: string; name: string }> {
  const d = await db('districts').where({ code }).first('id', 'code', 'name');
  if (!d) throw new NotFoundError(`No district with code ${code}`, { code });
  return { id: Number(d.id), code: d.code, name: d.name };
}

export async function districtEstimate(db: Knex, code: string) {
  const d = await districtRow(db, code);
  const run = await runs.latestPublished(db);
  if (!run) return { district: { code: d.code, name: d.name }, run: null, main: null, variants: [], note: null };
  const records = await runs.estimateRecords(db, run.id, d.id);
  const note = (await runs.notesFor(db, run.id)).get(d.id) ?? null;
  const main = records.find((r) => r.variant === 'main') ?? null;
  const variants = records
    .filter((r) => r.variant !== 'main')
    .map((r) => ({ variant: r.variant, ...summaryOf(r), reason: r.reason }));
  return { district: { code: d.code, name: d.name }, run: publishedRunMeta(run), main, variants, note };
}

export async function districtHistory(db: Knex, code: string) {
  const d = await districtRow(db, code);
  const rows = await db('run_estimates as e')
    .join('runs as r', 'r.id', 'e.run_id')
    .where({ 'e.district_id': d.id, 'e.variant': 'main', 'r.state': 'published' })
    .orderBy('r.published_at', 'desc')
    .select('r.id', 'r.published_at', 'r.data_version', 'e.result');
  return {
    district: { code: d.code, name: d.name },
    history: rows.map((r: { id: number; published_at: string; data_version: number; result: EstimateRecord }) => ({
      runId: Number(r.id),
      publishedAt: new Date(r.published_at).toISOString(),
      dataVersion: r.data_version,
      ...summaryOf(r.result),
    })),
  };
}
