import { curveInference } from './curve-inference';
import { twoSidedP } from './distributions';
import { EstimationInputError } from './errors';
import { fitLeastSquares } from './fit-least-squares';
import { fixedEffectsRank } from './fixed-effects-rank';
import type { ModelSpec, ModelSpecInput, PanelRow } from './model-spec';
import { parseModelSpec } from './parse-model-spec';
import { prepareRows } from './prepare-rows';
import { twoWayWithin } from './two-way-within';
import type { FitPanelResult, PanelNotEstimable } from './types';

/**
 * Pooled two-way fixed-effects curve (district and year effects) with district-clustered
 * covariance: the region's reference curve and the substitute for a district whose own
 * series is too short.
 *
 * Formula: y_it = a_i + d_t + b1·x_it + b2·x_it² [+ b3·x_it³] + g'z_it + e_it; the effects are
 * absorbed by the within transformation (two-way-within.ts: alternating projections to
 * 1e-12, exact after one sweep when balanced), then OLS of ỹ on the transformed slope
 * regressors by pivoted QR. Covariance: always clustered by district (Arellano 1987),
 * V = c·(X̃'X̃)⁻¹ Σ_g X̃_g'ẽ_g ẽ_g'X̃_g (X̃'X̃)⁻¹ with c from spec.clusterAdjustment (default
 * N/(N−k), k = slope regressors only: plm's vcovHC(method = "arellano", type = "HC1")).
 * Inference (t, p, intervals, U-test) on G − 1 degrees of freedom, or normal. R² within =
 * 1 − RSS/Σỹ²; adjusted with (N − 1)/dfResidual, dfResidual = N − k − (G + T − C).
 * x_min and x_max are over all rows. Transforms as fitCurve (log of y, x and controls
 * except levelControls).
 * References: Arellano, M. (1987), Oxford Bulletin of Economics and Statistics 49(4),
 * 431–434; Wooldridge, J. M. (2010), Econometric Analysis of Cross Section and Panel Data,
 * 2nd ed., MIT Press, ch. 10; Gaure (2013), Computational Statistics & Data Analysis 66, 8–18.
 *
 * Throws: EstimationInputError for bad rows (as fitCurve, plus `duplicate_row` for a repeated
 * district–year) and `invalid_argument` for the spec. Returns `not_estimable` for fewer than
 * 2 districts, too few rows, a rank-deficient within design, or no convergence.
 *
 * Example (panel A, 280 rows):
 *   fitPanel(rows, { form: 'quadratic', transform: 'log', covariance: 'cluster' })
 *   // → { coefficients: [7.6246…, −0.36432…, 0.78667…], turningPoints: [{ x: 10.4642…, level: 35037.1… }],
 *   //     covarianceInfo: { type: 'cluster', factor: 1.0108…, clusters: 8 }, df: 7, … }
 */
