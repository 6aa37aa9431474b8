import { take, type Workspace } from './workspace';

/**
 * The Newey–West (Bartlett kernel) HAC "meat" in Q₁ coordinates, rows in the order given
 * (year order; a missing year is not a gap in the lag count).
 *
 * Formula: with s_t = e_t·q_t (q_t the t-th row of thin Q) and w_j = 1 − j/(L+1),
 *   M = Σ_t s_t s_tᵀ + Σ_{j=1..L} w_j Σ_{t=j+1..n} (s_t s_{t−j}ᵀ + s_{t−j} s_tᵀ),
 * computed as Sᵀ·(W·S) with S the n × k score matrix and W the banded Toeplitz matrix of the
 * weights (w_0 = 1, w_{|t−s|} within the band, 0 outside), multiplied by the caller's
 * small-sample factor (n/(n−k) by default, see
 * robust-covariance.ts). The sandwich R⁻¹ M R⁻ᵀ in pivot coordinates equals
 * (XᵀX)⁻¹ [Σ x_t e_t … ] (XᵀX)⁻¹ exactly.
 * Reference: Newey, W. K. and West, K. D. (1987), "A simple, positive semi-definite,
 * heteroskedasticity and autocorrelation consistent covariance matrix", Econometrica 55(3),
 * 703–708.
 *
 * Throws: nothing (the caller validates 0 ≤ L < n).
 *
 * Example: n = 2, k = 1, q = (1/√2, 1/√2), e = (1, 1), L = 1 (w₁ = 1/2):
 *   neweyWestMeat(q, e, 2, 1, 1)  // → [1.5000000000000002]   (0.5 + 0.5 + 0.5·(0.5 + 0.5))
 */
export function neweyWestMeat(
  q1: Float64Array,
  e: ArrayLike<number>,
  n: number,
  k: number,
  lag: number,
  ws?: Workspace,
): Float64Array {
  const m = take(ws, k * k);
  // scores s_a(t) = e_t·q_t[a], stored column by column
  const s = take(ws, n * k);
  for (let a = 0; a < k; a++) {
    const o = a * n;
    for (let t = 0; t < n; t++) s[o + t] = e[t] * q1[o + t];
  }
  // M = Sᵀ W S with W the banded Toeplitz matrix of Bartlett weights (w_0 = 1):
  // first U = W S (each entry a short weighted sum), then the upper triangle of Sᵀ U
  const u = take(ws, n * k);
  for (let a = 0; a < k; a++) {
    const o = a * n;
    for (let t = 0; t < n; t++) u[o + t] = s[o + t];
    for (let j = 1; j <= lag; j++) {
      const w = 1 - j / (lag + 1);
      for (let t = j; t < n; t++) {
        u[o + t] += w * s[o + t - j];
        u[o + t - j] += w * s[o + t];
      }
    }
  }
  for (let a = 0; a < k; a++) {
    const oa = a * n;
    for (let b = a; b < k; b++) {
      const ob = b * n;
      let acc0 = 0,
        acc1 = 0;
      let t = 0;
      for (; t + 1 < n; t += 2) {
        acc0 += s[oa + t] * u[ob + t];
        acc1 += s[oa + t + 1] * u[ob + t + 1];
      }
      if (t < n) acc0 += s[oa + t] * u[ob + t];
      m[b * k + a] = acc0 + acc1;
      m[a * k + b] = acc0 + acc1;
    }
  }
  return m;
}
