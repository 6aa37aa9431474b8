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
import { resolveTrack, shownTracks, trackById } from '../tracks/service';
import { formatDateTime, inLocale } from './format';
import { districtSummaryContent, type DistrictSummaryContent, type TrackFinding } from './summary-content';
import { districtBriefContent } from './district-content';
import { locatorScene, standingsMapScene } from './map-figure';
import { regionBriefContent, type PooledFit } from './region-content';
import { indicatorWords, summaryRecords } from './store';
import type { BriefSource } from './trace';

/** Sizes of the brief's maps, in points. */
export const REGION_MAP = { width: 170, height: 150 };
export const LOCATOR = { width: 110, height: 90 };

/**
 * The published run a brief reads: `runId` when given (it must be published, and belong to
 * `track` when one is named), else the latest published run of `track` (default: the headline).
 */
export async function publishedRun(db: Knex, runId?: number, track?: string): Promise<PublishedRun> {
  if (runId !== undefined) {
    const run = await estimates.findRun(db, runId);
    if (!run || run.state !== 'published')
      throw new NotFoundError(`No published run ${runId}: briefs are made from published runs only.`, { runId });
    if (track && (await resolveTrack(db, track)).id !== run.trackId)
      throw new NotFoundError(`Published run ${runId} is not a run of track "${track}".`, { runId, track });
    return run;
  }
  const t = await resolveTrack(db, track);
  const run = await estimates.latestPublished(db, undefined, t.id);
  if (!run)
    throw new AppError(
      404,
      'no_published_run',
      `Nothing has been published for ${t.name} yet: a brief appears once a run of the track is published.`,
      { track: t.code },
    );
  return run;
}

export async function briefSource(db: Knex, run: PublishedRun, generatedAt = new Date()): Promise<BriefSource> {
  const [settings, catalogue, track] = await Promise.all([
    getSettings(db),
    indicatorWords(db),
    trackById(db, run.trackId),
  ]);
  return {
    run,
    timeZone: settings.regionTimeZone,
    paperSize: settings.briefPaperSize,
    locale: settings.regionLocale,
    generatedAt,
    indicators: catalogue,
    track: { code: track.code, name: track.name },
  };
}

async function districtBriefIn(db: Knex, code: string, runId?: number, track?: string): Promise<DistrictBriefContent> {
  const district = await districtByCode(db, code);
  const run = await publishedRun(db, runId, track);
  return districtBriefOfRun(db, district, run);
}

/**
 * Every figure and date of a brief is written in the region's locale (the `regionLocale`
 * setting): the content is built inside it (api/briefs/format.ts reads it across awaits).
 */
async function localised<T>(db: Knex, build: () => Promise<T>): Promise<T> {
  const { regionLocale } = await getSettings(db);
  return inLocale(regionLocale, build);
}

export function districtBrief(db: Knex, code: string, runId?: number, track?: string): Promise<DistrictBriefContent> {
  return localised(db, () => districtBriefIn(db, code, runId, track));
}

export function regionBrief(db: Knex, runId?: number, track?: string): Promise<RegionBriefContent> {
  return localised(db, () => regionBriefIn(db, runId, track));
}

export function districtSummary(db: Knex, code: string): Promise<DistrictSummaryContent> {
  return localised(db, () => districtSummaryIn(db, code));
}

/** A district's brief from one published run (any track). */
export async function districtBriefOfRun(
  db: Knex,
  district: { id: number; code: string; name: string },
  run: PublishedRun,
): Promise<DistrictBriefContent> {
  const code = district.code;
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

async function regionBriefIn(db: Knex, runId?: number, track?: string): Promise<RegionBriefContent> {
  const run = await publishedRun(db, runId, track);
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

/** The district summary: every shown track's standing side by side, then each track's brief. */
async function districtSummaryIn(db: Knex, code: string): Promise<DistrictSummaryContent> {
  const district = await districtByCode(db, code);
  const [tracks, settings, words] = await Promise.all([shownTracks(db), getSettings(db), indicatorWords(db)]);
  const findings: TrackFinding[] = [];
  for (const t of tracks) {
    const track = { code: t.code, name: t.name };
    const label = words.get(t.emissionsIndicator);
    const indicator = label ? `${label.name}${label.unit ? ` (${label.unit})` : ''}` : t.emissionsIndicator;
    const run = await estimates.latestPublished(db, undefined, t.id);
    if (!run) {
      findings.push({ track, indicator, missing: 'no published run yet' });
      continue;
    }
    const main = (await estimates.estimateRecords(db, run.id, district.id)).find((r) => r.variant === 'main');
    if (!main) {
      findings.push({ track, indicator, missing: `not in run #${run.id} (no data when it ran)` });
      continue;
    }
    findings.push({
      track,
      indicator,
      driverUnit: words.get(run.spec.selection.driver)?.unit ?? '',
      record: main,
      brief: await districtBriefOfRun(db, district, run),
      runId: run.id,
      publishedAt: run.publishedAt,
    });
  }
  return districtSummaryContent({ code: district.code, name: district.name }, findings, {
    timeZone: settings.regionTimeZone,
    paperSize: settings.briefPaperSize,
    locale: settings.regionLocale,
    generatedAt: formatDateTime(new Date(), settings.regionTimeZone),
  });
}

/** A thread hands back the PDF's bytes as a Uint8Array; Express and mail want a Buffer. */
const asBuffer = (u: Uint8Array): Buffer =>
  Buffer.isBuffer(u) ? u : Buffer.from(u.buffer, u.byteOffset, u.byteLength);

/** The content is read here; the PDF is drawn in the compute pool, off the event loop. */
export async function districtBriefPdf(
  { db, compute }: Pick<AppContext, 'db' | 'compute'>,
  code: string,
  runId?: number,
  track?: string,
): Promise<{ filename: string; content: Buffer; runId: number }> {
  const c = await districtBrief(db, code, runId, track);
  const content = asBuffer(await compute.run({ kind: 'district-pdf', content: c }));
  const t = c.track ? `-${c.track.code}` : '';
  return { filename: `crestwatch-${c.code}${t}-run-${c.trace.runId}.pdf`, content, runId: c.trace.runId };
}

export async function districtSummaryPdf(
  { db, compute }: Pick<AppContext, 'db' | 'compute'>,
  code: string,
): Promise<{ filename: string; content: Buffer }> {
  const c = await districtSummary(db, code);
  const content = asBuffer(await compute.run({ kind: 'summary-pdf', content: c }));
  return { filename: `crestwatch-${c.code}-summary.pdf`, content };
}

export async function regionBriefPdf(
  { db, compute }: Pick<AppContext, 'db' | 'compute'>,
  runId?: number,
  track?: string,
): Promise<{ filename: string; content: Buffer; runId: number }> {
  const c = await regionBrief(db, runId, track);
  const content = asBuffer(await compute.run({ kind: 'region-pdf', content: c }));
  const t = c.track ? `-${c.track.code}` : '';
  return { filename: `crestwatch-region${t}-run-${c.trace.runId}.pdf`, content, runId: c.trace.runId };
}
