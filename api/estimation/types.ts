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
  /** 'auto' (default) uses double-double when the estimated forward error u·κ·(1 + κ‖r‖/(‖X‖‖b‖)) exceeds 1e-11 */
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

/** A piece of a confidence set on the x scale; null ends are infinite. */
export interface SetPiece {
  lo: number | null;
  hi: number | null;
}

/**
 * A Fieller-type confidence set. `bounded`: [lo, hi]. `two_rays`: (−∞, lo] ∪ [hi, ∞)
 * (one of lo/hi null when only one ray exists). `whole_line`: lo = hi = null.
 */
export interface FiellerSet {
  kind: 'bounded' | 'two_rays' | 'whole_line';
  lo: number | null;
  hi: number | null;
  pieces: SetPiece[];
  /** quadratic coefficients A, B, C and discriminant (quadratic model only) */
  A?: number;
  B?: number;
  C?: number;
  discriminant?: number;
  /** cubic sets: false when no piece contains x* (a numerical failure, never shown as an interval) */
  containsTurningPoint?: boolean;
}

export interface UTestResult {
  xMin: number;
  xMax: number;
  slopeAtMin: number;
  seAtMin: number;
  tAtMin: number | null;
  slopeAtMax: number;
  seAtMax: number;
  tAtMax: number | null;
  /** the H1 tested, chosen by the estimated curvature */
  orientation: 'inverted_u' | 'u';
  statistic: number | null;
  /** degrees of freedom of the t reference; null = normal */
  df: number | null;
  /** one-sided p-value */
  pValue: number | null;
  rejects: boolean;
  alpha: number;
  /** the estimated slope changes sign inside [xMin, xMax] */
  extremumInRange: boolean;
  bothOrientations: {
    inverted_u: { statistic: number | null; pValue: number | null };
    u: { statistic: number | null; pValue: number | null };
  };
}

export interface WaldTestResult {
  /** W = bᵀ V⁻¹ b */
  statistic: number | null;
  q: number;
  /** W / q */
  fStatistic: number | null;
  /** denominator df; null = chi-square reference */
  df: number | null;
  pValue: number | null;
  rejects: boolean | null;
  reason: string | null;
  /** condition of the equilibrated block (pivoted Cholesky estimate); null when not computed */
  condition: number | null;
}

/**
 * Shape over the observed range; `n_shape` (rises, falls, rises again) and `inverted_n`
 * (falls, rises, falls) only for a cubic whose slope changes sign twice inside the range.
 */
export type ShapeName = 'inverted_u' | 'u' | 'increasing' | 'decreasing' | 'flat' | 'n_shape' | 'inverted_n';
export type StandingName = 'approaching' | 'at_turn' | 'past_turn' | 'no_turn' | 'not_estimable';

/** An interval end pair on the model's x scale and in real units (exp under the log transform). */
export interface IntervalEnds {
  lo: number | null;
  hi: number | null;
  levelLo: number | null;
  levelHi: number | null;
}

export interface TurningPoint {
  /** on the model's x scale (ln driver under the log transform) */
  x: number;
  /** in real units: exp(x) under the log transform, x itself in level form (null if it overflows) */
  level: number | null;
  kind: 'peak' | 'trough';
  inRange: boolean;
  /** gradient of x* with respect to the slope coefficients (b1, b2[, b3]) */
  gradient: number[];
  delta: { se: number | null } & IntervalEnds;
  fieller: FiellerSet & { levelLo: number | null; levelHi: number | null };
  /** the interval chosen for standing (Fieller by default) is bounded */
  intervalBounded: boolean;
  /** outside [xMin, xMax] */
  extrapolated: boolean;
}

export interface SignRuleReading {
  reading: ShapeName;
  b1: number;
  b2: number;
  pB1: number;
  pB2: number;
  alpha: number;
}

export interface ShapeResult {
  shape: ShapeName;
  decidedBy: 'u_test' | 'wald_flat' | 'two_turns_in_range' | 'slope_at_midpoint';
  notes: string[];
  slopeAtMidpoint: { x: number; value: number; se: number | null };
  /** the common-practice first read from the signs of b1 and b2 */
  signRule: SignReading | null;
}

export type SignReading = SignRuleReading;

export interface StandingResult {
  standing: StandingName;
  /** the turning point (index into turningPoints) that sets the standing */
  turningPointIndex: number | null;
  intervalMethod: 'fieller' | 'delta';
  /** false: the interval is not bounded and the standing follows the point estimate */
  intervalBounded: boolean | null;
  interval: IntervalEnds | null;
  extrapolated: boolean;
  xNow: number;
  levelNow: number;
  note: string | null;
}

export interface GapResult {
  /** 100·(X_now/X* − 1) in real units */
  percent: number | null;
  extrapolated: boolean;
  reason: string | null;
}

export interface ElasticityResult {
  xNow: number;
  value: number | null;
  se: number | null;
  lo: number | null;
  hi: number | null;
  form: 'log' | 'level';
  reason: string | null;
}

