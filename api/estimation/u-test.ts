import { upperTail } from './distributions';
import type { UTestResult } from './types';

/**
 * Lind–Mehlum test for an inverse-U (or U) shape over the observed range [x_min, x_max].
 *
 * Formula: slope s(x) = b1 + 2·b2·x [+ 3·b3·x²], se(s(x)) = √(a(x)ᵀ V a(x)) with
 * a(x) = (1, 2x[, 3x²]) and V the covariance block of the slope terms; t_min = s(x_min)/se,
 * t_max = s(x_max)/se. Orientation: inverse U when s(x_max) < s(x_min) (for a quadratic,
 * b2 < 0), else U. Inverse U: H1 s(x_min) > 0 and s(x_max) < 0, statistic
 * T = min(t_min, −t_max); U: T = min(−t_min, t_max). One-sided p = P(t_df > T) (N(0,1)
 * when df is null) — the intersection-union test of Sasabuchi (1980). When the extremum lies
 * outside the range one slope has the "wrong" sign, T < 0 and p > 0.5 (trivial
 * non-rejection); T and p are still reported.
 * References: Lind, J. T. and Mehlum, H. (2010), "With or without U? The appropriate test
 * for a U-shaped relationship", Oxford Bulletin of Economics and Statistics 72(1), 109–118;
 * Sasabuchi, S. (1980), "A test of a multivariate normal mean with composite hypotheses
 * determined by linear inequalities", Biometrika 67(2), 429–439.
 *
 * Throws: nothing; se values of zero give ±Infinity t, reported as null.
 *
 * Example (PA01, classical covariance, df 31):
 *   lindMehlumTest([12.1077, -0.61929], V, 8.9999995, 10.5941058, 31, 0.05)
 *   // → { orientation: 'inverted_u', statistic: 15.5726…, pValue: 1.66e-16, rejects: true, … }
 */
export function lindMehlumTest(
  slopeCoefficients: ReadonlyArray<number>, slopeCovariance: ReadonlyArray<ArrayLike<number>>,
  xMin: number, xMax: number, df: number | null, alpha: number,
): UTestResult {
  const m = slopeCoefficients.length;
  const at = (x: number): { value: number; se: number } => {
    const a = [1, 2 * x, 3 * x * x].slice(0, m);
    let value = 0, v = 0;
    for (let i = 0; i < m; i++) {
      value += a[i] * slopeCoefficients[i];
      for (let j = 0; j < m; j++) v += a[i] * slopeCovariance[i][j] * a[j];
    }
    return { value, se: Math.sqrt(Math.max(v, 0)) };
  };
  const lo = at(xMin), hi = at(xMax);
  const tMin = lo.value / lo.se, tMax = hi.value / hi.se;
  const orientation: 'inverted_u' | 'u' = hi.value < lo.value ? 'inverted_u' : 'u';
  const invStat = Math.min(tMin, -tMax);
  const uStat = Math.min(-tMin, tMax);
  const fin = (v: number): number | null => (Number.isFinite(v) ? v : null);
  const p = (s: number): number | null => (Number.isNaN(s) ? null : upperTail(s, df));
  const statistic = orientation === 'inverted_u' ? invStat : uStat;
  const pValue = p(statistic);
  // extremum inside the range: the slope changes sign between x_min and x_max
  const extremumInRange = (lo.value > 0 && hi.value < 0) || (lo.value < 0 && hi.value > 0);
  return {
    xMin, xMax,
    slopeAtMin: lo.value, seAtMin: lo.se, tAtMin: fin(tMin),
    slopeAtMax: hi.value, seAtMax: hi.se, tAtMax: fin(tMax),
    orientation, statistic: fin(statistic), df, pValue,
    rejects: pValue !== null && pValue < alpha,
    alpha,
    extremumInRange,
    bothOrientations: {
      inverted_u: { statistic: fin(invStat), pValue: p(invStat) },
      u: { statistic: fin(uStat), pValue: p(uStat) },
    },
  };
}
