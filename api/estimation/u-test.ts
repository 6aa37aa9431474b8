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
  slopeCoefficients: ReadonlyArray<number>,
  slopeCovariance: ReadonlyArray<ArrayLike<number>>,
  xMin: number,
  xMax: number,
  df: number | null,
  alpha: number,
): UTestResult {
  const lo = slopeAt(slopeCoefficients, slopeCovariance, xMin);
  const hi = slopeAt(slopeCoefficients, slopeCovariance, xMax);
  const loValue = lo[0],
    loSe = lo[1],
    hiValue = hi[0],
    hiSe = hi[1];
  const tMin = loValue / loSe,
    tMax = hiValue / hiSe;
  const orientation: 'inverted_u' | 'u' = hiValue < loValue ? 'inverted_u' : 'u';
  const invStat = Math.min(tMin, -tMax);
  const uStat = Math.min(-tMin, tMax);
  const pInv = Number.isNaN(invStat) ? null : upperTail(invStat, df);
  const pU = Number.isNaN(uStat) ? null : upperTail(uStat, df);
  const statistic = orientation === 'inverted_u' ? invStat : uStat;
  const pValue = orientation === 'inverted_u' ? pInv : pU;
  // extremum inside the range: the slope changes sign between x_min and x_max
  const extremumInRange = (loValue > 0 && hiValue < 0) || (loValue < 0 && hiValue > 0);
  return {
    xMin,
    xMax,
    slopeAtMin: loValue,
    seAtMin: loSe,
    tAtMin: finite(tMin),
    slopeAtMax: hiValue,
    seAtMax: hiSe,
    tAtMax: finite(tMax),
    orientation,
    statistic: finite(statistic),
    df,
    pValue,
    rejects: pValue !== null && pValue < alpha,
    alpha,
    extremumInRange,
    bothOrientations: {
      inverted_u: { statistic: finite(invStat), pValue: pInv },
      u: { statistic: finite(uStat), pValue: pU },
    },
  };
}

/** [s(x), se(s(x))] for the slope polynomial with gradient (1, 2x, 3x²). */
function slopeAt(b: ReadonlyArray<number>, V: ReadonlyArray<ArrayLike<number>>, x: number): [number, number] {
  const m = b.length;
  const a0 = 1,
    a1 = 2 * x,
    a2 = 3 * x * x;
  let value = a0 * b[0] + a1 * b[1];
  let v = V[0][0] + 2 * a1 * V[0][1] + a1 * a1 * V[1][1];
  if (m > 2) {
    value += a2 * b[2];
    v += 2 * a2 * V[0][2] + 2 * a1 * a2 * V[1][2] + a2 * a2 * V[2][2];
  }
  return [value, Math.sqrt(Math.max(v, 0))];
}

function finite(v: number): number | null {
  return Number.isFinite(v) ? v : null;
}
