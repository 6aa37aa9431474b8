/**
 * Reading what runs stored, for the published views (region, district list, card, history)
 * and for comparing two published runs (alerts). Runs write these rows; this store only
 * reads them. Rows come back camelCased.
 */
import type { Knex } from 'knex';
import { Client } from 'pg';
import { estimateListRows, type EstimateListRow } from '../db/estimate-list-rows';

import type { ModelSpec } from '../estimation';
import type { EstimateRecord } from '../runs/estimate-record';
import { PooledCurveSchema, type PooledCurve } from '../../contracts/estimates';
import { parse } from '../../contracts/kit';

export type { EstimateListRow };

/** The series a run was fitted on, as the run recorded them. */
export interface RunSelection {
  emissions: string;
  driver: string;
  controls: string[];
  firstYear: number | null;
  lastYear: number | null;
}

/**
 * What the published views, briefs and exports show of a run (`state` tells a published
 * run from one in review, which analysts may export).
 */
export interface PublishedRun {
  id: number;
  /** the track the run re-estimated */
  trackId: number;
  state: string;
  publishedAt: string | null;
  spec: { name: string; model: ModelSpec; selection: RunSelection };
  dataVersion: number | null;
  dataHash: string | null;
  softwareVersion: string;
  /** the regional pooled curve as fitted (parsed with its contract) */
  pooled: PooledCurve | null;
}

const iso = (v: unknown) => (v ? new Date(v as string).toISOString() : null);
const num = (v: unknown) => (v === null || v === undefined ? null : Number(v));

function toPublishedRun(r: Record<string, unknown>): PublishedRun {
  return {
    id: Number(r.id),
    trackId: Number(r.track_id),
    state: String(r.state),
    publishedAt: iso(r.published_at),
    spec: r.spec as PublishedRun['spec'],
    dataVersion: num(r.data_version),
    dataHash: (r.data_hash as string | null) ?? null,
    softwareVersion: String(r.software_version),
    pooled: r.pooled ? parse(PooledCurveSchema, r.pooled) : null,
  };
}

const RUN_COLUMNS = [
  'id',
  'track_id',
  'state',
  'published_at',
  'spec',
  'data_version',
  'data_hash',
  'software_version',
  'pooled',
];

/** A track's latest published run (or its latest before a given publish time). */
export async function latestPublished(
  db: Knex,
  trackId: number,
  before?: { publishedAt: string },
): Promise<PublishedRun | null> {
  const q = db('runs')
    .where({ state: 'published', track_id: trackId })
    .orderBy([
      { column: 'published_at', order: 'desc' },
      { column: 'id', order: 'desc' },
    ])
    .first(...RUN_COLUMNS);
  if (before) q.where('published_at', '<', before.publishedAt);
  const r = await q;
  return r ? toPublishedRun(r) : null;
}

/** One run by id in any state (callers decide which states they show). */
export async function findRun(db: Knex, id: number): Promise<PublishedRun | null> {
  const r = await db('runs')
    .where({ id })
    .first(...RUN_COLUMNS);
  return r ? toPublishedRun(r) : null;
}

/** A run's analyst notes by district code. */
export async function notesByCode(db: Knex, runId: number): Promise<Map<string, string>> {
  const rows: { code: string; note: string }[] = await db('run_notes as n')
    .join('districts as d', 'd.id', 'n.district_id')
    .where({ 'n.run_id': runId })
    .select('d.code', 'n.note');
  return new Map(rows.map((r) => [r.code, String(r.note)]));
}

/** The summary columns of a run's main estimates, in district-code order. */
export function mainEstimateRows(db: Knex, runId: number): Promise<EstimateListRow[]> {
  return estimateListRows(db, runId, 'main');
}

/** The columns two runs are compared on, per district (main variant). */
export interface ComparableEstimate {
  districtId: number;
  code: string;
  name: string;
  standing: string;
  shape: string | null;
  threshold: number | null;
  uTestRejects: boolean | null;
}

