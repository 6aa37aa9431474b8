/**
 * One district's figures in words, shared by the district brief, the region table and the
 * JSON brief content: the threshold with its interval (never a bounded interval where the
 * Fieller set is two rays or the whole line: "not bounded at 95%"), the projected
 * crossing, the gap and the elasticity. Rounded by format.ts.
 */
import type { EstimateRecord, ThresholdRecord } from '../runs/estimate-record';
import {
  formatElasticity,
  formatElasticityInterval,
  formatLevel,
  formatLevelInterval,
  formatLevelPercent,
  formatSignedPercent,
} from './format';
import { FIELLER_KIND_LABEL, intervalMethodLabel } from './words';

export interface ThresholdTexts {
  /** "22,000", or "none" */
  value: string;
  /** "14,300 – 36,500", or "not bounded at 95%", or "—" without a threshold */
  interval: string;
  /** the interval with its level and method, and the other method beside it */
  detail: string;
  /** a bounded interval is printed */
  bounded: boolean;
  /** real-unit ends of the printed interval (null unless bounded) */
  band: { lo: number; hi: number } | null;
}

const DASH = '—';

/** The parts of a district's record the figures read (a region table row has no more). */
export type FigureRecord = Pick<
  EstimateRecord,
  'status' | 'threshold' | 'standing' | 'model' | 'projection' | 'gapPercent' | 'elasticity'
>;

export function levelTextOf(r: Pick<FigureRecord, 'model'>): string {
  return formatLevelPercent(r.model.level);
}

export function thresholdTexts(r: FigureRecord): ThresholdTexts {
  return thresholdTextsOf(r.threshold, r.standing.intervalMethod, r.model.level, r.status === 'not_estimable');
}

type TurningPointLike = Pick<ThresholdRecord, 'level'> & {
  delta: { levelLo: number | null; levelHi: number | null };
  fieller: { kind: string; levelLo: number | null; levelHi: number | null };
};

/** The threshold of a district record or of the pooled fit, read at `level` with `method`. */
export function thresholdTextsOf(
  tp: TurningPointLike | null,
  method: string,
  confidence: number,
  notEstimated = false,
): ThresholdTexts {
  const level = formatLevelPercent(confidence);
  if (!tp || tp.level === null || !Number.isFinite(tp.level)) {
    const why = notEstimated ? 'not estimated' : 'the fitted curve has no turning point';
    return { value: 'none', interval: DASH, detail: why, bounded: false, band: null };
  }
  const value = formatLevel(tp.level);
  const fiellerBounded = tp.fieller.kind === 'bounded' && tp.fieller.levelLo !== null && tp.fieller.levelHi !== null;
  const deltaBounded = tp.delta.levelLo !== null && tp.delta.levelHi !== null;
  // The Fieller set decides whether the threshold is bounded at all: where it is two rays
  // or the whole line, no bounded interval is printed, whichever method the spec reads.
  if (!fiellerBounded) {
    const kind = FIELLER_KIND_LABEL[tp.fieller.kind] ?? tp.fieller.kind;
    const note = method === 'delta' && deltaBounded ? '; the delta-method interval is not shown' : '';
    return {
      value,
      interval: `not bounded at ${level}`,
      detail: `not bounded at ${level} (the Fieller set is ${kind})${note}`,
      bounded: false,
      band: null,
    };
  }
  const fieller = { lo: tp.fieller.levelLo!, hi: tp.fieller.levelHi! };
  const delta = deltaBounded ? { lo: tp.delta.levelLo!, hi: tp.delta.levelHi! } : null;
  const useDelta = method === 'delta' && delta !== null;
  const main = useDelta ? delta : fieller;
  const other = useDelta
    ? `Fieller ${formatLevelInterval(fieller.lo, fieller.hi)}`
    : delta
      ? `delta method ${formatLevelInterval(delta.lo, delta.hi)}`
      : 'delta method not available';
  const interval = formatLevelInterval(main.lo, main.hi);
  return {
    value,
    interval,
    detail: `${level} ${intervalMethodLabel(useDelta ? 'delta' : 'fieller')} interval ${interval}; ${other}`,
    bounded: true,
    band: main,
  };
}

export interface ProjectionTexts {
  /** "about 2031", "passed about 2013", "not on current trend" */
  value: string;
  /** the range, or why there is none */
  detail: string;
  /** the crossing year for the table: "2031 (2029–2036)" */
  short: string;
}

export function projectionTexts(r: FigureRecord): ProjectionTexts {
  const p = r.projection;
  const extrapolated = r.threshold?.extrapolated ? '; the threshold lies outside the observed incomes' : '';
  if (!p || p.status === 'no_threshold')
    return { value: 'no threshold', detail: 'no threshold to project towards', short: DASH };
  if (p.status === 'not_on_current_trend' || p.crossingYear === null) {
    return {
      value: 'not on current trend',
      detail: `${p.note ?? 'the income trend does not lead to the threshold'}${extrapolated}`,
      short: 'not on trend',
    };
  }
  const both = p.earliest !== null && p.latest !== null;
  const range = both ? (p.earliest === p.latest ? `${p.earliest}` : `${p.earliest}–${p.latest}`) : null;
  const rangeText = range ? `range ${range} from the interval ends` : 'range not bounded (the interval is not bounded)';
  const short = `${p.crossingYear}${range && range !== String(p.crossingYear) ? ` (${range})` : ''}`;
  if (p.status === 'already_past') {
    return {
      value: `passed about ${p.crossingYear}`,
      detail: `on the income trend line; ${rangeText}${extrapolated}`,
      short: `passed ${short}`,
    };
  }
  return {
    value: `about ${p.crossingYear}`,
    detail: `on the current income trend; ${rangeText}${extrapolated}`,
    short,
  };
}

export function gapText(r: FigureRecord): string {
  return r.gapPercent === null || !Number.isFinite(r.gapPercent) ? DASH : formatSignedPercent(r.gapPercent);
}

export interface ElasticityTexts {
  value: string;
  detail: string;
}

/** `pressure`: the watched indicator's name inside a sentence (from the catalogue), e.g. "PM2.5 annual mean concentration". */
export function elasticityTexts(r: FigureRecord, pressure = 'emissions'): ElasticityTexts {
  const e = r.elasticity;
  if (!e || e.value === null) {
    return {
      value: 'not available',
      detail: r.status === 'substitute' ? 'the district’s own series is too short to estimate it' : 'not estimated',
    };
  }
  const level = levelTextOf(r);
  const interval = e.lo !== null && e.hi !== null ? `${level} interval ${formatElasticityInterval(e.lo, e.hi)}; ` : '';
  const size = formatElasticity(Math.abs(e.value));
  const words =
    Math.abs(e.value) < 0.005
      ? `1% more income goes with about no change in ${pressure}`
      : `1% more income goes with about ${size}% ${e.value > 0 ? 'more' : 'less'} ${pressure}`;
  return { value: formatElasticity(e.value), detail: `${interval}${words}` };
}
