/**
 * Delta-method standard error and symmetric confidence interval of a smooth function of
 * the coefficients: se = √(gᵀ V g), interval point ∓ c·se (on the scale where g was
 * taken; for a log-scale turning point exponentiate the two ends, never ± on the level).
 *
 * Formula: first-order Taylor expansion, Var f(b̂) ≈ ∇fᵀ V ∇f.
 * Reference: Oehlert, G. W. (1992), "A note on the delta method", The American
 * Statistician 46(1), 27–29.
 *
 * Throws: nothing; `se`, `lo`, `hi` are null when gᵀVg is negative or not finite.
 *
 * Example:
 *   deltaMethod([1, 2], [[1, 0], [0, 0.25]], 10, 2)   // → { se: 1.4142135623730951, lo: 7.17157…, hi: 12.82842… }
 */
export function deltaMethod(
  gradient: ArrayLike<number>,
  covariance: ReadonlyArray<ArrayLike<number>>,
  point: number,
  critical: number,
): { se: number | null; lo: number | null; hi: number | null } {
  const m = gradient.length;
  let v = 0;
  for (let a = 0; a < m; a++) for (let b = 0; b < m; b++) v += gradient[a] * covariance[a][b] * gradient[b];
  if (!(v >= 0) || !Number.isFinite(v) || !Number.isFinite(point)) return { se: null, lo: null, hi: null };
  const se = Math.sqrt(v);
  return { se, lo: point - critical * se, hi: point + critical * se };
}
