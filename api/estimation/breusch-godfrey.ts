import { chiSquareUpperTail } from './distributions';
import { take, type Workspace } from './workspace';

/**
 * Breusch–Godfrey LM test for serial correlation up to order p (rows in year order).
 *
 * Formula: auxiliary regression of e on [X, e_{t−1}, …, e_{t−p}] (lagged residuals filled
 * with 0 before the start, as R's lmtest::bgtest with fill = 0); LM = n·Σŷ²_aux/Σe² against
 * χ²(p). Because e ⊥ X, the fitted sum of squares is ‖Q₁ᵀe‖² + ‖P_Z̃ e‖² with
 * Z̃ = (I − Q₁Q₁ᵀ)Z, so only a p-column least-squares problem is solved (modified
 * Gram–Schmidt with one re-orthogonalisation against Q₁ and the previous columns).
 * References: Breusch, T. S. (1978), "Testing for autocorrelation in dynamic linear
 * models", Australian Economic Papers 17(31), 334–355; Godfrey, L. G. (1978), "Testing
 * against general autoregressive and moving average error models when the regressors
 * include lagged dependent variables", Econometrica 46(6), 1293–1301.
 *
 * Orders 1..maxOrder are computed together (the order-p basis extends the order-(p−1) one).
 *
 * Throws: nothing; statistic null when n ≤ k + p or a lag column is numerically in span(X).
 *
 * Example: breuschGodfrey(e, q1, 35, 4, 2) on PA01 residuals
 *   // → [{ order: 1, statistic: 2.2009…, df: 1, pValue: 0.1379… }, { order: 2, statistic: 2.5793…, df: 2, pValue: 0.2754… }]
 */
export function breuschGodfrey(
  e: ArrayLike<number>,
  q1: Float64Array,
  n: number,
  k: number,
  maxOrder: number,
  ws?: Workspace,
): Array<{ order: number; statistic: number | null; df: number; pValue: number | null }> {
  const out: Array<{ order: number; statistic: number | null; df: number; pValue: number | null }> = [];
  let ee = 0;
  for (let t = 0; t < n; t++) ee += e[t] * e[t];
  // orthonormal basis: the k columns of Q₁, then the orthonormalised lag columns
  const basis = take(ws, n * (k + maxOrder));
  basis.set(q1.subarray(0, n * k));
  let fitted = 0;
  for (let c = 0; c < k; c++) {
    let s = 0;
    for (let t = 0; t < n; t++) s += basis[c * n + t] * e[t];
    fitted += s * s;
  }
  let ok = ee > 0;
  for (let j = 1; j <= maxOrder; j++) {
    if (ok && n > k + j) {
      const oz = (k + j - 1) * n;
      for (let t = j; t < n; t++) basis[oz + t] = e[t - j];
      let norm0 = 0;
      for (let t = 0; t < n; t++) norm0 += basis[oz + t] * basis[oz + t];
      norm0 = Math.sqrt(norm0);
      // Gram–Schmidt against the basis, repeated once when the norm drops by more than
      // half (Kahan–Parlett "twice is enough" criterion)
      let nz = norm0;
      for (let pass = 0; pass < 2; pass++) {
        const before = nz;
        for (let c = 0; c < k + j - 1; c++) {
          const oc = c * n;
          let s = 0;
          for (let t = 0; t < n; t++) s += basis[oc + t] * basis[oz + t];
          for (let t = 0; t < n; t++) basis[oz + t] -= s * basis[oc + t];
        }
        nz = 0;
        for (let t = 0; t < n; t++) nz += basis[oz + t] * basis[oz + t];
        nz = Math.sqrt(nz);
        if (nz > 0.5 * before) break;
      }
      if (nz > 1e-10 * norm0) {
        let s = 0;
        for (let t = 0; t < n; t++) {
          basis[oz + t] /= nz;
          s += basis[oz + t] * e[t];
        }
        fitted += s * s;
        const statistic = (n * fitted) / ee;
        out.push({ order: j, statistic, df: j, pValue: chiSquareUpperTail(statistic, j) });
        continue;
      }
    }
    ok = false;
    out.push({ order: j, statistic: null, df: j, pValue: null });
  }
  return out;
}
