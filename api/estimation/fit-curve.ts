import { curveDiagnostics } from './curve-diagnostics';
import { centredCubicInference } from './centred-inference';
import { curveInference } from './curve-inference';
import { elasticityNow } from './elasticity';
import { EstimationInputError } from './errors';
import { fitLeastSquares } from './fit-least-squares';
import { thresholdGap } from './gap';
import { incomeTrend } from './income-trend';
import type { CurveRow, ModelSpec, ModelSpecInput } from './model-spec';
import { parseModelSpec } from './parse-model-spec';
import { prepareRows } from './prepare-rows';
import { projectCrossing } from './projection';
import { districtStanding } from './standing';
import type { CurveNotEstimable, FitCurveOptions, FitCurveResult } from './types';
import { acquireWorkspace, releaseWorkspace, take, toArray, type Workspace } from './workspace';

/**
 * Fits one district's emissions–driver curve and reads it: turning points with delta and
 * Fieller intervals, the U-test, shape, standing, gap, elasticity now, income trend,
 * projected crossing and residual diagnostics.
 *
 * Formula: y_t = b0 + b1·x_t + b2·x_t² [+ b3·x_t³] + g'z_t + e_t, under the log transform
 * with y, x and the controls (except levelControls) logged; terms const, x, x2[, x3], then
 * the controls. OLS by pivoted QR (ols.ts) with the spec's covariance; inference with t on
 * n − k df (or normal); shape, standing, gap, elasticity, trend and projection as in
 * docs/method.md (see curve-inference.ts, standing.ts, gap.ts, elasticity.ts, income-trend.ts,
 * projection.ts, curve-diagnostics.ts); for a cubic the slope inference is computed on the
 * centred and scaled design (centred-inference.ts). Under the log transform x_now, x_min, x_max are ln
 * values and the `level` fields exp of them.
 * References: Grossman, G. M. and Krueger, A. B. (1995), "Economic growth and the
 * environment", Quarterly Journal of Economics 110(2), 353–377 (the curve); Lind & Mehlum
 * (2010), Oxford Bulletin of Economics and Statistics 72(1), 109–118; Fieller (1954), JRSS B
 * 16(2), 175–185; Newey & West (1987), Econometrica 55(3), 703–708.
 *
 * Returns a plain JSON-serialisable object: `{ status: 'ok', … }`, or
 * `{ status: 'not_estimable', reason }` when there are fewer rows than spec.minYears
 * (default k + 5) or the design is rank deficient (e.g. a constant control) or HC3 is
 * undefined, or a result fails its own check (`numerical_failure`, e.g. a cubic Fieller set
 * without its turning point). No NaN or Infinity appears: undefined quantities are null with a reason.
 *
 * Throws: EstimationInputError for bad input — `invalid_argument` (model spec, cluster
 * covariance for one district, bad lag), `non_finite_value`, `non_positive_under_log`,
 * `missing_control`, `duplicate_year` — each naming the row (details.row, year, column).
 *
 * Example:
 *   fitCurve(rowsOfPA01, { form: 'quadratic', transform: 'log', covariance: 'newey_west' })
 *   // → { status: 'ok', coefficients: [-59.385…, 12.1077…, -0.61929…, 0.42539…],
 *   //     turningPoints: [{ x: 9.7755…, level: 17597.7…, kind: 'peak', … }], shape: { shape: 'inverted_u', … },
 *   //     standing: { standing: 'past_turn', … }, gap: { percent: 126.73… }, … }
 */
export function fitCurve(
  rows: ReadonlyArray<CurveRow>,
  model: ModelSpecInput | ModelSpec,
  options: FitCurveOptions = {},
): FitCurveResult {
  const spec = parseModelSpec(model);
  if (spec.covariance === 'cluster') {
    throw new EstimationInputError(
      'invalid_argument',
      "Covariance 'cluster' is for the pooled panel (fitPanel); choose classical, hc1, hc3 or newey_west for one district",
      { reason: 'covariance' },
    );
  }
  const n0 = Array.isArray(rows) ? rows.length : 0;
  const nc0 = spec.controls ? spec.controls.length : 4;
  const ws = acquireWorkspace(n0 * (24 + 2 * nc0 + 9 * (4 + nc0)) + 10 * (4 + nc0) ** 2 + 64);
  try {
    return fitCurveWith(rows, spec, options, ws);
  } finally {
    releaseWorkspace(ws);
  }
}

