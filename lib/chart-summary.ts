// Text summaries of the card's two charts, for screen readers and as the visible caption
// "In words" under each chart. Pure functions of the published record.
import { bandOf, curveChartModel, pathChartModel, thresholdOf } from './chart-model';
import type { EstimateRecord } from '@/contracts/estimates';
import { formatLevel, intervalText, levelPercent, METHOD_LABEL, notBoundedText, shapeWords } from './estimate-words';
import { formatEmissions } from './format';
import { UNKNOWN_UNITS, withUnit, type RunUnits } from './units';

/** The threshold as the chart shows it; `drawn` says whether it fell inside the frame. */
function thresholdWords(r: EstimateRecord, drawn: boolean, u: RunUnits): string {
  const x = thresholdOf(r);
  if (x === null) return 'No positive threshold is marked.';
  const noun = r.threshold?.kind === 'trough' ? 'low point' : 'turning point';
  const where = r.threshold?.extrapolated ? ', beyond the observed incomes' : '';
  const band = bandOf(r);
  if (!drawn) {
    const interval = band
      ? `its ${levelPercent(r.model.level)} ${METHOD_LABEL[r.standing.intervalMethod]} interval is ${formatLevel(band.lo)}–${formatLevel(band.hi)}`
      : notBoundedText(r.model.level);
    return `The ${noun} lies at ${withUnit(formatLevel(x), u.incomeUnit)}${where}, too far from the observed incomes to fall inside the chart (${interval}).`;
  }
  const method = METHOD_LABEL[r.standing.intervalMethod];
  if (band) {
    return `The ${noun} is marked at ${withUnit(formatLevel(x), u.incomeUnit)}${where}, with its ${levelPercent(r.model.level)} ${method} interval (${formatLevel(band.lo)}–${formatLevel(band.hi)}) as a shaded band.`;
  }
  const kind = r.threshold?.fieller.kind ?? null;
  return (
    `The ${noun} is marked at ${withUnit(formatLevel(x), u.incomeUnit)}${where} as a line without a band: ` +
    `${notBoundedText(r.model.level)} (${intervalText(kind, r.standing.levelLo, r.standing.levelHi)}).`
  );
}

export function curveChartSummary(r: EstimateRecord, u: RunUnits = UNKNOWN_UNITS): string {
  const pts = r.points;
  if (pts.length === 0) return 'No observed years to chart.';
  const first = pts[0];
  const last = pts[pts.length - 1];
  const parts = [
    `${u.emissionsName} against ${u.incomeName.toLowerCase()}, both on log scales, for ${pts.length} observed years (${first.year}–${last.year}).`,
  ];
  if (r.status === 'substitute')
    parts.push('The district’s own series is too short: the regional pooled curve stands in as the fitted line.');
  else if (r.curve.length > 0 && r.shape)
    parts.push(
      `The fitted curve over the observed incomes: ${shapeWords(r.shape.shape, r.model.alpha).toLowerCase()}.`,
    );
  else parts.push('No fitted curve: the district is not estimable in this run.');
  if (r.status !== 'not_estimable') parts.push(thresholdWords(r, curveChartModel(r).threshold !== null, u));
  parts.push(
    `Latest year ${last.year} highlighted: income ${withUnit(formatLevel(last.x), u.incomeUnit)}, ${u.emissionsName.toLowerCase()} ${withUnit(formatEmissions(last.y), u.emissionsUnit)}.`,
  );
  if (r.status === 'ok' && r.pooledCurve.length > 0)
    parts.push('The regional pooled curve is drawn faint for reference.');
  return parts.join(' ');
}

export function pathChartSummary(r: EstimateRecord, u: RunUnits = UNKNOWN_UNITS): string {
  const pts = r.points;
  if (pts.length === 0) return 'No observed years to chart.';
  const first = pts[0];
  const last = pts[pts.length - 1];
  const parts = [
    `${u.incomeName} by year on a log scale, ${first.year}–${last.year}: from ${formatLevel(first.x)} to ${withUnit(formatLevel(last.x), u.incomeUnit)}.`,
  ];
  if (r.status !== 'not_estimable') parts.push(thresholdWords(r, pathChartModel(r).threshold !== null, u));
  const p = r.projection;
  if (p && r.trendPerYear !== null) {
    const pct = (Math.exp(r.trendPerYear) - 1) * 100;
    const trend = `The recent income trend (${pct >= 0 ? '+' : '−'}${Math.abs(pct).toFixed(1)}% a year) is drawn dashed ahead of ${last.year}`;
    if (p.status === 'projected' && p.crossingYear !== null)
      parts.push(`${trend}; it meets the threshold around ${p.crossingYear}.`);
    else if (p.status === 'already_past' && p.crossingYear !== null)
      parts.push(`${trend}; income passed the threshold around ${p.crossingYear}.`);
    else if (p.status === 'not_on_current_trend')
      parts.push(`${trend}; it does not meet the threshold (not on current trend).`);
    else parts.push(`${trend}.`);
  }
  return parts.join(' ');
}
