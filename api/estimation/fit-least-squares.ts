import { twoSidedP } from './distributions';
import { EstimationInputError } from './errors';
import { leastSquaresDoubleDouble } from './least-squares-dd';
import { leastSquaresDouble } from './least-squares-double';
import { DEFAULT_RANK_TOLERANCE } from './qr';
import { compensatedResiduals } from './compensated-residuals';
import { conditionEstimates } from './condition-estimate';
import { gradientRefinement } from './gradient-refinement';
import { robustCovariance } from './robust-covariance';
import type { DesignMatrix, LeastSquaresCore, OlsOptions, OlsResult } from './types';
import { take, toArray, type Workspace } from './workspace';

/** Estimated relative forward error above which 'auto' precision refits in double-double. */
export const FORWARD_ERROR_THRESHOLD = 1e-11;
/** Unit roundoff of double precision, 2⁻⁵³. */
const UNIT_ROUNDOFF = 2 ** -53;

/**
 * Estimated relative forward error of a least-squares solution computed in double, from
 * the perturbation bound u·κ·(1 + κ·‖r‖/(‖X‖·‖b‖)) (Higham 2002, §20.1; Golub & Van Loan
 * 2013, §5.3.8), on the column-equilibrated problem that pivoted QR effectively solves:
 * κ = κ₁(R·D⁻¹) (condition-estimate.ts), ‖X·D⁻¹‖₂ taken as 1 (its lower bound with unit
 * columns, so the estimate can only be high), ‖D·b‖₂, ‖r‖₂, times the factor that turns a
 * normwise bound into one for the smallest coefficient (scaledCoefficients below): the
 * goal is digits in every coefficient, not in their norm.
 * A small κ with a large residual (R² near 0) can still lose digits through the κ² term.
 * The refinement that follows a high estimate (improveOrRefit) removes that term.
 */
export function forwardErrorEstimate(
  core: Pick<LeastSquaresCore, 'k' | 'perm' | 'columnNorms' | 'coefficients' | 'residuals' | 'n'>,
  kappa: number,
): number {
  const { n, residuals } = core;
  const { norm, amplification } = scaledCoefficients(core);
  let nr = 0;
  for (let i = 0; i < n; i++) nr += residuals[i] * residuals[i];
  const ratio = norm > 0 ? Math.sqrt(nr) / norm : Infinity;
  return UNIT_ROUNDOFF * kappa * (1 + kappa * ratio) * amplification;
}

/**
 * ‖D·b‖₂ and the factor that turns the normwise bound into one for every coefficient:
 * ‖D·b‖ / min |D_j·b_j| over the coefficients that carry at least SMALLEST_SHARE of ‖D·b‖
 * (an error of size E·‖D·b‖ in D·b is a relative error of E·‖D·b‖/|D_j·b_j| in b_j).
 * Without it, a fit whose coefficients differ in scale by 10⁵ after equilibration (a
 * degree-5 polynomial in x = 1…21 whose coefficients are all 1) passes the normwise test
 * while its smallest coefficient keeps under 10 digits.
 */
function scaledCoefficients(core: Pick<LeastSquaresCore, 'k' | 'perm' | 'columnNorms' | 'coefficients'>): {
  norm: number;
  amplification: number;
} {
  const { k, perm, columnNorms, coefficients } = core;
  let nb = 0;
  for (let j = 0; j < k; j++) {
    const v = columnNorms[j] * coefficients[perm[j]];
    nb += v * v;
  }
  const norm = Math.sqrt(nb);
  let smallest = norm;
  for (let j = 0; j < k; j++) {
    const v = Math.abs(columnNorms[j] * coefficients[perm[j]]);
    if (v >= SMALLEST_SHARE * norm && v < smallest) smallest = v;
  }
  return { norm, amplification: smallest > 0 ? norm / smallest : 1 };
}

/** Coefficients below this share of ‖D·b‖ are zero for the purpose of the error bound (their digits are noise). */
const SMALLEST_SHARE = 1e-8;

