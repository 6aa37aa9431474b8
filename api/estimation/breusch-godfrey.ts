import { chiSquareUpperTail } from './distributions';

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
 * Throws: nothing; statistic null when n ≤ k + p or a lag column is numerically in span(X).
 *
 * Example: breuschGodfrey(e, q1, 35, 4, 1) on PA01 residuals   // → { statistic: 13.3…, df: 1, pValue: 2.6e-4 } (see the R fixture)
 */
export function breuschGodfrey(
  e: ArrayLike<number>, q1: Float64Array, n: number, k: number, order: number,
): { order: number; statistic: number | null; df: number; pValue: number | null } {
  const none = { order, statistic: null, df: order, pValue: null };
  if (n <= k + order) return none;
  let ee = 0;
  for (let t = 0; t < n; t++) ee += e[t] * e[t];
  if (!(ee > 0)) return none;
  const basis: Float64Array[] = [];
  for (let c = 0; c < k; c++) basis.push(q1.subarray(c * n, (c + 1) * n));
  let fitted = 0;
  for (const q of basis) {
    let s = 0;
    for (let t = 0; t < n; t++) s += q[t] * e[t];
    fitted += s * s;
  }
  for (let j = 1; j <= order; j++) {
    const z = new Float64Array(n);
    for (let t = j; t < n; t++) z[t] = e[t - j];
    let norm0 = 0;
    for (let t = 0; t < n; t++) norm0 += z[t] * z[t];
    norm0 = Math.sqrt(norm0);
    for (let pass = 0; pass < 2; pass++) {
      for (const q of basis) {
        let s = 0;
        for (let t = 0; t < n; t++) s += q[t] * z[t];
        for (let t = 0; t < n; t++) z[t] -= s * q[t];
      }
    }
    let nz = 0;
    for (let t = 0; t < n; t++) nz += z[t] * z[t];
    nz = Math.sqrt(nz);
    if (!(nz > 1e-10 * norm0)) return none;
    for (let t = 0; t < n; t++) z[t] /= nz;
    let s = 0;
    for (let t = 0; t < n; t++) s += z[t] * e[t];
    fitted += s * s;
    basis.push(z);
  }
  const statistic = (n * fitted) / ee;
  return { order, statistic, df: order, pValue: chiSquareUpperTail(statistic, order) };
}
