/**
 * The content of a district brief, from the district's main estimate in a published run:
 * the headline, the standing, the figures, the two charts, a three-line reading, the
 * model line, the cautions and the trace. Pure; the PDF and the HTML view render it.
 */
import type { BriefFigure, DistrictBriefContent } from '../../contracts/briefs';
import type { EstimateRecord } from '../runs/estimate-record';
import { curveChart, pathChart, type ThresholdMark } from './chart-scene';
import { elasticityTexts, gapText, levelTextOf, projectionTexts, thresholdTexts, type ThresholdTexts } from './figures';
import { agree } from '../../lib/plain-words';
import {
  formatDate,
  formatElasticity,
  formatLevel,
  formatLevelPercent,
  formatLowerEnd,
  formatUpperEnd,
  turnTestWords,
} from './format';
import { indicatorOf, modelLine, sourcesOf, traceOf, type BriefSource } from './trace';
import { CAUTIONS, inSentence, shapeLabel, standingLabel } from './words';

/** A longer name is printed in the title only; the headline calls the district by its code. */
const HEADLINE_NAME_MAX = 48;
export const CHART_WIDTH = 252;
/** Characters of an axis label (name and unit) that fit beside "(log scale)" on a chart. */
const AXIS_LABEL_MAX = 42;
/** Letter is 50 pt shorter than A4: its charts give up part of that. */
export function chartHeight(paper: string): number {
  return paper === 'LETTER' ? 185 : 205;
}

export function districtPdfPath(code: string, track?: string): string {
  return `/api/briefs/district/${encodeURIComponent(code)}.pdf${track ? `?track=${encodeURIComponent(track)}` : ''}`;
}

function span(r: EstimateRecord): string {
  if (r.firstYear === null || r.lastYear === null) return 'no years';
  return r.firstYear === r.lastYear ? String(r.firstYear) : `${r.firstYear}–${r.lastYear}`;
}

/** The words of one track: its watched indicator and the driver, as the catalogue names them, inside a sentence. */
export interface TrackWords {
  /** e.g. "PM2.5 annual mean concentration", "CO2 emissions per person" */
  pressure: string;
  /** e.g. "real income per person" */
  driver: string;
}

function headline(r: EstimateRecord, name: string, th: ThresholdTexts, w: TrackWords): string {
  const now = r.range ? formatLevel(r.range.levelNow) : null;
  const year = r.lastYear ?? '';
  const peak = r.threshold?.kind !== 'trough';
  const unbounded =
    th.value !== 'none' && !th.bounded
      ? ` The interval is not bounded at ${levelTextOf(r)}, so this reading rests on the point estimate alone.`
      : '';
  const sub = r.status === 'substitute' ? ' (read on the regional pooled curve)' : '';
  switch (r.standing.standing) {
    case 'approaching':
      return peak
        ? `${name} is approaching its threshold${sub}: ${w.driver} (${now} in ${year}) is below the band where ${w.pressure} has tended to turn down, estimated at ${th.value}.${unbounded}`
        : `${name} is approaching the trough of a U-shaped curve${sub}: ${w.pressure} has fallen with ${w.driver} so far and would tend to rise again past about ${th.value}; ${w.driver} is ${now} (${year}).${unbounded}`;
    case 'at_turn':
      return `${name} is at its threshold${sub}: ${w.driver} (${now} in ${year}) lies inside the band around the estimated turning point of ${th.value}.${unbounded}`;
    case 'past_turn':
      return peak
        ? `${name} is past its threshold${sub}: ${w.driver} (${now} in ${year}) is above the band where ${w.pressure} has tended to turn down, estimated at ${th.value}.${unbounded}`
        : `${name} is past the trough of a U-shaped curve${sub}: at ${now} (${year}) ${w.driver} is above ${th.value}, where ${w.pressure} has tended to rise again with it.${unbounded}`;
    case 'no_turn': {
      const shape = r.shape?.shape;
      const how =
        shape === 'increasing'
          ? `${w.pressure} ${agree(w.pressure, 'rises', 'rise')} with ${w.driver}`
          : shape === 'decreasing'
            ? `${w.pressure} ${agree(w.pressure, 'falls', 'fall')} as ${w.driver} grows`
            : `${w.pressure} ${agree(w.pressure, 'shows', 'show')} no clear link with ${w.driver} at the ${formatLevelPercent(r.model.alpha)} level`;
      return `${name} shows no turn in the data${sub}: over ${span(r)} ${how}, and no turning point lies where the district has been.`;
    }
    default:
      return `${name} could not be estimated in this run: ${r.reason?.message ?? r.standing.note ?? 'no usable series'}.`;
  }
}

