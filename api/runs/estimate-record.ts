/**
 * What a run stores per district and variant: the figures a card, a review screen, a
 * brief, the CSV export and the alerts read, in plain JSON, taken from the engine's result
 * (nothing else: standard errors and p-values of the terms and the residual standard
 * error are left to a reproduction, and variants keep only what their summaries show). Real units (income per person,
 * emissions per person) are used for every point a chart draws.
 */
import type { CurveFit, FitCurveResult, FitPanelResult, TurningPoint } from '../estimation';

export const VARIANTS = ['main', 'no_controls', 'cubic', 'last20', 'level'] as const;
export type Variant = (typeof VARIANTS)[number];

export interface ThresholdRecord {
  x: number;
  level: number | null;
  kind: 'peak' | 'trough';
  inRange: boolean;
  extrapolated: boolean;
  intervalBounded: boolean;
  delta: { se: number | null; levelLo: number | null; levelHi: number | null };
  fieller: { kind: 'bounded' | 'two_rays' | 'whole_line'; levelLo: number | null; levelHi: number | null };
}

export interface EstimateRecord {
  variant: Variant;
  status: 'ok' | 'not_estimable' | 'substitute';
  reason: { code: string; message: string } | null;
  model: {
    form: string;
    transform: string;
    covariance: string;
    lag: number | null;
    level: number;
    alpha: number;
    intervalMethod: string;
    criticalValue: string;
    controls: string[];
  };
  n: number;
  k: number;
  firstYear: number | null;
  lastYear: number | null;
  droppedYears: number[];
  terms: string[];
  coefficients: number[];
  rSquared: number | null;
  range: { levelMin: number; levelMax: number; levelNow: number; xNow: number } | null;
  threshold: ThresholdRecord | null;
  turningPoints: ThresholdRecord[];
  standing: {
    standing: string;
    intervalMethod: string;
    intervalBounded: boolean | null;
    levelLo: number | null;
    levelHi: number | null;
    note: string | null;
  };
  shape: { shape: string; decidedBy: string; notes: string[] } | null;
  uTest: {
    statistic: number | null;
    pValue: number | null;
    rejects: boolean;
    orientation: string;
    slopeAtMin: number;
    slopeAtMax: number;
    tAtMin: number | null;
    tAtMax: number | null;
  } | null;
  wald: { fStatistic: number | null; pValue: number | null; rejects: boolean | null } | null;
  gapPercent: number | null;
  elasticity: { value: number | null; se: number | null; lo: number | null; hi: number | null } | null;
  trendPerYear: number | null;
  projection: {
    status: string;
    crossingYear: number | null;
    earliest: number | null;
    latest: number | null;
    note: string | null;
  } | null;
  diagnostics: CurveFit['diagnostics'] | null;
  /** observed points in real units, year order */
  points: { year: number; x: number; y: number }[];
  /** fitted curve over the observed range, real units, controls at their sample means */
  curve: { x: number; y: number }[];
  /** the regional pooled curve anchored at this district's mean, same axes */
  pooledCurve: { x: number; y: number }[];
}

/**
 * What a sensitivity variant does not store: its readers (the card's sensitivity strip,
 * the review's variant table) show its standing, threshold, shape, gap, crossing and
 * years only; the rest is recomputed by reproducing the run. Kept in step with the
 * migration that compacted records written before.
 */
export const VARIANT_BLANKS = {
  terms: [],
  coefficients: [],
  rSquared: null,
  turningPoints: [],
  uTest: null,
  wald: null,
  elasticity: null,
  trendPerYear: null,
} satisfies Partial<EstimateRecord>;

export function thresholdRecord(tp: TurningPoint): ThresholdRecord {
  return {
    x: tp.x,
    level: tp.level,
    kind: tp.kind,
    inRange: tp.inRange,
    extrapolated: tp.extrapolated,
    intervalBounded: tp.intervalBounded,
    delta: { se: tp.delta.se, levelLo: tp.delta.levelLo, levelHi: tp.delta.levelHi },
    fieller: { kind: tp.fieller.kind, levelLo: tp.fieller.levelLo, levelHi: tp.fieller.levelHi },
  };
}

