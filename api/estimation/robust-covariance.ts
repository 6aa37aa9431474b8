import { clusterMeat } from './cluster-meat';
import { EstimationInputError } from './errors';
import { heteroskedasticMeat } from './hc-meat';
import { defaultNeweyWestLag } from './newey-west-lag';
import { neweyWestMeat } from './newey-west-meat';
import type { CovarianceInfo, CovarianceOptions, LeastSquaresCore } from './types';
import { take, type Workspace } from './workspace';

/**
 * Covariance matrix of OLS coefficients: classical, HC0/HC1/HC3, Newey–West or
 * cluster-robust, from the QR factors (never from XᵀX).
 *
 * Formulas (X = Q₁·R·Pᵀ, e the residuals, q_i the rows of Q₁, s² = eᵀe/(n−k)):
 * - classical   V = s²·(XᵀX)⁻¹ = s²·P R⁻¹R⁻ᵀ Pᵀ
 * - sandwich    V = c · P R⁻¹ M R⁻ᵀ Pᵀ with M from hc-meat.ts, newey-west-meat.ts or
 *   cluster-meat.ts, which is the same as (XᵀX)⁻¹ [Σ scores] (XᵀX)⁻¹.
 * - factors c:  HC0 1, HC1 n/(n−k), HC3 1 (weights 1/(1−h_i)² inside M);
 *   Newey–West n/(n−k) (`adjust`, default true; lag default floor(4(n/100)^(2/9)));
 *   cluster `clusterAdjustment`: `n_over_n_minus_k` N/(N−k) (default), `none` 1,
 *   `g_over_g_minus_1` G/(G−1), `combined` G/(G−1)·(N−1)/(N−k), with k =
 *   `clusterParameterCount` (default the number of columns; for a within-transformed
 *   panel, the slope regressors only).
 * References: White (1980) Econometrica 48(4); MacKinnon & White (1985) Journal of
 * Econometrics 29(3); Newey & West (1987) Econometrica 55(3); Arellano (1987) Oxford
 * Bulletin of Economics and Statistics 49(4); Zeileis, A. (2004), "Econometric computing
 * with HC and HAC covariance matrix estimators", Journal of Statistical Software 11(10).
 *
 * Throws: EstimationInputError `invalid_argument` (bad lag, missing or mismatched cluster
 * labels, fewer than 2 clusters, n ≤ k) and `covariance_undefined` (HC3 with leverage 1).
 *
 * Example: y = (1, 2, 4) on X = [1 1; 1 2; 1 3] gives b = (−2/3, 3/2), e = (1/6, −1/3, 1/6),
 * s² = 1/6 and (XᵀX)⁻¹ = [[7/3, −1], [−1, 1/2]], so
 *   robustCovariance(core, e, h, { covariance: 'classical' }).matrix
 *   // → [7/18, −1/6, −1/6, 1/12]   (column-major 2 × 2)
 */
export function robustCovariance(
  core: LeastSquaresCore,
  e: ArrayLike<number>,
  leverage: ArrayLike<number>,
  options: CovarianceOptions,
  ws?: Workspace,
): { matrix: Float64Array; info: CovarianceInfo } {
  const { n, k, perm, rinv, q1, xtxInv } = core;
  const type = options.covariance ?? 'classical';
  if (!(n > k)) {
    throw new EstimationInputError(
      'invalid_argument',
      `Need more rows than columns for a covariance (n = ${n}, k = ${k})`,
      { n, k },
    );
  }
  if (type === 'classical') {
    let rss = 0;
    for (let i = 0; i < n; i++) rss += e[i] * e[i];
    const s2 = rss / (n - k);
    const v = take(ws, k * k);
    for (let i = 0; i < k * k; i++) v[i] = s2 * xtxInv[i];
    return { matrix: v, info: { type, factor: 1, lag: null, clusters: null } };
  }
  let meat: Float64Array;
  let factor = 1;
  let lag: number | null = null;
  let clusters: number | null = null;
  if (type === 'hc0' || type === 'hc1' || type === 'hc3') {
    meat = heteroskedasticMeat(q1, e, leverage, n, k, type, ws);
    if (type === 'hc1') factor = n / (n - k); // recorded; applied inside the meat
  } else if (type === 'newey_west') {
    lag = options.lag ?? defaultNeweyWestLag(n);
    if (!Number.isInteger(lag) || lag < 0 || lag >= n) {
      throw new EstimationInputError(
        'invalid_argument',
        `Newey–West lag must be an integer in [0, n−1] (n = ${n}), got ${lag}`,
        { reason: 'lag', lag, n },
      );
    }
    meat = neweyWestMeat(q1, e, n, k, lag, ws);
    factor = options.adjust === false ? 1 : n / (n - k);
    if (factor !== 1) for (let i = 0; i < k * k; i++) meat[i] *= factor;
  } else if (type === 'cluster') {
    const labels = options.clusters;
    if (!labels || labels.length !== n) {
      throw new EstimationInputError(
        'invalid_argument',
        `Cluster covariance needs one cluster label per row (${n}), got ${labels ? labels.length : 'none'}`,
        { reason: 'clusters', n },
      );
    }
    const index = new Map<string | number, number>();
    const groups = new Int32Array(n);
    for (let i = 0; i < n; i++) {
      let g = index.get(labels[i]);
      if (g === undefined) {
        g = index.size;
        index.set(labels[i], g);
      }
      groups[i] = g;
    }
    const G = index.size;
    if (G < 2)
      throw new EstimationInputError('invalid_argument', 'Cluster covariance needs at least 2 clusters', {
        reason: 'clusters',
        clusters: G,
      });
    clusters = G;
    meat = clusterMeat(q1, e, n, k, groups, G, ws);
    const kc = options.clusterParameterCount ?? k;
    const adj = options.clusterAdjustment ?? 'n_over_n_minus_k';
    factor =
      adj === 'none'
        ? 1
        : adj === 'g_over_g_minus_1'
          ? G / (G - 1)
          : adj === 'combined'
            ? (G / (G - 1)) * ((n - 1) / (n - kc))
            : n / (n - kc);
    for (let i = 0; i < k * k; i++) meat[i] *= factor;
  } else {
    throw new EstimationInputError('invalid_argument', `Unknown covariance type '${String(type)}'`, {
      reason: 'covariance',
      covariance: type,
    });
  }
  // V_piv = R⁻¹ M R⁻ᵀ (R⁻¹ upper triangular, column-major k × k)
  const t = take(ws, k * k); // T = R⁻¹ M
  for (let a = 0; a < k; a++) {
    for (let c = 0; c < k; c++) {
      let s = 0;
      for (let m = a; m < k; m++) s += rinv[m * k + a] * meat[c * k + m];
      t[c * k + a] = s;
    }
  }
  const v = take(ws, k * k);
  for (let a = 0; a < k; a++) {
    for (let b = a; b < k; b++) {
      let s = 0;
      for (let m = b; m < k; m++) s += t[m * k + a] * rinv[m * k + b];
      v[perm[a] * k + perm[b]] = s;
      v[perm[b] * k + perm[a]] = s;
    }
  }
  return { matrix: v, info: { type, factor, lag, clusters } };
}
