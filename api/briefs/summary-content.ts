/**
 * The district summary brief: a first page with every shown track's standing for one
 * district side by side (the headline track first), then each track's own district brief
 * on a page of its own. Pure; the service gathers the runs and estimates.
 */
import type { BriefTrack, DistrictBriefContent } from '../../contracts/briefs';
import type { EstimateRecord } from '../runs/estimate-record';
import { gapText, projectionTexts, thresholdTexts } from './figures';
import { formatDate } from './format';
import { CAUTIONS, standingLabel } from './words';

/** One track's row on the first page. */
export interface SummaryRow {
  track: BriefTrack;
  /** the watched indicator with its unit, e.g. "PM2.5 annual mean concentration (µg/m³)" */
  indicator: string;
  standingKey: string;
  standing: string;
  gap: string;
  /** the threshold with the driver's unit, e.g. "22,000 constant 2020 currency units per person" */
  threshold: string;
  crossing: string;
  /** "run #12 of 3 December 2026", or why there is nothing to show */
  run: string;
}

export interface DistrictSummaryContent {
  kind: 'district-summary';
  code: string;
  name: string;
  subtitle: string;
  headline: string;
  rows: SummaryRow[];
  note: string;
  cautions: string[];
  /** the generated-on line of the first page */
  generatedAt: string;
  paperSize: DistrictBriefContent['paperSize'];
  /** the region's locale (BCP 47): the PDF's document language */
  locale?: string;
  /** each track's district brief, in the rows' order (tracks without an estimate have none) */
  pages: DistrictBriefContent[];
}

/** What the service found for one track: its brief (when it has an estimate) or why not. */
export type TrackFinding =
  | {
      track: BriefTrack;
      indicator: string;
      driverUnit: string;
      record: EstimateRecord;
      brief: DistrictBriefContent;
      runId: number;
      publishedAt: string | null;
    }
  | { track: BriefTrack; indicator: string; missing: string };

const DASH = '—';

export function summaryRow(f: TrackFinding, timeZone: string): SummaryRow {
  if ('missing' in f)
    return {
      track: f.track,
      indicator: f.indicator,
      standingKey: 'none',
      standing: DASH,
      gap: DASH,
      threshold: DASH,
      crossing: DASH,
      run: f.missing,
    };
  const r = f.record;
  const th = thresholdTexts(r);
  return {
    track: f.track,
    indicator: f.indicator,
    standingKey: r.standing.standing,
    standing: `${standingLabel(r.standing.standing)}${r.status === 'substitute' ? ' (regional curve)' : ''}`,
    gap: th.value === 'none' || r.gapPercent === null ? DASH : gapText(r),
    threshold: th.value === 'none' ? 'none' : `${th.value}${f.driverUnit ? ` ${f.driverUnit}` : ''}`,
    crossing: projectionTexts(r).value,
    run: `run #${f.runId}${f.publishedAt ? ` of ${formatDate(f.publishedAt, timeZone)}` : ''}`,
  };
}

export function districtSummaryContent(
  district: { code: string; name: string },
  findings: TrackFinding[],
  opts: { timeZone: string; paperSize: DistrictBriefContent['paperSize']; generatedAt: string; locale?: string },
): DistrictSummaryContent {
  const rows = findings.map((f) => summaryRow(f, opts.timeZone));
  const read = rows.filter((r) => r.standingKey !== 'none');
  const kinds = new Set(read.map((r) => r.standingKey));
  const headline = !read.length
    ? `${district.name} has no published estimate on any track yet.`
    : kinds.size === 1
      ? `${district.name} reads the same on all ${read.length} track${read.length === 1 ? '' : 's'} with a published run: ${read[0].standing.toLowerCase()}.`
      : `The tracks disagree for ${district.name}: ${read.map((r) => `${r.standing.toLowerCase()} on ${r.track.name}`).join(', ')}.`;
  return {
    kind: 'district-summary',
    code: district.code,
    name: district.name,
    subtitle: `District summary · ${district.code} · ${rows.length} track${rows.length === 1 ? '' : 's'}`,
    headline,
    rows,
    note: 'Each track is read from its own latest published run; tracks are never compared with each other by the product (a threshold is the income level where that indicator has tended to turn). The pages that follow give each track’s full brief.',
    cautions: [...CAUTIONS],
    generatedAt: opts.generatedAt,
    paperSize: opts.paperSize,
    ...(opts.locale ? { locale: opts.locale } : {}),
    pages: findings.flatMap((f) => ('brief' in f ? [f.brief] : [])),
  };
}
