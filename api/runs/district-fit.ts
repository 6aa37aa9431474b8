/**
 * Fits one district for a run: the spec itself ('main') and its sensitivity variants
 * (without controls, cubic, last 20 years only, level form). A district too short for
 * its own fit gets the regional pooled curve as a labelled substitute: the pooled
 * turning point and interval, read against the district's own latest income and trend.
 */
import {
  districtStanding,
  EstimationInputError,
  fitCurve,
  incomeTrend,
  projectCrossing,
  thresholdGap,
  type FitPanelResult,
  type ModelSpec,
} from '../estimation';
import {
  recordFromFit,
  thresholdRecord,
  type DistrictData,
  type EstimateRecord,
  type Variant,
} from './estimate-record';

export interface RunModel {
  spec: ModelSpec;
  controls: string[];
}

function rowsOf(data: DistrictData, controls: string[], keep: (year: number) => boolean) {
  const rows = [];
  for (let i = 0; i < data.years.length; i++) {
    if (!keep(data.years[i])) continue;
    const c: Record<string, number> = {};
    for (const name of controls) c[name] = data.controls[name][i];
    rows.push({ year: data.years[i], y: data.y[i], x: data.x[i], controls: c });
  }
  return rows;
}

function subset(data: DistrictData, keep: (year: number) => boolean): DistrictData {
  const idx = data.years.map((y, i) => (keep(y) ? i : -1)).filter((i) => i >= 0);
  const controls: Record<string, number[]> = {};
  for (const [k, v] of Object.entries(data.controls)) controls[k] = idx.map((i) => v[i]);
  return {
    years: idx.map((i) => data.years[i]),
    x: idx.map((i) => data.x[i]),
    y: idx.map((i) => data.y[i]),
    controls,
    droppedYears: data.droppedYears,
  };
}

export function variantModels(model: RunModel): Record<Variant, RunModel & { window?: number }> {
  const { spec, controls } = model;
  return {
    main: model,
    no_controls: { spec: { ...spec, levelControls: [] }, controls: [] },
    cubic: { spec: { ...spec, form: 'cubic' }, controls },
    last20: { spec, controls, window: 20 },
    level: { spec: { ...spec, transform: 'level', levelControls: [] }, controls },
  };
}

function fitOne(
  variant: Variant,
  m: RunModel & { window?: number },
  data: DistrictData,
  pooled: FitPanelResult | null,
): EstimateRecord {
  const last = data.years[data.years.length - 1] ?? 0;
  const keep = m.window ? (y: number) => y > last - m.window! : () => true;
  const d = m.window ? subset(data, keep) : data;
  try {
    const fit = fitCurve(
      rowsOf(d, m.controls, () => true),
      { ...m.spec, controls: m.controls },
      { diagnostics: variant === 'main' },
    );
    return recordFromFit(variant, fit, d, pooled, m.controls, variant === 'main');
  } catch (err) {
    if (!(err instanceof EstimationInputError)) throw err;
    // Bad data (e.g. a non-positive value under logs) is reported on the district, never
    // dropped; a series too short for the spec's Newey–West lag says so (the lag is never clamped).
    const code = err.code === 'invalid_argument' && err.details.reason === 'lag' ? 'lag_too_large' : err.code;
    const message =
      code === 'lag_too_large'
        ? `${d.years.length} years are too few for the spec's Newey–West lag of ${m.spec.lag} (it needs at least ${(m.spec.lag ?? 0) + 1})`
        : err.message;
    const fit = {
      status: 'not_estimable' as const,
      model: { ...m.spec, controls: m.controls },
      n: d.years.length,
      k: 0,
      minYears: 0,
      reason: { code: code as 'too_few_rows', message, details: {} },
      standing: { standing: 'not_estimable' as const },
    };
    return recordFromFit(variant, fit, d, pooled, m.controls, false);
  }
}

/** The regional substitute for a district whose own series cannot carry the model. */
export function substituteRecord(
  own: EstimateRecord,
  data: DistrictData,
  pooled: FitPanelResult | null,
  spec: ModelSpec,
): EstimateRecord {
  if (!pooled || pooled.status !== 'ok' || data.x.length === 0) return own;
  const log = spec.transform === 'log';
  const levelNow = data.x[data.x.length - 1];
  const xNow = log ? Math.log(levelNow) : levelNow;
  const standing = districtStanding({
    shape: pooled.shape.shape,
    turningPoints: pooled.turningPoints,
    xNow,
    levelNow,
    method: spec.intervalMethod,
    level: spec.level,
  });
  const tp = standing.turningPointIndex === null ? null : pooled.turningPoints[standing.turningPointIndex];
  const gap = tp ? thresholdGap(levelNow, tp.level, tp.extrapolated) : null;
  const trend = incomeTrend(data.years, data.x, spec.trendYears);
  const bounded = standing.intervalBounded === true && standing.interval !== null;
  const ln = (v: number | null) => (v === null ? null : log ? v : v > 0 ? Math.log(v) : null);
  const projection = tp
    ? projectCrossing({
        lnThreshold: ln(tp.x),
        lnNow: Math.log(levelNow),
        lnLo: bounded ? ln(standing.interval!.lo) : null,
        lnHi: bounded ? ln(standing.interval!.hi) : null,
        trend: trend.slopePerYear,
        lastYear: data.years[data.years.length - 1],
        extrapolated: tp.extrapolated,
      })
    : null;
  return {
    ...own,
    status: 'substitute',
    reason: {
      code: own.reason?.code ?? 'too_few_rows',
      message: `${own.reason?.message ?? 'series too short'}; the regional pooled curve stands in`,
    },
    range: { levelMin: Math.min(...data.x), levelMax: Math.max(...data.x), levelNow, xNow },
    threshold: tp ? thresholdRecord(tp) : null,
    turningPoints: pooled.turningPoints.map(thresholdRecord),
    standing: {
      standing: standing.standing,
      intervalMethod: standing.intervalMethod,
      intervalBounded: standing.intervalBounded,
      levelLo: standing.interval?.levelLo ?? null,
      levelHi: standing.interval?.levelHi ?? null,
      note: standing.note,
    },
    shape: {
      shape: pooled.shape.shape,
      decidedBy: pooled.shape.decidedBy,
      notes: [...pooled.shape.notes, 'regional pooled curve'],
    },
    uTest: {
      statistic: pooled.uTest.statistic,
      pValue: pooled.uTest.pValue,
      rejects: pooled.uTest.rejects,
      orientation: pooled.uTest.orientation,
      slopeAtMin: pooled.uTest.slopeAtMin,
      slopeAtMax: pooled.uTest.slopeAtMax,
      tAtMin: pooled.uTest.tAtMin,
      tAtMax: pooled.uTest.tAtMax,
    },
    gapPercent: gap?.percent ?? null,
    trendPerYear: trend.slopePerYear,
    projection: projection
      ? {
          status: projection.status,
          crossingYear: projection.crossingYear,
          earliest: projection.range?.earliest ?? null,
          latest: projection.range?.latest ?? null,
          note: projection.note,
        }
      : null,
  };
}

/** Every variant for one district; the main one falls back to the regional substitute. */
export function fitDistrict(model: RunModel, data: DistrictData, pooled: FitPanelResult | null): EstimateRecord[] {
  const models = variantModels(model);
  return (Object.keys(models) as Variant[]).map((variant) => {
    const rec = fitOne(variant, models[variant], data, pooled);
    return variant === 'main' && rec.status === 'not_estimable' && rec.reason?.code === 'too_few_rows'
      ? substituteRecord(rec, data, pooled, model.spec)
      : rec;
  });
}