function fitCurveWith(
  rows: ReadonlyArray<CurveRow>,
  spec: ModelSpec,
  options: FitCurveOptions,
  ws: Workspace,
): FitCurveResult {
  const data = prepareRows(rows, spec, false, ws);
  const m = spec.form === 'cubic' ? 3 : 2;
  const terms = m === 3 ? ['const', 'x', 'x2', 'x3'] : ['const', 'x', 'x2'];
  for (const c of data.controlNames) terms.push(c);
  const k = terms.length;
  const n = data.n;
  const minYears = spec.minYears ?? k + 5;
  if (n < minYears || n <= k) {
    return notEstimable(
      spec,
      n,
      k,
      minYears,
      'too_few_rows',
      `${n} rows; the model needs at least ${Math.max(minYears, k + 1)}`,
      { n, k, minYears },
    );
  }
  const design = take(ws, n * k);
  const x = data.x;
  for (let i = 0; i < n; i++) {
    const xi = x[i];
    design[i] = 1;
    design[n + i] = xi;
    design[2 * n + i] = xi * xi;
    if (m === 3) design[3 * n + i] = xi * xi * xi;
  }
  for (let c = 0; c < data.controls.length; c++) design.set(data.controls[c], (1 + m + c) * n);
  let fit;
  try {
    fit = fitLeastSquares(
      { nRows: n, nCols: k, data: design },
      data.y,
      { covariance: spec.covariance, lag: spec.lag, names: terms },
      ws,
    );
  } catch (err) {
    if (err instanceof EstimationInputError && (err.code === 'rank_deficient' || err.code === 'covariance_undefined')) {
      return notEstimable(spec, n, k, minYears, err.code, err.message, err.details);
    }
    throw err;
  }
  const { result, core } = fit;
  let xMin = Infinity,
    xMax = -Infinity,
    levelMin = Infinity,
    levelMax = -Infinity;
  for (let i = 0; i < n; i++) {
    if (x[i] < xMin) xMin = x[i];
    if (x[i] > xMax) xMax = x[i];
    if (data.xRaw[i] < levelMin) levelMin = data.xRaw[i];
    if (data.xRaw[i] > levelMax) levelMax = data.xRaw[i];
  }
  const last = n - 1;
  const xNow = x[last];
  const levelNow = data.xRaw[last];
  const lastYear = data.years[last];
  let inf;
  let centred: ReturnType<typeof centredCubicInference> | null = null;
  try {
    if (m === 3 && xMax > xMin) {
      centred = centredCubicInference({
        x,
        controls: data.controls,
        y: data.y,
        n,
        rawSlope: [result.coefficients[1], result.coefficients[2], result.coefficients[3]],
        xMin,
        xMax,
        xNow: x[n - 1],
        df: result.df,
        spec,
        options: { covariance: spec.covariance, lag: spec.lag },
      });
      inf = centred.inference;
    } else {
      inf = curveInference({
        coefficients: result.coefficients,
        covariance: result.covariance,
        slopeStart: 1,
        slopeTerms: m,
        xMin,
        xMax,
        df: result.df,
        spec,
      });
    }
  } catch (err) {
    // numerical_failure from a cubic set; rank_deficient / covariance_undefined only if the
    // centred refit of a cubic disagrees with the raw one at the rounding margin
    if (
      err instanceof EstimationInputError &&
      (err.code === 'numerical_failure' || err.code === 'rank_deficient' || err.code === 'covariance_undefined')
    ) {
      return notEstimable(spec, n, k, minYears, err.code, err.message, err.details);
    }
    throw err;
  }
  const standing = districtStanding({
    shape: inf.shape.shape,
    turningPoints: inf.turningPoints,
    xNow,
    levelNow,
    method: spec.intervalMethod,
    level: spec.level,
  });
  const tp = standing.turningPointIndex === null ? null : inf.turningPoints[standing.turningPointIndex];
  const gap = tp
    ? thresholdGap(levelNow, tp.level, tp.extrapolated)
    : { percent: null, extrapolated: false, reason: 'no turning point' };
  const designRowNow = new Array<number>(k);
  for (let c = 0; c < k; c++) designRowNow[c] = design[c * n + last];
  const elasticity =
    centred && spec.transform === 'log'
      ? centred.logElasticity(inf.critical.value)
      : elasticityNow({
          transform: spec.transform,
          coefficients: result.coefficients,
          covariance: result.covariance,
          slopeTerms: m,
          xNow,
          designRowNow,
          fittedNow: result.fitted[last],
          critical: inf.critical.value,
        });
  const trend = incomeTrend(data.years, data.xRaw, spec.trendYears);
  const log = spec.transform === 'log';
  const bounded = tp !== null && standing.intervalBounded === true && standing.interval !== null;
  const projection = projectCrossing({
    lnThreshold: tp ? lnOf(tp.x, log) : null,
    lnNow: Math.log(levelNow),
    lnLo: bounded ? lnOf(standing.interval!.lo, log) : null,
    lnHi: bounded ? lnOf(standing.interval!.hi, log) : null,
    trend: trend.slopePerYear,
    lastYear,
    extrapolated: tp ? tp.extrapolated : false,
  });
  const diagnostics =
    options.diagnostics === false
      ? null
      : curveDiagnostics(
          core.residuals,
          core.q1,
          result.leverage,
          data.years,
          n,
          k,
          ws,
          options.exactDurbinWatson === true,
        );
  return {
    status: 'ok',
    model: spec,
    names: result.names,
    coefficients: result.coefficients,
    standardErrors: result.standardErrors,
    tStatistics: result.tStatistics,
    pValues: result.pValues,
    covariance: result.covariance,
    covarianceInfo: result.covarianceInfo,
    residuals: result.residuals,
    fitted: result.fitted,
    leverage: result.leverage,
    n: result.n,
    k: result.k,
    df: result.df,
    rank: result.rank,
    rss: result.rss,
    tss: result.tss,
    rSquared: result.rSquared,
    adjRSquared: result.adjRSquared,
    residualStandardError: result.residualStandardError,
    condition: result.condition,
    terms,
    years: toArray(data.years),
    range: { xMin, xMax, levelMin, levelMax, firstYear: data.years[0], lastYear, xNow, levelNow },
    critical: inf.critical,
    turningPoints: inf.turningPoints,
    uTest: inf.uTest,
    wald: inf.wald,
    shape: inf.shape,
    standing,
    gap,
    elasticity,
    trend,
    projection,
    diagnostics,
  };
}

/** ln of a model-scale value: itself under the log transform, else its log when positive. */
function lnOf(v: number | null, log: boolean): number | null {
  if (v === null) return null;
  if (log) return v;
  return v > 0 ? Math.log(v) : null;
}

function notEstimable(
  spec: ModelSpec,
  n: number,
  k: number,
  minYears: number,
  code: CurveNotEstimable['reason']['code'],
  message: string,
  details: Record<string, unknown>,
): CurveNotEstimable {
  return {
    status: 'not_estimable',
    model: spec,
    n,
    k,
    minYears,
    reason: { code, message, details },
    standing: { standing: 'not_estimable' },
  };
}