/**
 * The OLS fit behind `ols` and `fitCurve`, on a column-major design: solves, checks the
 * rank, estimates the condition, forms the requested covariance and the summary
 * statistics, and returns the plain result together with the internal QR core (thin Q,
 * R⁻¹) that the diagnostics reuse.
 *
 * Formulas: b by pivoted Householder QR with refinement (least-squares-double.ts), or in
 * double-double when precision is 'double-double', or 'auto' and the estimated forward
 * error u·κ·(1 + κ·‖r‖/(‖X‖‖b‖)) of the double solution exceeds 1e-11
 * (forwardErrorEstimate below): then the κ² term is first removed by refinement with a
 * double-double gradient (gradient-refinement.ts), and the fit is redone in double-double
 * (least-squares-dd.ts) unless u·κ plus the last correction is within 1e-11; RSS = Σe², R² = 1 − RSS/TSS (TSS about the mean when X has a
 * constant column, else about zero, as R's summary.lm), adj R² = 1 − (1 − R²)(n − i)/(n − k)
 * with i = 1 for a centred R² and 0 otherwise, s = √(RSS/(n − k)), t = b/SE, two-sided p
 * from t(n − k); condition κ₁(R) = ‖R‖₁‖R⁻¹‖₁ (within a factor k of κ₂(X)).
 * Reference: Businger & Golub (1965), Numerische Mathematik 7(3), 269–276; Higham, N. J.
 * (2002), Accuracy and Stability of Numerical Algorithms, 2nd ed., SIAM, ch. 20.
 *
 * `ws` (optional): scratch memory (workspace.ts); the returned core's arrays then live in it
 * and are valid only until the caller releases the workspace (the result never aliases it).
 *
 * Throws: EstimationInputError `rank_deficient` (details: rank, k, dependent columns and the
 * columns each depends on), `invalid_argument` (n ≤ k, option errors), `covariance_undefined`.
 *
 * Example: fitLeastSquares({ nRows: 3, nCols: 2, data: Float64Array.from([1,1,1, 1,2,3]) },
 *   Float64Array.from([1, 2, 4])).result.coefficients   // → [-0.6666666666666667, 1.5]
 */
export function fitLeastSquares(
  X: DesignMatrix,
  y: Float64Array,
  options: OlsOptions = {},
  ws?: Workspace,
): { result: OlsResult; core: LeastSquaresCore } {
  const { nRows: n, nCols: k, data, dataLo } = X;
  const names = options.names ? [...options.names] : Array.from({ length: k }, (_, j) => `x${j}`);
  if (names.length !== k) {
    throw new EstimationInputError('invalid_argument', `Got ${names.length} column names for ${k} columns`, {
      reason: 'names',
    });
  }
  if (!(n > k)) {
    throw new EstimationInputError('invalid_argument', `OLS needs more rows than columns (n = ${n}, k = ${k})`, {
      reason: 'too_few_rows',
      n,
      k,
    });
  }
  const tol = options.rankTolerance ?? DEFAULT_RANK_TOLERANCE;
  const precision = options.precision ?? 'auto';
  let core =
    precision === 'double-double'
      ? leastSquaresDoubleDouble(data, y, n, k, tol, dataLo)
      : leastSquaresDouble(data, y, n, k, tol, 3, dataLo, ws);
  if (core.rank < k) throw rankError(core, names);
  let cond = conditionEstimates(core);
  if (precision === 'auto' && !(forwardErrorEstimate(core, cond.scaled) <= FORWARD_ERROR_THRESHOLD)) {
    core = improveOrRefit(core, cond.scaled, data, y, n, k, tol, dataLo);
    if (core.rank < k) throw rankError(core, names);
    cond = conditionEstimates(core);
  }
  const e = core.residuals;
  const q1 = core.q1;
  const leverage = take(ws, n);
  for (let c = 0; c < k; c++) {
    const off = c * n;
    for (let i = 0; i < n; i++) leverage[i] += q1[off + i] * q1[off + i];
  }
  let rss = 0;
  for (let i = 0; i < n; i++) rss += e[i] * e[i];
  const centered = options.centeredRSquared ?? hasConstantColumn(data, n, k);
  let tss = 0;
  if (centered) {
    let mean = 0;
    for (let i = 0; i < n; i++) mean += y[i];
    mean /= n;
    for (let i = 0; i < n; i++) tss += (y[i] - mean) * (y[i] - mean);
  } else {
    for (let i = 0; i < n; i++) tss += y[i] * y[i];
  }
  const df = n - k;
  const rSquared = tss > 0 ? 1 - rss / tss : 0;
  const adjRSquared = 1 - (1 - rSquared) * ((n - (centered ? 1 : 0)) / df);
  const { matrix, info } = robustCovariance(core, e, leverage, options, ws);
  const coefficients = toArray(core.coefficients);
  const covariance: number[][] = [];
  const standardErrors: number[] = [];
  const tStatistics: number[] = [];
  const pValues: number[] = [];
  for (let a = 0; a < k; a++) {
    const row: number[] = new Array(k);
    for (let b = 0; b < k; b++) row[b] = matrix[b * k + a];
    covariance.push(row);
    const se = Math.sqrt(Math.max(0, matrix[a * k + a]));
    standardErrors.push(se);
    const t = coefficients[a] / se;
    tStatistics.push(t);
    pValues.push(twoSidedP(t, df));
  }
  const fitted = new Array<number>(n);
  for (let i = 0; i < n; i++) fitted[i] = y[i] - e[i];
  const result: OlsResult = {
    names,
    coefficients,
    standardErrors,
    tStatistics,
    pValues,
    covariance,
    covarianceInfo: info,
    residuals: toArray(e),
    fitted,
    leverage: toArray(leverage),
    n,
    k,
    df,
    rank: core.rank,
    rss,
    tss,
    rSquared,
    adjRSquared,
    residualStandardError: Math.sqrt(rss / df),
    condition: {
      estimate: cond.raw,
      scaledEstimate: cond.scaled,
      precision: core.precision,
      refinementSteps: core.refinementSteps,
    },
  };
  return { result, core };
}

