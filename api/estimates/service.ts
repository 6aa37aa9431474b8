/**
 * What officials see: each track's latest published run only (the headline track when a
 * read names none). The region's standings, the district list with each standing, one
 * district's published estimate with its sensitivity variants and a row per shown track,
 * and a district's history across a track's published runs. Also what alerts compare
 * between two published runs of one track.
 */
import type { Knex } from 'knex';
import { districtByCode, districtNames, districtSummaries } from '../districts/service';
import { regionEstimate } from './region-rows';
import type { RegionEstimate } from '../../contracts/estimates';
import { indicatorLabels, resolveTrack, shownTracks, trackRef, type TrackRow } from '../tracks/service';
import type { IndicatorLabel } from '../../contracts/tracks';
import type { EstimateRecord } from '../runs/estimate-record';
import { correctionNotice } from '../runs/corrections';
import * as store from './store';

export type { ComparableEstimate, EstimateListRow, PublishedRun } from './store';

export function publishedRunMeta(
  run: store.PublishedRun,
  units: { emissions: IndicatorLabel; driver: IndicatorLabel },
) {
  return {
    id: run.id,
    publishedAt: run.publishedAt,
    specName: run.spec.name,
    model: run.spec.model,
    selection: run.spec.selection,
    dataVersion: run.dataVersion,
    dataHash: run.dataHash,
    softwareVersion: run.softwareVersion,
    units,
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

/** A published run's meta with its indicators' labels (units) from the catalogue. */
export async function runMeta(db: Knex, run: store.PublishedRun): Promise<PublishedRunMeta> {
  const { emissions, driver } = run.spec.selection;
  const labels = await indicatorLabels(db, [emissions, driver]);
  return publishedRunMeta(run, { emissions: labels.get(emissions)!, driver: labels.get(driver)! });
}

/**
 * A track's latest published run (the headline track's when `trackId` is not given), or
 * its latest published before `before.publishedAt`.
 */
export async function latestPublished(
  db: Knex,
  before?: { publishedAt: string },
  trackId?: number,
): Promise<store.PublishedRun | null> {
  return store.latestPublished(db, trackId ?? (await resolveTrack(db)).id, before);
}

/** A run by id in any state; briefs and exports decide which states they read. */
export const findRun = (db: Knex, id: number) => store.findRun(db, id);
/** Every record (all variants) of one district in a run. */
export const estimateRecords = (db: Knex, runId: number, districtId: number) =>
  store.estimateRecords(db, runId, districtId);
/** An analyst's note on one district in a run, if any. */
export const noteFor = (db: Knex, runId: number, districtId: number) => store.noteFor(db, runId, districtId);
/** A run's analyst notes by district code. */
export const notesByCode = (db: Knex, runId: number) => store.notesByCode(db, runId);
/** The summary columns of a run's main estimates, in district-code order. */
export const mainEstimateRows = (db: Knex, runId: number) => store.mainEstimateRows(db, runId);

/** The main estimates of a run on the columns two runs are compared on (alerts). */
export function comparableEstimates(db: Knex, runId: number): Promise<store.ComparableEstimate[]> {
  return store.comparableEstimates(db, runId);
}

/** Code → summary of a track's latest published run (for the district list and the region view). */
export async function publishedSummaries(
  db: Knex,
  track?: TrackRow,
): Promise<{ run: store.PublishedRun | null; byCode: Map<string, EstimateSummary> }> {
  const run = await store.latestPublished(db, (track ?? (await resolveTrack(db))).id);
  if (!run) return { run: null, byCode: new Map() };
  // Built in SQL (store.ts mainSummaryRows) with the same fields as summaryOf: decoding
  // every full record took over a second for 3,000 districts.
  const rows = await store.mainSummaryRows(db, run.id);
  return { run, byCode: new Map(rows.map((r) => [r.code, nullsToDefaults(r.summary) as EstimateSummary])) };
}

/** Every district's code and name, by name: what the search needs (the region answer has the standings). */
export async function listDistricts(db: Knex) {
  const districts = await districtNames(db);
  return { districts: districts.map((d) => ({ code: d.code, name: d.name })) };
}

export async function region(db: Knex, trackCode?: string) {
  const track = await resolveTrack(db, trackCode);
  const [{ run, byCode }, districts] = await Promise.all([publishedSummaries(db, track), districtSummaries(db)]);
  const counts: Record<string, number> = {};
  const rows = districts.map((d) => {
    const estimate = byCode.get(d.code) ?? null;
    const key = estimate?.standing ?? 'not_estimable';
    counts[key] = (counts[key] ?? 0) + 1;
    return {
      code: d.code,
      name: d.name,
      firstYear: d.firstYear,
      lastYear: d.lastYear,
      nYears: d.nYears,
      // The summaries' enum fields come from SQL as plain strings; they hold the contract's values.
      estimate: estimate && regionEstimate(estimate as unknown as RegionEstimate),
    };
  });
  const pooled = run?.pooled ?? null;
  return {
    track: await trackRef(db, track),
    run: run ? await runMeta(db, run) : null,
    counts,
    pooled:
      pooled && pooled.status === 'ok'
        ? {
            shape: pooled.shape.shape,
            threshold: pooled.turningPoints[0]?.level ?? null,
            fieller: pooled.turningPoints[0]?.fieller ?? null,
            terms: pooled.terms,
            coefficients: pooled.coefficients,
            range: pooled.range,
          }
        : null,
    districts: rows,
  };
}

/** One row per shown track (the headline first): its standing here in its latest published run. */
async function trackRows(db: Knex, districtId: number) {
  const tracks = await shownTracks(db);
  const runIds = tracks.map((t) => t.publishedRunId).filter((id): id is number => id !== null);
  const rows = await store.mainRowsOfDistrict(db, runIds, districtId);
  return Promise.all(
    tracks.map(async (t) => {
      const row = t.publishedRunId === null ? null : (rows.get(t.publishedRunId) ?? null);
      return {
        ...(await trackRef(db, t)),
        standing: (row?.standing ?? null) as EstimateSummary['standing'] | null,
        gapPercent: row?.gapPercent ?? null,
        shape: (row?.shape ?? null) as EstimateSummary['shape'],
        runId: t.publishedRunId,
      };
    }),
  );
}

export async function districtEstimate(db: Knex, code: string, trackCode?: string) {
  const d = await districtByCode(db, code);
  const track = await resolveTrack(db, trackCode);
  const [ref, tracks, run] = await Promise.all([
    trackRef(db, track),
    trackRows(db, d.id),
    store.latestPublished(db, track.id),
  ]);
  if (!run)
    return {
      district: { code: d.code, name: d.name },
      track: ref,
      tracks,
      run: null,
      main: null,
      variants: [],
      note: null,
      correction: null,
    };
  const [records, note, correction] = await Promise.all([
    store.estimateRecords(db, run.id, d.id),
    store.noteFor(db, run.id, d.id),
    correctionNotice(db, run.id, d.id),
  ]);
  const main = records.find((r) => r.variant === 'main') ?? null;
  const variants = records
    .filter((r) => r.variant !== 'main')
    .map((r) => ({ variant: r.variant, ...summaryOf(r), reason: r.reason }));
  return {
    district: { code: d.code, name: d.name },
    track: ref,
    tracks,
    run: await runMeta(db, run),
    main,
    variants,
    note,
    correction,
  };
}

export async function districtHistory(db: Knex, code: string, trackCode?: string) {
  const d = await districtByCode(db, code);
  const track = await resolveTrack(db, trackCode);
  const rows = await store.publishedHistory(db, d.id, track.id);
  return {
    district: { code: d.code, name: d.name },
    track: await trackRef(db, track),
    history: rows.map((r) => ({
      runId: r.runId,
      publishedAt: r.publishedAt,
      dataVersion: r.dataVersion,
      ...summaryOf(r.record),
    })),
  };
}
