/**
 * Plain-data types of the estimation engine (inputs, results and the internal least-squares
 * core shared by the double and double-double solvers). No functions here.
 */

/**
 * Column-major design matrix: entry (i, j) is data[j * nRows + i]. `dataLo`, when given,
 * holds low-order parts so that entry (i, j) is exactly data + dataLo (a double-double
 * design, e.g. raw polynomial powers from polynomial-design.ts); solvers that work in
 * double use data only, except for the compensated residuals.
 */
export interface DesignMatrix {
  nRows: number;
  nCols: number;
  data: Float64Array;
  dataLo?: Float64Array;
}

/** What a least-squares solver hands to ols (internal; column-major Float64Arrays). */
export interface LeastSquaresCore {
  n: number;
  k: number;
  rank: number;
  /** perm[j] = original column index of pivot position j */
  perm: Int32Array;
  /** original column norms, in pivot order */
  columnNorms: Float64Array;
  /** relative remaining norm of each column when it was chosen, pivot order */
  relativePivots: Float64Array;
  precision: 'double' | 'double-double';
  refinementSteps: number;
  /** original column order */
  coefficients: Float64Array;
  residuals: Float64Array;
  /** thin Q (n × k, pivot order) */
  q1: Float64Array;
  /** R⁻¹ (k × k upper, pivot order) */
  rinv: Float64Array;
  /** (XᵀX)⁻¹ in original order, k × k */
  xtxInv: Float64Array;
  /** R (k × k, column-major, pivot order; only the first `rank` rows meaningful) */
  r: Float64Array;
  rDiagonal: Float64Array;
}

export type CovarianceType = 'classical' | 'hc0' | 'hc1' | 'hc3' | 'newey_west' | 'cluster';

/**
 * Small-sample factor for cluster-robust covariances (N rows, G clusters, k the number of
 * regressors counted, see `clusterParameterCount`):
 * - `n_over_n_minus_k` N/(N−k)             (default; plm's HC1 convention)
 * - `none`             1                    (HC0)
 * - `g_over_g_minus_1` G/(G−1)
 * - `combined`         G/(G−1) · (N−1)/(N−k)
 */
export type ClusterAdjustment = 'n_over_n_minus_k' | 'none' | 'g_over_g_minus_1' | 'combined';

export interface CovarianceOptions {
  covariance?: CovarianceType;
  /** Newey–West lag (rows); default floor(4·(n/100)^(2/9)) */
  lag?: number;
  /** Newey–West small-sample factor n/(n−k); default true */
  adjust?: boolean;
  /** cluster labels, one per row (covariance 'cluster') */
  clusters?: ReadonlyArray<string | number>;
  clusterAdjustment?: ClusterAdjustment;
  /** k used in the cluster factor; default the number of columns of X */
  clusterParameterCount?: number;
}

export interface OlsOptions extends CovarianceOptions {
  /** column names used in messages and results; default x0, x1, ... */
  names?: readonly string[];
  /** 'auto' (default) uses double-double when the scaled condition estimate exceeds 1e7 */
  precision?: 'auto' | 'double' | 'double-double';
  /** relative remaining-norm threshold for rank deficiency (default 1e-12) */
  rankTolerance?: number;
  /** R² about the mean (true) or about zero; default: true when X has a constant column */
  centeredRSquared?: boolean;
}

export interface CovarianceInfo {
  type: CovarianceType;
  /** multiplier applied to the meat (n/(n−k), N/(N−k), ...) */
  factor: number;
  lag: number | null;
  clusters: number | null;
}

export interface OlsResult {
  names: string[];
  coefficients: number[];
  standardErrors: number[];
  /** coefficient / SE */
  tStatistics: number[];
  /** two-sided p-values from t with df degrees of freedom */
  pValues: number[];
  covariance: number[][];
  covarianceInfo: CovarianceInfo;
  residuals: number[];
  fitted: number[];
  /** diagonal of the hat matrix */
  leverage: number[];
  n: number;
  k: number;
  df: number;
  rank: number;
  rss: number;
  tss: number;
  rSquared: number;
  adjRSquared: number;
  residualStandardError: number;
  condition: {
    /** κ₁(R) = ‖R‖₁‖R⁻¹‖₁, an estimate of the condition number of X */
    estimate: number;
    /** the same for the column-equilibrated X·D⁻¹ (what limits the accuracy) */
    scaledEstimate: number;
    precision: 'double' | 'double-double';
    refinementSteps: number;
  };
}