export interface TrendResult {
  /** OLS slope of ln(driver) on year over rows with year > lastYear − window */
  slopePerYear: number | null;
  nUsed: number;
  firstYear: number | null;
  lastYear: number | null;
  window: number;
  reason: string | null;
}

export interface ProjectionResult {
  status: 'projected' | 'already_past' | 'not_on_current_trend' | 'no_threshold';
  yearsToThreshold: number | null;
  crossingYear: number | null;
  range: { earliest: number | null; latest: number | null } | null;
  extrapolated: boolean;
  note: string | null;
}

export interface CurveDiagnostics {
  /** pValue: normal approximation with exact moments; pValueExact: Imhof's exact p (null unless requested) */
  durbinWatson: {
    statistic: number;
    pValue: number | null;
    pValueExact: number | null;
    mean: number | null;
    variance: number | null;
    method: string;
  };
  breuschGodfrey: Array<{ order: number; statistic: number | null; df: number; pValue: number | null }>;
  breuschPagan: { statistic: number | null; df: number; pValue: number | null };
  jarqueBera: {
    statistic: number | null;
    skewness: number | null;
    kurtosis: number | null;
    df: 2;
    pValue: number | null;
  };
  /** row is the index in year order */
  largestLeverage: { value: number; year: number; row: number } | null;
  residualsByYear: Array<{ year: number; residual: number }>;
}

export interface CriticalValueInfo {
  kind: 't' | 'normal';
  df: number | null;
  value: number;
  level: number;
}

export interface CurveRange {
  /** on the model's x scale */
  xMin: number;
  xMax: number;
  /** in real units */
  levelMin: number;
  levelMax: number;
  firstYear: number;
  lastYear: number;
  /** the driver in the latest year */
  xNow: number;
  levelNow: number;
}

/** A district curve that could be fitted. */
export interface CurveFit extends OlsResult {
  status: 'ok';
  model: import('./model-spec').ModelSpec;
  /** coefficient names: const, x, x2[, x3], then the controls */
  terms: string[];
  years: number[];
  range: CurveRange;
  critical: CriticalValueInfo;
  turningPoints: TurningPoint[];
  uTest: UTestResult;
  wald: WaldTestResult;
  shape: ShapeResult;
  standing: StandingResult;
  gap: GapResult;
  elasticity: ElasticityResult;
  trend: TrendResult;
  projection: ProjectionResult;
  diagnostics: CurveDiagnostics | null;
}

/** A district whose data cannot carry the model (too short, rank deficient, ...). */
export interface CurveNotEstimable {
  status: 'not_estimable';
  model: import('./model-spec').ModelSpec;
  n: number;
  k: number;
  minYears: number;
  reason: {
    code: 'too_few_rows' | 'rank_deficient' | 'covariance_undefined' | 'numerical_failure';
    message: string;
    details: Record<string, unknown>;
  };
  standing: { standing: 'not_estimable' };
}

export type FitCurveResult = CurveFit | CurveNotEstimable;

export interface FitCurveOptions {
  /** compute the residual diagnostics (default true) */
  diagnostics?: boolean;
  /** also compute the exact Durbin–Watson p-value (Imhof; ≈ 1 ms per fit; default false) */
  exactDurbinWatson?: boolean;
}

/** The pooled two-way fixed-effects curve of a region. */
export interface PanelFit {
  status: 'ok';
  model: import('./model-spec').ModelSpec;
  /** slope terms only (the fixed effects are absorbed): x, x2[, x3], controls */
  terms: string[];
  coefficients: number[];
  standardErrors: number[];
  /** t = b / SE and two-sided p with G − 1 df (or normal) */
  tStatistics: number[];
  pValues: number[];
  covariance: number[][];
  covarianceInfo: CovarianceInfo;
  n: number;
  districts: number;
  years: number;
  balanced: boolean;
  /** N − k − (G + T − C), C the connected components (plm's df for a connected panel) */
  dfResidual: number;
  /** degrees of freedom of inference: G − 1 (null under normal critical values) */
  df: number | null;
  rss: number;
  rSquaredWithin: number;
  adjRSquaredWithin: number;
  absorption: {
    method: 'alternating_projections';
    iterations: number;
    converged: boolean;
    maxRelativeChange: number;
    components: number;
  };
  range: { xMin: number; xMax: number; levelMin: number; levelMax: number };
  critical: CriticalValueInfo;
  turningPoints: TurningPoint[];
  uTest: UTestResult;
  wald: WaldTestResult;
  shape: ShapeResult;
  condition: OlsResult['condition'];
}

export interface PanelNotEstimable {
  status: 'not_estimable';
  model: import('./model-spec').ModelSpec;
  n: number;
  k: number;
  reason: {
    code: 'too_few_rows' | 'too_few_districts' | 'rank_deficient' | 'not_converged' | 'numerical_failure';
    message: string;
    details: Record<string, unknown>;
  };
}

export type FitPanelResult = PanelFit | PanelNotEstimable;
