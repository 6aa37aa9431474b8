import { curveInference } from './curve-inference';
import { elasticityNow } from './elasticity';
import { fitLeastSquares } from './fit-least-squares';
import type { ModelSpec } from './model-spec';
import type { ElasticityResult, OlsOptions, TurningPoint } from './types';

type Inference = ReturnType<typeof curveInference>;

/**
 * The slope inference of a cubic (turning points with delta and Fieller intervals, U-test,
 * Wald test, shape, log-form elasticity) computed on the centred and scaled design, so that
 * no variance a′Va is formed from the raw-power covariance.
 *
 * Formula: t = (x − c)/h with c = (x_min + x_max)/2, h = (x_max − x_min)/2, so the observed
 * range is t ∈ [−1, 1]; the same least squares on columns 1, t, t², t³ and the controls (same
 * covariance) gives b̃ and Ṽ, well conditioned. The slope is dy/dx = s̃(t)/h with
 * s̃(t) = b̃1 + 2b̃2·t + 3b̃3·t²: turning points, Fieller sets and the U-test's t statistics
 * are those of s̃ mapped by x = c + h·t (the factor 1/h cancels in every ratio); slopes and
 * their SEs are divided by h, delta SEs multiplied by h. The Wald test of the slope terms is
 * the same hypothesis in either basis (the slope polynomial is zero). The reported gradient
 * of x* stays the one with respect to the raw (b1, b2, b3) (cubic-turning-points.ts).
 * Reference: Björck (1996), Numerical Methods for Least Squares Problems, SIAM, §4.5
 * (orthogonal and centred polynomial bases); Seber & Lee (2003), Linear Regression Analysis,
 * 2nd ed., Wiley, §7.1 (centring polynomial regressors).
 *
 * Throws: what fitLeastSquares throws (the raw fit has already succeeded, so in practice
 * nothing); EstimationInputError `numerical_failure` from curve-inference.
 *
 * Example: fitCurve of a log cubic calls centredCubicInference(...) and reports its
 * turningPoints, uTest, wald and shape.
 */
export function centredCubicInference(input: {
  x: ArrayLike<number>;
  controls: ReadonlyArray<ArrayLike<number>>;
  y: Float64Array;
  n: number;
  rawSlope: [number, number, number];
  xMin: number;
  xMax: number;
  xNow: number;
  df: number;
  spec: ModelSpec;
  options: OlsOptions;
}): { inference: Inference; logElasticity: (critical: number) => ElasticityResult } {
  const { x, controls, y, n, rawSlope, xMin, xMax, xNow, spec, options } = input;
  const c = 0.5 * (xMin + xMax);
  const h = 0.5 * (xMax - xMin);
  const k = 4 + controls.length;
  const data = new Float64Array(n * k);
  for (let i = 0; i < n; i++) {
    const t = (x[i] - c) / h;
    data[i] = 1;
    data[n + i] = t;
    data[2 * n + i] = t * t;
    data[3 * n + i] = t * t * t;
  }
  for (let j = 0; j < controls.length; j++) for (let i = 0; i < n; i++) data[(4 + j) * n + i] = controls[j][i];
  const { result } = fitLeastSquares({ nRows: n, nCols: k, data }, y, options);
  const tMin = (xMin - c) / h,
    tMax = (xMax - c) / h;
  const inf = curveInference({
    coefficients: result.coefficients,
    covariance: result.covariance,
    slopeStart: 1,
    slopeTerms: 3,
    xMin: tMin,
    xMax: tMax,
    df: input.df,
    spec,
  });
  const log = spec.transform === 'log';
  const toX = (t: number | null): number | null => (t === null ? null : c + h * t);
  const level = (v: number | null): number | null => {
    if (v === null) return null;
    if (!log) return v;
    const e = Math.exp(v);
    return Number.isFinite(e) ? e : null;
  };
  const [, b2, b3] = rawSlope;
  const turningPoints: TurningPoint[] = inf.turningPoints.map((tp) => {
    const xs = c + h * tp.x;
    const ds = 2 * b2 + 6 * b3 * xs;
    const se = tp.delta.se === null ? null : tp.delta.se * h;
    const dLo = toX(tp.delta.lo),
      dHi = toX(tp.delta.hi);
    const fLo = toX(tp.fieller.lo),
      fHi = toX(tp.fieller.hi);
    return {
      ...tp,
      x: xs,
      level: level(xs),
      gradient: ds !== 0 ? [-1 / ds, (-2 * xs) / ds, (-3 * xs * xs) / ds] : tp.gradient,
      delta: { se, lo: dLo, hi: dHi, levelLo: level(dLo), levelHi: level(dHi) },
      fieller: {
        ...tp.fieller,
        lo: fLo,
        hi: fHi,
        levelLo: level(fLo),
        levelHi: level(fHi),
        pieces: tp.fieller.pieces.map((p) => ({ lo: toX(p.lo), hi: toX(p.hi) })),
      },
    };
  });
  const u = inf.uTest;
  const uTest = {
    ...u,
    xMin,
    xMax,
    slopeAtMin: u.slopeAtMin / h,
    seAtMin: u.seAtMin / h,
    slopeAtMax: u.slopeAtMax / h,
    seAtMax: u.seAtMax / h,
  };
  const mid = inf.shape.slopeAtMidpoint;
  const shape = {
    ...inf.shape,
    slopeAtMidpoint: { x: c, value: mid.value / h, se: mid.se === null ? null : mid.se / h },
  };
  const logElasticity = (critical: number): ElasticityResult => {
    const e = elasticityNow({
      transform: 'log',
      coefficients: result.coefficients,
      covariance: result.covariance,
      slopeTerms: 3,
      xNow: (xNow - c) / h,
      designRowNow: [],
      fittedNow: 0,
      critical,
    });
    const d = (v: number | null) => (v === null ? null : v / h);
    return { ...e, xNow, value: d(e.value), se: d(e.se), lo: d(e.lo), hi: d(e.hi) };
  };
  return { inference: { ...inf, turningPoints, uTest, shape }, logElasticity };
}