export interface DistrictData {
  years: number[];
  /** driver and emissions in real units; controls by name */
  x: number[];
  y: number[];
  controls: Record<string, number[]>;
  droppedYears: number[];
}

const CURVE_POINTS = 41;

/** Evaluates the fitted polynomial (with controls at their means) over [lo, hi] in real units. */
export function sampleCurve(
  slopes: number[],
  intercept: number,
  transform: 'log' | 'level',
  lo: number,
  hi: number,
): { x: number; y: number }[] {
  const out: { x: number; y: number }[] = [];
  const log = transform === 'log';
  const a = log ? Math.log(lo) : lo;
  const b = log ? Math.log(hi) : hi;
  for (let i = 0; i < CURVE_POINTS; i++) {
    const u = a + ((b - a) * i) / (CURVE_POINTS - 1);
    let v = intercept;
    let p = u;
    for (const s of slopes) {
      v += s * p;
      p *= u;
    }
    out.push({ x: log ? Math.exp(u) : u, y: log ? Math.exp(v) : v });
  }
  return out;
}

const mean = (v: number[]) => v.reduce((s, x) => s + x, 0) / v.length;

/** Mean of each control on the model scale (logged unless kept in levels). */
function controlMeans(
  data: DistrictData,
  controls: string[],
  transform: 'log' | 'level',
  levelControls: string[],
): number[] {
  return controls.map((c) =>
    mean(data.controls[c].map((v) => (transform === 'log' && !levelControls.includes(c) ? Math.log(v) : v))),
  );
}

export function districtCurve(fit: CurveFit, data: DistrictData): { x: number; y: number }[] {
  const m = fit.model.form === 'cubic' ? 3 : 2;
  const controls = fit.terms.slice(1 + m);
  const means = controlMeans(data, controls, fit.model.transform, fit.model.levelControls);
  const intercept = fit.coefficients[0] + controls.reduce((s, _c, j) => s + fit.coefficients[1 + m + j] * means[j], 0);
  return sampleCurve(
    fit.coefficients.slice(1, 1 + m),
    intercept,
    fit.model.transform,
    fit.range.levelMin,
    fit.range.levelMax,
  );
}

/** The pooled curve's shape passed through this district's mean point (log form). */
export function pooledCurveFor(pooled: FitPanelResult | null, data: DistrictData): { x: number; y: number }[] {
  if (!pooled || pooled.status !== 'ok' || pooled.model.transform !== 'log' || data.x.length < 2) return [];
  const m = pooled.model.form === 'cubic' ? 3 : 2;
  const slopes = pooled.coefficients.slice(0, m);
  const controls = pooled.terms.slice(m);
  if (controls.some((c) => !data.controls[c])) return [];
  const lx = data.x.map(Math.log);
  const poly = (u: number) => slopes.reduce((s, b, j) => s + b * u ** (j + 1), 0);
  // With the controls at their means the curve passes through (mean ln x-poly, mean ln y).
  const intercept = mean(data.y.map(Math.log)) - mean(lx.map(poly));
  return sampleCurve(slopes, intercept, 'log', Math.min(...data.x), Math.max(...data.x));
}

function modelOf(fit: FitCurveResult, controls: string[]): EstimateRecord['model'] {
  const s = fit.model;
  return {
    form: s.form,
    transform: s.transform,
    covariance: s.covariance,
    lag: fit.status === 'ok' ? fit.covarianceInfo.lag : (s.lag ?? null),
    level: s.level,
    alpha: s.alpha,
    intervalMethod: s.intervalMethod,
    criticalValue: s.criticalValue,
    controls,
  };
}

function points(data: DistrictData) {
  return data.years.map((year, i) => ({ year, x: data.x[i], y: data.y[i] }));
}