function reading(r: EstimateRecord, th: ThresholdTexts, w: TrackWords): string[] {
  const incomeName = w.driver;
  const p = w.pressure;
  const lines: string[] = [];
  const years = span(r);
  const t = th.value;
  const shape = r.shape?.shape ?? null;
  const lead =
    r.status === 'substitute'
      ? `The district’s own series (${years}) is too short for its own curve, so the region’s pooled curve is read at its income: `
      : `Over ${years}, `;
  if (r.status === 'not_estimable')
    lines.push(`No curve could be fitted: ${r.reason?.message ?? 'the series cannot carry the model'}.`);
  else if (shape === 'inverted_u')
    lines.push(`${lead}${p} rose with ${incomeName} at first and has tended to fall once it passed about ${t}.`);
  else if (shape === 'u')
    lines.push(`${lead}${p} fell with ${incomeName} at first and has tended to rise again once it passed about ${t}.`);
  else if (shape === 'n_shape' || shape === 'inverted_n') {
    const order = shape === 'n_shape' ? 'rose, then fell, then rose again' : 'fell, then rose, then fell again';
    const turn = r.threshold?.kind === 'trough' ? 'low point' : 'high point';
    lines.push(
      `${lead}${p} ${order} as ${incomeName} grew; the threshold read here is the ${turn} nearest today’s income, about ${t}.`,
    );
  } else if (shape === 'increasing')
    lines.push(`${lead}${p} rose with ${incomeName} throughout the incomes observed; no turn shows there.`);
  else if (shape === 'decreasing')
    lines.push(`${lead}${p} fell as ${incomeName} grew, throughout the incomes observed; no turn shows there.`);
  else
    lines.push(
      `${lead}${p} ${agree(p, 'shows', 'show')} no clear link with ${incomeName} at the ${formatLevelPercent(r.model.alpha)} level: the data cannot tell a rise from a fall.`,
    );
  if (r.range) {
    const e = r.elasticity?.value ?? null;
    const el =
      e !== null && Math.abs(e) >= 0.005
        ? `; today 1% more ${incomeName} goes with about ${formatElasticity(Math.abs(e))}% ${e > 0 ? 'more' : 'less'} ${p}`
        : '';
    const gap = r.gapPercent !== null && t !== 'none' ? ` (${gapText(r)} against the threshold)` : '';
    lines.push(`In ${r.lastYear}, ${incomeName} was ${formatLevel(r.range.levelNow)}${gap}${el}.`);
  } else {
    lines.push(`There is no latest ${incomeName} to read against a threshold.`);
  }
  if (t === 'none')
    lines.push(`Without a turning point there is no threshold to watch; follow the trend of ${p} itself.`);
  else if (th.bounded && th.band)
    lines.push(
      `The ${levelTextOf(r)} interval runs from ${formatLowerEnd(th.band.lo)} to ${formatUpperEnd(th.band.hi)}: read the band, not the point.`,
    );
  else
    lines.push(
      `The data do not pin the threshold down (its interval is not bounded at ${levelTextOf(r)}): treat ${t} as a rough guide only.`,
    );
  return lines;
}

function shapeDetail(r: EstimateRecord): string | null {
  const parts: string[] = [];
  if (r.uTest?.pValue !== null && r.uTest?.pValue !== undefined) {
    parts.push(turnTestWords(r.uTest.pValue, r.uTest.rejects, r.model.alpha));
  }
  for (const n of r.shape?.notes ?? []) parts.push(n);
  return parts.length ? parts.join('; ') : null;
}

function standingDetail(r: EstimateRecord, w: TrackWords): string | null {
  if (r.standing.note) return r.standing.note;
  if (r.standing.standing === 'not_estimable') return r.reason?.message ?? null;
  if (r.standing.intervalBounded && r.standing.standing !== 'no_turn')
    return `read against the ${levelTextOf(r)} ${r.standing.intervalMethod === 'delta' ? 'delta-method' : 'Fieller'} interval`;
  if (r.shape?.shape === 'u' && r.standing.standing !== 'no_turn')
    return `a U shape: past its trough ${w.pressure} rises with ${w.driver}`;
  if (
    (r.shape?.shape === 'n_shape' || r.shape?.shape === 'inverted_n') &&
    r.threshold?.kind === 'trough' &&
    r.standing.standing !== 'no_turn'
  )
    return `read from a low point: past it ${w.pressure} rises with ${w.driver}`;
  return null;
}