export function fitPanel(rows: ReadonlyArray<PanelRow>, model: ModelSpecInput | ModelSpec): FitPanelResult {
  const spec = parseModelSpec(model);
  const data = prepareRows(rows, spec, true);
  const n = data.n;
  const m = spec.form === 'cubic' ? 3 : 2;
  const terms = ['x', 'x2', 'x3'].slice(0, m).concat(data.controlNames);
  const k = terms.length;
  const notEstimable = (
    code: PanelNotEstimable['reason']['code'],
    message: string,
    details: Record<string, unknown>,
  ): PanelNotEstimable => ({ status: 'not_estimable', model: spec, n, k, reason: { code, message, details } });
  const unitIndex = new Map<string, number>(),
    periodIndex = new Map<number, number>();
  const unit = new Int32Array(n),
    period = new Int32Array(n);
  for (let i = 0; i < n; i++) {
    let u = unitIndex.get(data.districts[i]);
    if (u === undefined) {
      u = unitIndex.size;
      unitIndex.set(data.districts[i], u);
    }
    let p = periodIndex.get(data.years[i]);
    if (p === undefined) {
      p = periodIndex.size;
      periodIndex.set(data.years[i], p);
    }
    unit[i] = u;
    period[i] = p;
  }
  const G = unitIndex.size,
    T = periodIndex.size;
  if (G < 2)
    return notEstimable('too_few_districts', `${G} district(s); a clustered panel needs at least 2`, { districts: G });
  const { rank: feRank, components } = fixedEffectsRank(unit, period, G, T);
  const dfResidual = n - k - feRank;
  if (dfResidual < 1)
    return notEstimable('too_few_rows', `${n} rows cannot carry ${k} slopes and ${feRank} fixed effects`, {
      n,
      k,
      fixedEffects: feRank,
    });
  const x = data.x;
  // the design is built once and within-transformed in place, column by column
  const design = new Float64Array(n * k);
  const cols: Float64Array[] = [];
  for (let j = 0; j < k; j++) cols.push(design.subarray(j * n, (j + 1) * n));
  for (let i = 0; i < n; i++) {
    const v = x[i];
    cols[0][i] = v;
    cols[1][i] = v * v;
    if (m === 3) cols[2][i] = v * v * v;
  }
  data.controls.forEach((c, j) => cols[m + j].set(c));
  const y = data.y; // prepareRows' own array: transformed in place
  const absorption = twoWayWithin([y, ...cols], unit, period, G, T, 1e-12);
  if (!absorption.converged) {
    return notEstimable(
      'not_converged',
      `Within transformation did not converge (largest relative change ${absorption.maxRelativeChange})`,
      { ...absorption },
    );
  }
  let fit;
  try {
    fit = fitLeastSquares({ nRows: n, nCols: k, data: design }, y, {
      names: terms,
      covariance: 'cluster',
      clusters: data.districts,
      clusterAdjustment: spec.clusterAdjustment,
      clusterParameterCount: k,
      centeredRSquared: false,
    });
  } catch (err) {
    if (err instanceof EstimationInputError && err.code === 'rank_deficient')
      return notEstimable('rank_deficient', err.message, err.details);
    throw err;
  }
  const r = fit.result;
  const dfInf = spec.criticalValue === 'normal' ? null : G - 1;
  let xMin = Infinity,
    xMax = -Infinity,
    levelMin = Infinity,
    levelMax = -Infinity;
  for (let i = 0; i < n; i++) {
    xMin = Math.min(xMin, x[i]);
    xMax = Math.max(xMax, x[i]);
    levelMin = Math.min(levelMin, data.xRaw[i]);
    levelMax = Math.max(levelMax, data.xRaw[i]);
  }
  let inf;
  try {
    inf = curveInference({
      coefficients: r.coefficients,
      covariance: r.covariance,
      slopeStart: 0,
      slopeTerms: m,
      xMin,
      xMax,
      df: G - 1,
      spec,
    });
  } catch (err) {
    if (err instanceof EstimationInputError && err.code === 'numerical_failure')
      return notEstimable('numerical_failure', err.message, err.details);
    throw err;
  }
  const tStatistics = r.coefficients.map((b, j) => b / r.standardErrors[j]);
  return {
    status: 'ok',
    model: spec,
    terms,
    coefficients: r.coefficients,
    standardErrors: r.standardErrors,
    tStatistics,
    pValues: tStatistics.map((t) => twoSidedP(t, dfInf)),
    covariance: r.covariance,
    covarianceInfo: r.covarianceInfo,
    n,
    districts: G,
    years: T,
    balanced: n === G * T,
    dfResidual,
    df: dfInf,
    rss: r.rss,
    rSquaredWithin: r.rSquared,
    adjRSquaredWithin: 1 - (1 - r.rSquared) * ((n - 1) / dfResidual),
    absorption: {
      method: 'alternating_projections',
      iterations: absorption.iterations,
      converged: true,
      maxRelativeChange: absorption.maxRelativeChange,
      components,
    },
    range: { xMin, xMax, levelMin, levelMax },
    critical: inf.critical,
    turningPoints: inf.turningPoints,
    uTest: inf.uTest,
    wald: inf.wald,
    shape: inf.shape,
    condition: r.condition,
  };
}