/**
 * The double solution's estimated error exceeds the threshold: first refine with the
 * gradient in double-double (gradient-refinement.ts), which removes the κ²·‖r‖ term and
 * leaves about u·κ; keep that when u·κ plus the last correction is within the threshold
 * and the refinement contracts (u·κ² < 0.1); otherwise refit in double-double.
 */
function improveOrRefit(
  core: LeastSquaresCore,
  kappa: number,
  data: Float64Array,
  y: Float64Array,
  n: number,
  k: number,
  tol: number,
  dataLo?: Float64Array,
): LeastSquaresCore {
  if (UNIT_ROUNDOFF * kappa * kappa < 0.1) {
    const saved = Float64Array.from(core.coefficients);
    const { steps, lastRelative } = gradientRefinement(data, y, n, k, core, dataLo);
    if (UNIT_ROUNDOFF * kappa + lastRelative <= FORWARD_ERROR_THRESHOLD) {
      compensatedResiduals(data, y, core.coefficients, n, k, core.residuals, dataLo);
      core.refinementSteps += steps;
      return core;
    }
    core.coefficients.set(saved);
  }
  return leastSquaresDoubleDouble(data, y, n, k, tol, dataLo);
}

function hasConstantColumn(data: Float64Array, n: number, k: number): boolean {
  for (let c = 0; c < k; c++) {
    const v = data[c * n];
    if (v === 0) continue;
    let same = true;
    for (let i = 1; i < n && same; i++) same = data[c * n + i] === v;
    if (same) return true;
  }
  return false;
}

function rankError(core: LeastSquaresCore, names: string[]): EstimationInputError {
  const { k, rank, perm, r, columnNorms } = core;
  const dependent: string[] = [];
  const dependsOn: Record<string, string[]> = {};
  const parts: string[] = [];
  for (let c = rank; c < k; c++) {
    const name = names[perm[c]];
    dependent.push(name);
    if (!(columnNorms[c] > 0)) {
      dependsOn[name] = [];
      parts.push(`column '${name}' is all zeros`);
      continue;
    }
    // R11 z = R12(:, c): the column as a combination of the columns chosen before it
    const z = new Float64Array(rank);
    for (let i = rank - 1; i >= 0; i--) {
      let s = r[c * k + i];
      for (let m = i + 1; m < rank; m++) s -= r[m * k + i] * z[m];
      z[i] = s / r[i * k + i];
    }
    const on: string[] = [];
    for (let i = 0; i < rank; i++) if (Math.abs(z[i]) * columnNorms[i] > 1e-6 * columnNorms[c]) on.push(names[perm[i]]);
    on.sort((a, b) => names.indexOf(a) - names.indexOf(b));
    dependsOn[name] = on;
    parts.push(`column '${name}' is a linear combination of ${on.map((s) => `'${s}'`).join(', ')}`);
  }
  return new EstimationInputError(
    'rank_deficient',
    `Design matrix is rank deficient (rank ${rank} of ${k}): ${parts.join('; ')}`,
    { rank, k, dependent, dependsOn },
  );
}