export function districtBriefContent(
  src: BriefSource,
  district: { code: string; name: string },
  r: EstimateRecord,
  note: string | null,
  correction: string | null = null,
): DistrictBriefContent {
  const th = thresholdTexts(r);
  const pr = projectionTexts(r);
  const level = levelTextOf(r);
  const driver = indicatorOf(src, src.run.spec.selection.driver);
  const emissions = indicatorOf(src, src.run.spec.selection.emissions);
  const w: TrackWords = { pressure: inSentence(emissions.name), driver: inSentence(driver.name) };
  const el = elasticityTexts(r, w.pressure);
  // An axis label carries the unit when it fits the chart's width; the figures always carry it.
  const withUnit = (i: { name: string; unit: string }) =>
    i.unit && i.name.length + i.unit.length <= AXIS_LABEL_MAX ? `${i.name} (${i.unit})` : i.name;
  const mark: ThresholdMark | null =
    r.threshold?.level !== null && r.threshold?.level !== undefined && Number.isFinite(r.threshold.level)
      ? { level: r.threshold.level, band: th.band }
      : null;
  const sub = r.status === 'substitute';
  const figures: BriefFigure[] = [
    { key: 'standing', label: 'Standing', value: standingLabel(r.standing.standing), detail: standingDetail(r, w) },
    {
      key: 'threshold',
      label: `${sub ? 'Threshold (regional)' : 'Threshold (turning point)'}${driver.unit ? `, ${driver.unit}` : ''}`,
      value: th.value,
      detail: th.detail,
    },
    {
      key: 'now',
      label: `${driver.name}${r.lastYear ? `, ${r.lastYear}` : ''}${driver.unit ? `, ${driver.unit}` : ''}`,
      value: r.range ? formatLevel(r.range.levelNow) : '—',
      detail:
        r.gapPercent !== null && th.value !== 'none'
          ? `${gapText(r)} against the threshold${r.threshold?.extrapolated ? ' (extrapolated)' : ''}`
          : null,
    },
    { key: 'crossing', label: 'Projected crossing', value: pr.value, detail: pr.detail },
    { key: 'elasticity', label: 'Elasticity now', value: el.value, detail: el.detail },
    {
      key: 'shape',
      label: 'Shape over the observed range',
      value: shapeLabel(r.shape?.shape ?? null, formatLevelPercent(r.model.alpha)),
      detail: shapeDetail(r),
    },
  ];
  const trace = traceOf(src);
  return {
    kind: 'district',
    ...(src.track ? { track: src.track } : {}),
    sources: sourcesOf(src),
    code: district.code,
    name: district.name,
    subtitle: `District brief · ${district.code}${src.track ? ` · ${src.track.name}` : ''} · published run #${src.run.id}${src.run.publishedAt ? ` of ${formatDate(src.run.publishedAt, src.timeZone)}` : ''}`,
    headline: headline(r, district.name.length > HEADLINE_NAME_MAX ? district.code : district.name, th, w),
    standing: { key: r.standing.standing, label: standingLabel(r.standing.standing), note: r.standing.note },
    figures,
    charts: {
      curve: curveChart({
        width: CHART_WIDTH,
        height: chartHeight(src.paperSize),
        transform: src.run.spec.model.transform,
        points: r.points,
        curve: r.curve,
        pooledCurve: r.pooledCurve,
        substitute: sub,
        threshold: mark,
        levelText: level,
        xLabel: withUnit(driver),
        yLabel: withUnit(emissions),
        title: `${emissions.name} and ${inSentence(driver.name)}`,
      }),
      path: pathChart({
        width: CHART_WIDTH,
        height: chartHeight(src.paperSize),
        transform: src.run.spec.model.transform,
        points: r.points.map((p) => ({ year: p.year, x: p.x })),
        threshold: mark,
        levelText: level,
        trendPerYear: r.trendPerYear,
        projection: r.projection ? { status: r.projection.status, crossingYear: r.projection.crossingYear } : null,
        xLabel: withUnit(driver),
      }),
    },
    reading: reading(r, th, w),
    substitute: sub
      ? `Series too short for its own curve (${r.n} years, ${span(r)}): the regional pooled curve stands in, read at this district’s income and trend.`
      : null,
    analystNote: note,
    correctionNotice: correction,
    modelLine: `${sub ? 'Regional substitute. ' : ''}${modelLine(src, { pooled: sub, lag: r.model.lag })} ${r.n} years used (${span(r)})${r.droppedYears.length ? `; left out for missing values: ${r.droppedYears.join(', ')}` : ''}.`,
    cautions: [...CAUTIONS],
    trace,
    paperSize: src.paperSize,
    pdfPath: districtPdfPath(district.code, src.track?.code),
  };
}
