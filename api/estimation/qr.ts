/**
 * Householder QR factorisation with column pivoting, in place on a column-major
 * Float64Array: A·P = Q·R.
 *
 * Formula: at step j the remaining column with the largest *relative* remaining norm
 * ‖a_c(j:n)‖ / ‖a_c‖ is moved to position j (this is Businger–Golub pivoting applied to
 * the column-equilibrated matrix A·D⁻¹, so the pivot order and the rank decision do not
 * depend on the units of the columns); a reflector H_j = I − τ·v·vᵀ (v₀ = 1, LAPACK dlarfg
 * convention, β = −sign(a_jj)·‖x‖) zeroes a_c(j+1:n). Remaining norms are recomputed
 * exactly at every step (k is small) instead of downdated.
 * A column whose relative remaining norm is ≤ `rankTolerance` lies (to that tolerance) in
 * the span of the columns chosen before it: factorisation stops there and `rank` = j.
 *
 * Reference: Businger, P. and Golub, G. H. (1965), "Linear least squares solutions by
 * Householder transformations", Numerische Mathematik 7(3), 269–276.
 *
 * Storage on return: R in the upper triangle of `qr` (first `rank` columns), the essential
 * part of each v below the diagonal, τ in `tau`; `perm[j]` is the original index of the
 * column in position j; `columnNorms[j]` its original Euclidean norm.
 *
 * Throws: nothing (a rank-deficient matrix is reported through `rank`; callers decide).
 *
 * Example:
 *   const a = Float64Array.from([1, 1, 1,  1, 2, 3]);   // columns (1,1,1) and (1,2,3)
 *   const f = pivotedQr(a, 3, 2);
 *   f.rank   // → 2
 *   f.perm   // → Int32Array [0, 1]  (equal relative norms: the first is kept first)
 *   f.qr[0]  // → -1.7320508075688772  (−√3)
 */
export interface QrFactorisation {
  n: number;
  k: number;
  qr: Float64Array;
  tau: Float64Array;
  perm: Int32Array;
  rank: number;
  columnNorms: Float64Array;
  /** relative remaining norm of each column when it was chosen (1 for the first) */
  relativePivots: Float64Array;
}

export const DEFAULT_RANK_TOLERANCE = 1e-12;

export function pivotedQr(
  a: Float64Array,
  n: number,
  k: number,
  rankTolerance = DEFAULT_RANK_TOLERANCE,
): QrFactorisation {
  const tau = new Float64Array(k);
  const perm = new Int32Array(k);
  const orig = new Float64Array(k);
  const rel = new Float64Array(k);
  for (let j = 0; j < k; j++) {
    perm[j] = j;
    let s = 0;
    const off = j * n;
    for (let i = 0; i < n; i++) s += a[off + i] * a[off + i];
    orig[j] = Math.sqrt(s);
  }
  let rank = Math.min(n, k);
  for (let j = 0; j < Math.min(n, k); j++) {
    // choose the pivot by relative remaining norm
    let best = -1;
    let bestRel = -1;
    for (let c = j; c < k; c++) {
      let s = 0;
      const off = c * n;
      for (let i = j; i < n; i++) s += a[off + i] * a[off + i];
      const r = orig[c] > 0 ? Math.sqrt(s) / orig[c] : 0;
      if (r > bestRel) {
        bestRel = r;
        best = c;
      }
    }
    if (best !== j) {
      const oj = j * n,
        ob = best * n;
      for (let i = 0; i < n; i++) {
        const t = a[oj + i];
        a[oj + i] = a[ob + i];
        a[ob + i] = t;
      }
      const t = orig[j];
      orig[j] = orig[best];
      orig[best] = t;
      const p = perm[j];
      perm[j] = perm[best];
      perm[best] = p;
    }
    rel[j] = bestRel;
    if (!(bestRel > rankTolerance)) {
      rank = j;
      break;
    }
    // Householder reflector for column j, rows j..n-1
    const oj = j * n;
    const alpha = a[oj + j];
    let xs = 0;
    for (let i = j + 1; i < n; i++) xs += a[oj + i] * a[oj + i];
    if (xs === 0) {
      tau[j] = 0;
      continue;
    }
    const norm = Math.sqrt(alpha * alpha + xs);
    const beta = alpha >= 0 ? -norm : norm;
    const tj = (beta - alpha) / beta;
    tau[j] = tj;
    const scale = 1 / (alpha - beta);
    for (let i = j + 1; i < n; i++) a[oj + i] *= scale;
    a[oj + j] = beta;
    for (let c = j + 1; c < k; c++) {
      const oc = c * n;
      let w = a[oc + j];
      for (let i = j + 1; i < n; i++) w += a[oj + i] * a[oc + i];
      w *= tj;
      a[oc + j] -= w;
      for (let i = j + 1; i < n; i++) a[oc + i] -= w * a[oj + i];
    }
  }
  return { n, k, qr: a, tau, perm, rank, columnNorms: orig, relativePivots: rel };
}
