/**
 * Residuals e = y − X·b computed as if in twice the working precision, then rounded
 * (compensated dot products: TwoSum for the running sum, Dekker's TwoProduct for each
 * term, errors accumulated separately).
 *
 * Formula: Ogita, Rump & Oishi's Dot2, e_i = fl( Σ_c p_c + Σ_c ε_c ) with y_i − Σ x_ic b_c
 * split exactly into sums and products; the result is as accurate as the double-double
 * value rounded once, unless the cancellation exceeds ~1e16.
 * Reference: Ogita, T., Rump, S. M. and Oishi, S. (2005), "Accurate sum and dot product",
 * SIAM Journal on Scientific Computing 26(6), 1955–1988.
 * These residuals drive the iterative refinement of ols (Golub & Wilkinson 1966, "Note on
 * the iterative refinement of least squares solution", Numerische Mathematik 9, 139–148).
 *
 * When `xLo` is given, X is the double-double design x + xLo and the terms xLo·b are
 * added to the error sum (their own rounding is below the result's).
 *
 * Throws: nothing. `out` (length n) receives the residuals; X is column-major n × k.
 *
 * Example:
 *   compensatedResiduals(Float64Array.from([1, 1]), Float64Array.from([1 + 2 ** -52, 1]),
 *     Float64Array.from([1]), 2, 1, new Float64Array(2))
 *   // → Float64Array [2.220446049250313e-16, 0]
 */
export function compensatedResiduals(
  x: Float64Array,
  y: Float64Array,
  b: Float64Array,
  n: number,
  k: number,
  out: Float64Array,
  xLo?: Float64Array,
): Float64Array {
  const SPLIT = 134217729;
  for (let i = 0; i < n; i++) {
    let s = y[i];
    let err = 0;
    for (let c = 0; c < k; c++) {
      const u = x[c * n + i];
      const v = -b[c];
      const p = u * v;
      let t = SPLIT * u;
      const uh = t - (t - u),
        ul = u - uh;
      t = SPLIT * v;
      const vh = t - (t - v),
        vl = v - vh;
      const pe = uh * vh - p + uh * vl + ul * vh + ul * vl;
      const s2 = s + p;
      const bb = s2 - s;
      err += s - (s2 - bb) + (p - bb) + pe;
      s = s2;
    }
    if (xLo) for (let c = 0; c < k; c++) err -= xLo[c * n + i] * b[c];
    out[i] = s + err;
  }
  return out;
}
