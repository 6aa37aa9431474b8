import { chiSquareUpperTail, fUpperTail } from './distributions';
import type { WaldTestResult } from './types';

/**
 * Wald test of H0: b = 0 for a block of q coefficients with covariance V (any estimator).
 *
 * Formula: W = bᵀ V⁻¹ b, computed through the Cholesky factor V = LLᵀ (W = ‖L⁻¹b‖²);
 * F form W/q against F(q, df) (df = n − k, or G − 1 for the clustered panel), or W against
 * χ²(q) when df is null (normal critical values).
 * Reference: Wald, A. (1943), "Tests of statistical hypotheses concerning several
 * parameters when the number of observations is large", Transactions of the American
 * Mathematical Society 54(3), 426–482.
 *
 * Throws: nothing; a V that is not positive definite gives statistic null with a reason.
 *
 * Example:
 *   waldTest([1, 1], [[1, 0], [0, 1]], 30, 0.05)   // → { statistic: 2, q: 2, fStatistic: 1, df: 30, pValue: 0.37981…, rejects: false, … }
 */
export function waldTest(
  b: ReadonlyArray<number>, v: ReadonlyArray<ArrayLike<number>>, df: number | null, alpha: number,
): WaldTestResult {
  const q = b.length;
  const L = new Float64Array(q * q);
  for (let j = 0; j < q; j++) {
    let d = v[j][j];
    for (let m = 0; m < j; m++) d -= L[j * q + m] * L[j * q + m];
    if (!(d > 0) || !Number.isFinite(d)) {
      return { statistic: null, q, fStatistic: null, df, pValue: null, rejects: null, reason: 'covariance block is not positive definite' };
    }
    const ljj = Math.sqrt(d);
    L[j * q + j] = ljj;
    for (let i = j + 1; i < q; i++) {
      let s = 0.5 * (v[i][j] + v[j][i]);
      for (let m = 0; m < j; m++) s -= L[i * q + m] * L[j * q + m];
      L[i * q + j] = s / ljj;
    }
  }
  let w = 0;
  const z = new Float64Array(q);
  for (let i = 0; i < q; i++) {
    let s = b[i];
    for (let m = 0; m < i; m++) s -= L[i * q + m] * z[m];
    z[i] = s / L[i * q + i];
    w += z[i] * z[i];
  }
  const f = w / q;
  const pValue = df === null ? chiSquareUpperTail(w, q) : fUpperTail(f, q, df);
  return { statistic: w, q, fStatistic: f, df, pValue, rejects: pValue < alpha, reason: null };
}
