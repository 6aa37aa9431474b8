import { chiSquareUpperTail } from './distributions';

/**
 * Jarque–Bera test of normality of the residuals.
 *
 * Formula: with central moments m_r = Σ(e_i − ē)^r / n, skewness S = m3/m2^{3/2},
 * kurtosis K = m4/m2², JB = n/6·(S² + (K − 3)²/4) against χ²(2).
 * Reference: Jarque, C. M. and Bera, A. K. (1980), "Efficient tests for normality,
 * homoscedasticity and serial independence of regression residuals", Economics Letters
 * 6(3), 255–259.
 *
 * Throws: nothing; null statistic when n < 3 or all residuals are equal.
 *
 * Example:
 *   jarqueBera([-1, 0, 1]).statistic   // → 0.28125 (S = 0, K = 1.5: 3/6·(2.25/4))
 */
export function jarqueBera(e: ArrayLike<number>): {
  statistic: number | null;
  skewness: number | null;
  kurtosis: number | null;
  df: 2;
  pValue: number | null;
} {
  const n = e.length;
  if (n < 3) return { statistic: null, skewness: null, kurtosis: null, df: 2, pValue: null };
  let mean = 0;
  for (let i = 0; i < n; i++) mean += e[i];
  mean /= n;
  let m2 = 0,
    m3 = 0,
    m4 = 0;
  for (let i = 0; i < n; i++) {
    const d = e[i] - mean,
      d2 = d * d;
    m2 += d2;
    m3 += d2 * d;
    m4 += d2 * d2;
  }
  m2 /= n;
  m3 /= n;
  m4 /= n;
  if (!(m2 > 0)) return { statistic: null, skewness: null, kurtosis: null, df: 2, pValue: null };
  const skewness = m3 / Math.pow(m2, 1.5);
  const kurtosis = m4 / (m2 * m2);
  const statistic = (n / 6) * (skewness * skewness + ((kurtosis - 3) * (kurtosis - 3)) / 4);
  return { statistic, skewness, kurtosis, df: 2, pValue: chiSquareUpperTail(statistic, 2) };
}
