/**
 * The "meat" of a heteroskedasticity-consistent sandwich in Q₁ coordinates:
 * M = Σ_i ω_i · e_i² · q_i q_iᵀ, with q_i the i-th row of the thin Q of X (so that
 * x_i = R·Pᵀ·q_i and (XᵀX)⁻¹x_i e_i = P·R⁻¹·q_i e_i).
 *
 * Formula: HC0 ω_i = 1; HC1 ω_i = n/(n−k); HC3 ω_i = 1/(1 − h_i)² with h_i = ‖q_i‖².
 * Reference: White, H. (1980), "A heteroskedasticity-consistent covariance matrix
 * estimator and a direct test for heteroskedasticity", Econometrica 48(4), 817–838 (HC0);
 * MacKinnon, J. G. and White, H. (1985), "Some heteroskedasticity-consistent covariance
 * matrix estimators with improved finite sample properties", Journal of Econometrics
 * 29(3), 305–325 (HC1, HC3).
 *
 * Throws: EstimationInputError `covariance_undefined` for HC3 when some 1 − h_i ≤
 * LEVERAGE_MARGIN·k (h_i = ‖q_i‖² carries a rounding error of about k·u, so a smaller
 * 1 − h_i is not known to even one digit and the row counts as fitted exactly; with the
 * margin 1e-9·k the weight 1/(1 − h_i)² keeps about six digits or more); details name the row.
 *
 * Example: n = 2, k = 1, q = (1/√2, 1/√2), e = (1, −1):
 *   heteroskedasticMeat(q, e, h = (0.5, 0.5), 2, 1, 'hc0')  // → [1.0000000000000002]   (0.5·1 + 0.5·1)
 *   heteroskedasticMeat(q, e, h, 2, 1, 'hc3')               // → [4.000000000000001]
 */
import { EstimationInputError } from './errors';
import { take, type Workspace } from './workspace';

/** Per-column margin below which 1 − h_i is treated as zero for HC3 (see above). */
export const LEVERAGE_MARGIN = 1e-9;

export function heteroskedasticMeat(
  q1: Float64Array,
  e: ArrayLike<number>,
  leverage: ArrayLike<number>,
  n: number,
  k: number,
  type: 'hc0' | 'hc1' | 'hc3',
  ws?: Workspace,
): Float64Array {
  const m = take(ws, k * k);
  const hc1 = n / (n - k);
  for (let i = 0; i < n; i++) {
    let w = e[i] * e[i];
    if (type === 'hc1') w *= hc1;
    else if (type === 'hc3') {
      const h = leverage[i];
      if (!(1 - h > LEVERAGE_MARGIN * k)) {
        throw new EstimationInputError(
          'covariance_undefined',
          `HC3 covariance is undefined: row ${i} has leverage ${h} (fitted exactly)`,
          { row: i, leverage: h },
        );
      }
      w /= (1 - h) * (1 - h);
    }
    for (let a = 0; a < k; a++) {
      const wa = w * q1[a * n + i];
      for (let b = a; b < k; b++) m[b * k + a] += wa * q1[b * n + i];
    }
  }
  for (let a = 0; a < k; a++) for (let b = a + 1; b < k; b++) m[a * k + b] = m[b * k + a];
  return m;
}
