import type { ElasticityResult } from './types';

/**
 * Elasticity of emissions with respect to the driver in the latest year, with its
 * delta-method standard error and interval.
 *
 * Formula: log form e = b1 + 2·b2·x_now [+ 3·b3·x_now²], gradient (1, 2x, 3x²) on the
 * slope terms, se = √(gᵀVg) (= √(V11 + 4x·V12 + 4x²·V22) for a quadratic). Level form: the
 * point elasticity e = s(X_now)·X_now/ŷ_now with s the slope and ŷ_now = d_nowᵀb the
 * fitted value of the latest row; gradient ∂e/∂b_j = (X/ŷ)·∂s/∂b_j − (s·X/ŷ²)·d_j over
 * all coefficients.
 * Reference: the delta method (Oehlert 1992, The American Statistician 46(1), 27–29).
 *
 * Throws: nothing; null with a reason when ŷ_now = 0 (level form) or the variance fails.
 *
 * Example (PA01, classical): elasticityNow({ form: 'log', …, xNow: 10.594105788008413 })
 *   // → { value: -1.0138708218002908, se: 0.052873767967897146, … }
 */
export function elasticityNow(input: {
  transform: 'log' | 'level';
  /** all coefficients, terms const, x, x2[, x3], controls */
  coefficients: ReadonlyArray<number>;
  covariance: ReadonlyArray<ArrayLike<number>>;
  /** number of slope terms (2 quadratic, 3 cubic), at indices 1..m */
  slopeTerms: number;
  xNow: number;
  /** latest design row and fitted value (level form) */
  designRowNow: ReadonlyArray<number>;
  fittedNow: number;
  critical: number;
}): ElasticityResult {
  const {
    transform,
    coefficients: b,
    covariance: V,
    slopeTerms: m,
    xNow: x,
    designRowNow: d,
    fittedNow,
    critical,
  } = input;
  const k = b.length;
  const a = [1, 2 * x, 3 * x * x].slice(0, m);
  let s = 0;
  for (let i = 0; i < m; i++) s += a[i] * b[i + 1];
  const g = new Array<number>(k).fill(0);
  let value: number;
  if (transform === 'log') {
    value = s;
    for (let i = 0; i < m; i++) g[i + 1] = a[i];
  } else {
    if (fittedNow === 0 || !Number.isFinite(fittedNow)) {
      return {
        xNow: x,
        value: null,
        se: null,
        lo: null,
        hi: null,
        form: transform,
        reason: 'fitted value in the latest year is zero',
      };
    }
    value = (s * x) / fittedNow;
    for (let j = 0; j < k; j++) g[j] = (-(s * x) / (fittedNow * fittedNow)) * d[j];
    for (let i = 0; i < m; i++) g[i + 1] += (x / fittedNow) * a[i];
  }
  let v = 0;
  for (let i = 0; i < k; i++) for (let j = 0; j < k; j++) v += g[i] * V[i][j] * g[j];
  if (!(v >= 0) || !Number.isFinite(v) || !Number.isFinite(value)) {
    return {
      xNow: x,
      value: Number.isFinite(value) ? value : null,
      se: null,
      lo: null,
      hi: null,
      form: transform,
      reason: 'variance not available',
    };
  }
  const se = Math.sqrt(v);
  return { xNow: x, value, se, lo: value - critical * se, hi: value + critical * se, form: transform, reason: null };
}
