/**
 * Briefs read published runs only: the latest, or one named by id that is published.
 * Builds the brief content (district or region) from the run's stored estimates, the
 * settings (paper size, time zone, alert limit) and the indicator catalogue; the PDF and
 * the JSON view are both made from that content.
 */
import type { Knex } from 'knex';
import type { DistrictBriefContent, RegionBriefContent } from '../../contracts/briefs';
import type { AppContext } from '../context';
import { currentCollection } from '../boundaries/answer';
import { AppError, NotFoundError } from '../http/errors';
import { districtByCode, districtNames } from '../districts/service';
import * as estimates from '../estimates/service';
import type { PublishedRun } from '../estimates/service';
import { correctionNotice } from '../runs/corrections';
import { getSettings } from '../settings/service';
import { districtBriefContent } from './district-content';
import { locatorScene, standingsMapScene } from './map-figure';
import { regionBriefContent, type PooledFit } from './region-content';
import { indicatorWords, summaryRecords } from './store';
import type { BriefSource } from './trace';

/** Sizes of the brief's maps, in points. */
export const REGION_MAP = { width: 170, height: 150 };
export const LOCATOR = { width: 110, height: 90 };

/** The published run a brief reads: `runId` when given (it must be published), else the latest. */
export async function publishedRun(db: Knex, runId?: number): Promise<PublishedRun> {
  if (runId !== undefined) {
    const run = await estimates.findRun(db, runId);
    if (!run || run.state !== 'published')
      throw new NotFoundError(`No published run ${runId}: briefs are made from published runs only.`, { runId });
    return run;
  }
  const run = await estimates.latestPublished(db);
  if (!run)
    throw new AppError(
      404,
      'no_published_run',
      'Nothing has been published yet: a brief appears once a run is published.',
    );
  return run;
}

export async function briefSource(db: Knex, run: PublishedRun, generatedAt = new Date()): Promise<BriefSource> {
  const [settings, catalogue] = await Promise.all([getSettings(db), indicatorWords(db)]);
  return {
    run,
    timeZone: settings.regionTimeZone,
    paperSize: settings.briefPaperSize,
    generatedAt,
    indicators: catalogue,
  };
}

export async function districtBrief(db: Knex, code: string, runId?: number): Promise<DistrictBriefContent> {
  const district = await districtByCode(db, code);
  const run = await publishedRun(db, runId);
  const records = await estimates.estimateRecords(db, run.id, district.id);
  const main = records.find((r) => r.variant === 'main');
  if (!main)
    throw new AppError(
      404,
      'not_in_run',
      `District ${code} has no estimate in published run #${run.id} (no data when it ran).`,
      { code, runId: run.id },
    );
  const note = (await estimates.noteFor(db, run.id, district.id))?.note ?? null;
  const correction = await correctionNotice(db, run.id, district.id);
  const content = districtBriefContent(
    await briefSource(db, run),
    { code: district.code, name: district.name },
    main,
    note,
    correction?.text ?? null,
  );
  const fc = await currentCollection(db, 'print');
  return {
    ...content,
    locator: fc
      ? locatorScene(fc, district.code, main.standing.standing, district.name, LOCATOR.width, LOCATOR.height)
      : null,
  };
}

export async function regionBrief(db: Knex, runId?: number): Promise<RegionBriefContent> {
  const run = await publishedRun(db, runId);
  const previous = run.publishedAt
    ? await estimates.latestPublished(db, { publishedAt: run.publishedAt }, run.trackId)
    : null;
  const [records, districts, current, previousRows, settings, src] = await Promise.all([
    summaryRecords(db, run.id),
    districtNames(db),
    estimates.mainEstimateRows(db, run.id),
    previous ? estimates.mainEstimateRows(db, previous.id) : Promise.resolve(null),
    getSettings(db),
    briefSource(db, run),
  ]);
  const content = regionBriefContent(
    src,
    {
      records,
      districts,
      current,
      previous: previous && previousRows ? { runId: previous.id, rows: previousRows } : null,
      shiftPercent: settings.thresholdShiftPercent,
    },
    run.pooled as PooledFit | null,
  );
  const fc = await currentCollection(db, 'print');
  const standings = new Map(current.map((r) => [r.code, r.standing]));
  return { ...content, map: fc ? standingsMapScene(fc, standings, REGION_MAP.width, REGION_MAP.height) : null };
}

/** A thread hands back the PDF's bytes as a Uint8Array; Express and mail want a Buffer. */
const asBuffer = (u: Uint8Array): Buffer =>
  Buffer.isBuffer(u) ? u : Buffer.from(u.buffer, u.byteOffset, u.byteLength);

/** The content is read here; the PDF is drawn in the compute pool, off the event loop. */
export async function districtBriefPdf(
  { db, compute }: Pick<AppContext, 'db' | 'compute'>,
  code: string,
  runId?: number,
): Promise<{ filename: string; content: Buffer; runId: number }> {
  const c = await districtBrief(db, code, runId);
  const content = asBuffer(await compute.run({ kind: 'district-pdf', content: c }));
  return { filename: `crestwatch-${c.code}-run-${c.trace.runId}.pdf`, content, runId: c.trace.runId };
}

export async function regionBriefPdf(
  { db, compute }: Pick<AppContext, 'db' | 'compute'>,
  runId?: number,
): Promise<{ filename: string; content: Buffer; runId: number }> {
  const c = await regionBrief(db, runId);
  const content = asBuffer(await compute.run({ kind: 'region-pdf', content: c }));
  return { filename: `crestwatch-region-run-${c.trace.runId}.pdf`, content, runId: c.trace.runId };
}
