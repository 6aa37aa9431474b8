/**
 * The Newey–West (Bartlett kernel) HAC "meat" in Q₁ coordinates, rows in the order given
 * (year order; a missing year is not a gap in the lag count).
 *
 * Formula: with s_t = e_t·q_t (q_t the t-th row of thin Q) and w_j = 1 − j/(L+1),
 *   M = Σ_t s_t s_tᵀ + Σ_{j=1..L} w_j Σ_{t=j+1..n} (s_t s_{t−j}ᵀ + s_{t−j} s_tᵀ),
 * multiplied by the caller's small-sample factor (n/(n−k) by default, see
 * robust-covariance.ts). The sandwich R⁻¹ M R⁻ᵀ in pivot coordinates equals
 * (XᵀX)⁻¹ [Σ x_t e_t … ] (XᵀX)⁻¹ exactly.
 * Reference: Newey, W. K. and West, K. D. (1987), "A simple, positive semi-definite,
 * heteroskedasticity and autocorrelation consistent covariance matrix", Econometrica 55(3),
 * 703–708.
 *
 * Throws: nothing (the caller validates 0 ≤ L < n).
 *
 * Example: n = 2, k = 1, q = (1/√2, 1/√2), e = (1, 1), L = 1 (w₁ = 1/2):
 *   neweyWestMeat(q, e, 2, 1, 1)  // → [1.5]   (0.5 + 0.5 + 0.5·(0.5 + 0.5))
 */
export function neweyWestMeat(q1: Float64Array, e: ArrayLike<number>, n: number, k: number, lag: number): Float64Array {
  const m = new Float64Array(k * k);
  for (let t = 0; t < n; t++) {
    const et = e[t];
    for (let a = 0; a < k; a++) {
      const sa = et * q1[a * n + t];
      for (let b = a; b < k; b++) m[b * k + a] += sa * et * q1[b * n + t];
    }
  }
  for (let j = 1; j <= lag; j++) {
    const w = 1 - j / (lag + 1);
    for (let t = j; t < n; t++) {
      const et = e[t] * w, es = e[t - j];
      for (let a = 0; a < k; a++) {
        const sa = et * q1[a * n + t];
        const sa2 = es * q1[a * n + t - j];
        for (let b = a; b < k; b++) {
          m[b * k + a] += sa * es * q1[b * n + t - j] + sa2 * et * q1[b * n + t];
        }
      }
    }
  }
  for (let a = 0; a < k; a++) for (let b = a + 1; b < k; b++) m[a * k + b] = m[b * k + a];
  return m;
}