/** The main estimates of a run with the columns alerts compare, in district-code order. */
export async function comparableEstimates(db: Knex, runId: number): Promise<ComparableEstimate[]> {
  const rows = await db('run_estimates as e')
    .join('districts as d', 'd.id', 'e.district_id')
    .where({ 'e.run_id': runId, 'e.variant': 'main' })
    .orderBy('d.code')
    .select('e.district_id', 'e.standing', 'e.shape', 'e.threshold', 'e.u_test_rejects', 'd.code', 'd.name');
  return rows.map((r: Record<string, unknown>) => ({
    districtId: Number(r.district_id),
    code: String(r.code),
    name: String(r.name),
    standing: String(r.standing),
    shape: (r.shape as string | null) ?? null,
    threshold: num(r.threshold),
    uTestRejects: (r.u_test_rejects as boolean | null) ?? null,
  }));
}

/** Every record of one district in a run (all variants). */
export async function estimateRecords(db: Knex, runId: number, districtId: number): Promise<EstimateRecord[]> {
  const rows = await db('run_estimates').where({ run_id: runId, district_id: districtId }).select('result');
  return rows.map((r: { result: EstimateRecord }) => r.result);
}

/** An analyst's note on one district in a run, if any. */
export async function noteFor(
  db: Knex,
  runId: number,
  districtId: number,
): Promise<{ note: string; authorEmail: string | null; updatedAt: string } | null> {
  const r = await db('run_notes')
    .where({ run_id: runId, district_id: districtId })
    .first('note', 'author_email', 'updated_at');
  return r
    ? { note: String(r.note), authorEmail: (r.author_email as string | null) ?? null, updatedAt: iso(r.updated_at)! }
    : null;
}

/** A district's main record in every published run of a track, newest first. */
export async function publishedHistory(
  db: Knex,
  districtId: number,
  trackId: number,
): Promise<{ runId: number; publishedAt: string; dataVersion: number; record: EstimateRecord }[]> {
  const rows = await db('run_estimates as e')
    .join('runs as r', 'r.id', 'e.run_id')
    .where({ 'e.district_id': districtId, 'e.variant': 'main', 'r.state': 'published', 'r.track_id': trackId })
    .orderBy('r.published_at', 'desc')
    .select('r.id', 'r.published_at', 'r.data_version', 'e.result');
  return rows.map((r: { id: number; published_at: string; data_version: number; result: EstimateRecord }) => ({
    runId: Number(r.id),
    publishedAt: new Date(r.published_at).toISOString(),
    dataVersion: r.data_version,
    record: r.result,
  }));
}

/**
 * The card-level summary of every main record of a run, built in SQL from the stored JSON
 * (the same fields as service.ts summaryOf), so listing 3,000 districts reads a few hundred
 * bytes per district instead of decoding each full record.
 */
export async function mainSummaryRows(
  db: Knex,
  runId: number,
): Promise<{ code: string; summary: Record<string, unknown> }[]> {
  const rows = await db.raw(
    `SELECT d.code, jsonb_build_object(
        'status', r->'status',
        'standing', r#>'{standing,standing}',
        'intervalBounded', r#>'{standing,intervalBounded}',
        'intervalMethod', r#>'{standing,intervalMethod}',
        'shape', r#>'{shape,shape}',
        'threshold', r#>'{threshold,level}',
        'thresholdLo', r#>'{standing,levelLo}',
        'thresholdHi', r#>'{standing,levelHi}',
        'fiellerKind', r#>'{threshold,fieller,kind}',
        'extrapolated', coalesce(r#>'{threshold,extrapolated}', 'false'::jsonb),
        'gapPercent', r->'gapPercent',
        'crossingYear', r#>'{projection,crossingYear}',
        'crossingEarliest', r#>'{projection,earliest}',
        'crossingLatest', r#>'{projection,latest}',
        'projectionStatus', r#>'{projection,status}',
        'lastYear', r->'lastYear',
        'levelNow', r#>'{range,levelNow}'
      ) AS summary
       FROM run_estimates e
       JOIN districts d ON d.id = e.district_id
       -- Detoast each record once (OFFSET 0 keeps the subquery from being inlined), not once per path.
       CROSS JOIN LATERAL (SELECT e.result || '{}'::jsonb AS r OFFSET 0) x
      WHERE e.run_id = ? AND e.variant = 'main'
      ORDER BY d.code`,
    [runId],
  );
  return rows.rows as { code: string; summary: Record<string, unknown> }[];
}

