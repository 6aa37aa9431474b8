import { chiSquareUpperTail, fUpperTail } from './distributions';
import type { WaldTestResult } from './types';

/**
 * Wald test of H0: b = 0 for a block of q coefficients with covariance V (any estimator).
 *
 * Formula: W = bᵀ V⁻¹ b, computed on the equilibrated block: with D = diag(V)^(−1/2),
 * C = D·V·D (unit diagonal) and z = D·b (the t statistics), W = zᵀ C⁻¹ z through a
 * Cholesky factorisation with diagonal pivoting, C = Pᵀ L Lᵀ P (largest remaining pivot
 * first). The block of raw powers (x, x², x³) can have a condition number near 1e11 that is
 * nearly all scaling; equilibration removes that part and `condition` reports what is left,
 * estimated as (largest/smallest pivot)² of L. A pivot ≤ 1e-14 (C not positive definite to
 * rounding) gives statistic null with a reason. F form W/q against F(q, df) (df = n − k, or
 * G − 1 for the clustered panel), or W against χ²(q) when df is null (normal critical values).
 * References: Wald, A. (1943), "Tests of statistical hypotheses concerning several
 * parameters when the number of observations is large", Transactions of the American
 * Mathematical Society 54(3), 426–482; Higham, N. J. (2002), Accuracy and Stability of
 * Numerical Algorithms, 2nd ed., SIAM, §10.3 (pivoted Cholesky) and §7.3 (equilibration).
 *
 * Throws: nothing; a V that is not positive definite gives statistic null with a reason.
 *
 * Example:
 *   waldTest([1, 1], [[1, 0], [0, 1]], 30, 0.05)   // → { statistic: 2, q: 2, fStatistic: 1, df: 30, pValue: 0.37981…, rejects: false, condition: 1, … }
 */
export function waldTest(
  b: ReadonlyArray<number>,
  v: ReadonlyArray<ArrayLike<number>>,
  df: number | null,
  alpha: number,
): WaldTestResult {
  const q = b.length;
  const fail = (reason: string): WaldTestResult => ({
    statistic: null,
    q,
    fStatistic: null,
    df,
    pValue: null,
    rejects: null,
    reason,
    condition: null,
  });
  const d = new Float64Array(q);
  for (let i = 0; i < q; i++) {
    if (!(v[i][i] > 0) || !Number.isFinite(v[i][i])) return fail('covariance block is not positive definite');
    d[i] = 1 / Math.sqrt(v[i][i]);
  }
  // A = D V D (symmetrised), z = D b; pivoted Cholesky in place on A (row-major q × q)
  const a = new Float64Array(q * q);
  for (let i = 0; i < q; i++) for (let j = 0; j < q; j++) a[i * q + j] = 0.5 * (v[i][j] + v[j][i]) * d[i] * d[j];
  const z = new Float64Array(q);
  for (let i = 0; i < q; i++) z[i] = b[i] * d[i];
  let maxPivot = 0,
    minPivot = Infinity;
  for (let j = 0; j < q; j++) {
    let p = j;
    for (let i = j + 1; i < q; i++) if (a[i * q + i] > a[p * q + p]) p = i;
    if (p !== j) {
      for (let c = 0; c < q; c++) {
        const t = a[j * q + c];
        a[j * q + c] = a[p * q + c];
        a[p * q + c] = t;
      }
      for (let r = 0; r < q; r++) {
        const t = a[r * q + j];
        a[r * q + j] = a[r * q + p];
        a[r * q + p] = t;
      }
      const t = z[j];
      z[j] = z[p];
      z[p] = t;
    }
    const piv = a[j * q + j];
    if (!(piv > 1e-14) || !Number.isFinite(piv)) return fail('covariance block is not positive definite');
    const ljj = Math.sqrt(piv);
    maxPivot = Math.max(maxPivot, ljj);
    minPivot = Math.min(minPivot, ljj);
    a[j * q + j] = ljj;
    for (let i = j + 1; i < q; i++) a[i * q + j] /= ljj;
    for (let i = j + 1; i < q; i++)
      for (let c = j + 1; c <= i; c++) {
        a[i * q + c] -= a[i * q + j] * a[c * q + j];
        a[c * q + i] = a[i * q + c];
      }
  }
  // W = ‖L⁻¹ z‖²
  let w = 0;
  const y = new Float64Array(q);
  for (let i = 0; i < q; i++) {
    let s = z[i];
    for (let m = 0; m < i; m++) s -= a[i * q + m] * y[m];
    y[i] = s / a[i * q + i];
    w += y[i] * y[i];
  }
  const f = w / q;
  const pValue = df === null ? chiSquareUpperTail(w, q) : fUpperTail(f, q, df);
  const condition = (maxPivot / minPivot) ** 2;
  return { statistic: w, q, fStatistic: f, df, pValue, rejects: pValue < alpha, reason: null, condition };
}