export function recordFromFit(
  variant: Variant,
  fit: FitCurveResult,
  data: DistrictData,
  pooled: FitPanelResult | null,
  controls: string[],
  withDiagnostics: boolean,
): EstimateRecord {
  // Only the main estimate carries what the charts draw; variants feed the sensitivity strip.
  const main = variant === 'main';
  // The shared fields are written out in each literal below, not spread from one object:
  // spreading them into a literal this large put V8 on a slow path that took most of a
  // run's record-building time (measured: 16× slower for a variant's record).
  const base = {
    variant,
    model: modelOf(fit, controls),
    droppedYears: data.droppedYears,
    points: main ? points(data) : [],
    pooledCurve: main ? pooledCurveFor(pooled, data) : [],
  };
  if (fit.status !== 'ok') {
    return {
      variant: base.variant,
      model: base.model,
      droppedYears: base.droppedYears,
      points: base.points,
      pooledCurve: base.pooledCurve,
      status: 'not_estimable',
      reason: { code: fit.reason.code, message: fit.reason.message },
      n: fit.n,
      k: fit.k,
      firstYear: data.years[0] ?? null,
      lastYear: data.years[data.years.length - 1] ?? null,
      terms: [],
      coefficients: [],
      rSquared: null,
      range: null,
      threshold: null,
      turningPoints: [],
      standing: {
        standing: 'not_estimable',
        intervalMethod: fit.model.intervalMethod,
        intervalBounded: null,
        levelLo: null,
        levelHi: null,
        note: fit.reason.message,
      },
      shape: null,
      uTest: null,
      wald: null,
      gapPercent: null,
      elasticity: null,
      trendPerYear: null,
      projection: null,
      diagnostics: null,
      curve: [],
    };
  }
  const st = fit.standing;
  const tp = st.turningPointIndex === null ? null : fit.turningPoints[st.turningPointIndex];
  const record: EstimateRecord = {
    variant: base.variant,
    model: base.model,
    droppedYears: base.droppedYears,
    points: base.points,
    pooledCurve: base.pooledCurve,
    status: 'ok',
    reason: null,
    n: fit.n,
    k: fit.k,
    firstYear: fit.range.firstYear,
    lastYear: fit.range.lastYear,
    terms: fit.terms,
    coefficients: fit.coefficients,
    rSquared: fit.rSquared,
    range: {
      levelMin: fit.range.levelMin,
      levelMax: fit.range.levelMax,
      levelNow: fit.range.levelNow,
      xNow: fit.range.xNow,
    },
    threshold: tp ? thresholdRecord(tp) : null,
    turningPoints: fit.turningPoints.map(thresholdRecord),
    standing: {
      standing: st.standing,
      intervalMethod: st.intervalMethod,
      intervalBounded: st.intervalBounded,
      levelLo: st.interval?.levelLo ?? null,
      levelHi: st.interval?.levelHi ?? null,
      note: st.note,
    },
    shape: { shape: fit.shape.shape, decidedBy: fit.shape.decidedBy, notes: fit.shape.notes },
    uTest: {
      statistic: fit.uTest.statistic,
      pValue: fit.uTest.pValue,
      rejects: fit.uTest.rejects,
      orientation: fit.uTest.orientation,
      slopeAtMin: fit.uTest.slopeAtMin,
      slopeAtMax: fit.uTest.slopeAtMax,
      tAtMin: fit.uTest.tAtMin,
      tAtMax: fit.uTest.tAtMax,
    },
    wald: { fStatistic: fit.wald.fStatistic, pValue: fit.wald.pValue, rejects: fit.wald.rejects },
    gapPercent: fit.gap.percent,
    elasticity: { value: fit.elasticity.value, se: fit.elasticity.se, lo: fit.elasticity.lo, hi: fit.elasticity.hi },
    trendPerYear: fit.trend.slopePerYear,
    projection: {
      status: fit.projection.status,
      crossingYear: fit.projection.crossingYear,
      earliest: fit.projection.range?.earliest ?? null,
      latest: fit.projection.range?.latest ?? null,
      note: fit.projection.note,
    },
    diagnostics: withDiagnostics ? fit.diagnostics : null,
    curve: main ? districtCurve(fit, data) : [],
  };
  return main ? record : { ...record, ...VARIANT_BLANKS };
}