/** A district's main-estimate columns in each of the given runs (the card's track rows). */
export async function mainRowsOfDistrict(
  db: Knex,
  runIds: number[],
  districtId: number,
): Promise<Map<number, { standing: string; shape: string | null; gapPercent: number | null }>> {
  if (!runIds.length) return new Map();
  const rows: Record<string, unknown>[] = await db('run_estimates')
    .whereIn('run_id', runIds)
    .where({ district_id: districtId, variant: 'main' })
    .select('run_id', 'standing', 'shape', 'gap_percent');
  return new Map(
    rows.map((r) => [
      Number(r.run_id),
      { standing: String(r.standing), shape: (r.shape as string | null) ?? null, gapPercent: num(r.gap_percent) },
    ]),
  );
}

/**
 * What every published answer depends on, in one cheap statement: each track's latest
 * published run, the tracks themselves (names, states, specs) and the headline setting, the
 * notes attached to those runs (count and last edit), the data version (uploads applied) and
 * the district table (count and highest id). Any change to one of them changes the answer.
 */
export async function publishedVersion(db: Knex): Promise<{ version: string; tracks: number }> {
  const { rows } = await db.raw(`
    WITH latest AS (
      SELECT DISTINCT ON (track_id) id FROM runs WHERE state = 'published'
       ORDER BY track_id, published_at DESC, id DESC
    )
    SELECT
      coalesce((SELECT string_agg(id::text, ',' ORDER BY id) FROM latest), '') AS runs,
      (SELECT count(*) || '@' || coalesce(max(updated_at)::text, '') FROM tracks) AS tracks,
      (SELECT count(*)::int FROM tracks) AS track_count,
      (SELECT value::text FROM settings WHERE key = 'headline_track') AS headline,
      (SELECT count(*) || '@' || coalesce(max(updated_at)::text, '') FROM run_notes WHERE run_id IN (SELECT id FROM latest)) AS notes,
      (SELECT coalesce(max(version), 0) FROM uploads WHERE version IS NOT NULL) AS data_version,
      (SELECT count(*) || '@' || coalesce(max(id), 0) FROM districts) AS districts`);
  const r = rows[0];
  return {
    version: `runs ${r.runs}; tracks ${r.tracks}; headline ${r.headline ?? ''}; notes ${r.notes}; data ${r.data_version}; districts ${r.districts}`,
    tracks: Number(r.track_count),
  };
}

/** The channel the published-tables' triggers notify on (migration 20261205020000). */
export const PUBLISHED_CHANNEL = 'crestwatch_published';

/**
 * Listens on PUBLISHED_CHANNEL over a connection of its own (outside the Knex pool, which it
 * would otherwise hold for ever). `changed` runs on every notification; `lost` once when the
 * connection fails or ends. The connection never keeps the process alive. Resolves with a
 * function that stops listening.
 */
export async function listenForPublishedChanges(
  db: Knex,
  on: { changed(): void; lost(err: unknown): void },
): Promise<() => Promise<void>> {
  const settings = (db.client as { connectionSettings: ConstructorParameters<typeof Client>[0] }).connectionSettings;
  const client = new Client(settings);
  let lost = false;
  const lose = (err: unknown) => {
    if (lost) return;
    lost = true;
    on.lost(err);
  };
  client.on('error', lose);
  client.on('end', () => lose(new Error('the listening connection ended')));
  client.on('notification', () => on.changed());
  try {
    await client.connect();
    await client.query(`LISTEN ${PUBLISHED_CHANNEL}`);
  } catch (err) {
    lost = true;
    await client.end().catch(() => {});
    throw err;
  }
  (client as unknown as { connection?: { stream?: { unref?(): void } } }).connection?.stream?.unref?.();
  return () => client.end().catch(() => {});
}
