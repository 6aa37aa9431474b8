import normalCdf from '@stdlib/stats-base-dists-normal-cdf';
import { take, type Workspace } from './workspace';

/**
 * Durbin–Watson statistic for first-order serial correlation of OLS residuals (rows in
 * year order), with the normal-approximation p-value for H1: positive autocorrelation.
 *
 * Formula: DW = Σ_{t≥2}(e_t − e_{t−1})² / Σ e_t². p-value: DW is approximated by a normal
 * with its exact mean and variance under H0, E = P/(n−k), Var = 2(Q − P·E)/((n−k)(n−k+2)),
 * where with A the DW difference matrix (tridiagonal, diagonal 1, 2, …, 2, 1, off-diagonal
 * −1) and Q₁ the thin Q of X: P = tr(A) − tr(Q₁ᵀAQ₁) and
 * Q = tr(A²) − 2·tr(Q₁ᵀA²Q₁) + tr((Q₁ᵀAQ₁)²); p = Φ((DW − E)/√Var). These are the moments
 * of R's lmtest::dwtest(exact = FALSE), computed from Q₁ instead of (XᵀX)⁻¹.
 * References: Durbin, J. and Watson, G. S. (1950, 1951), "Testing for serial correlation
 * in least squares regression I, II", Biometrika 37(3/4), 409–428 and 38(1/2), 159–177.
 *
 * Throws: nothing; pValue is null when n < max(5, k) or the variance is not positive.
 *
 * Example: residuals (1, −1, 1, −1, …) alternate, so DW ≈ 4 and the p-value is ≈ 1.
 */
export function durbinWatson(
  e: ArrayLike<number>,
  q1: Float64Array,
  n: number,
  k: number,
  ws?: Workspace,
): { statistic: number; pValue: number | null; mean: number | null; variance: number | null; method: string } {
  let num = 0,
    den = 0;
  for (let t = 0; t < n; t++) {
    den += e[t] * e[t];
    if (t > 0) num += (e[t] - e[t - 1]) * (e[t] - e[t - 1]);
  }
  const statistic = num / den;
  const method = 'normal approximation with exact moments, H1: positive autocorrelation';
  if (n < Math.max(5, k) || !(den > 0)) return { statistic, pValue: null, mean: null, variance: null, method };
  // B = A·Q₁
  const b = take(ws, n * k);
  for (let c = 0; c < k; c++) {
    const o = c * n;
    for (let t = 0; t < n; t++) {
      const diag = t === 0 || t === n - 1 ? 1 : 2;
      let v = diag * q1[o + t];
      if (t > 0) v -= q1[o + t - 1];
      if (t < n - 1) v -= q1[o + t + 1];
      b[o + t] = v;
    }
  }
  // Q₁ᵀAQ₁ is symmetric: its trace and squared Frobenius norm from the upper triangle
  let trQAQ = 0,
    trQA2Q = 0,
    trSq = 0;
  for (let c = 0; c < k; c++) {
    for (let d = c; d < k; d++) {
      let s = 0;
      for (let t = 0; t < n; t++) s += q1[c * n + t] * b[d * n + t];
      if (c === d) {
        trQAQ += s;
        trSq += s * s;
      } else trSq += 2 * s * s;
    }
    for (let t = 0; t < n; t++) trQA2Q += b[c * n + t] * b[c * n + t];
  }
  const P = 2 * (n - 1) - trQAQ;
  const Q = 2 * (3 * n - 4) - 2 * trQA2Q + trSq;
  const mean = P / (n - k);
  const variance = (2 / ((n - k) * (n - k + 2))) * (Q - P * mean);
  if (!(variance > 0)) return { statistic, pValue: null, mean, variance, method };
  return { statistic, pValue: normalCdf(statistic, mean, Math.sqrt(variance)), mean, variance, method };
}
