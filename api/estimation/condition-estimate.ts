import type { LeastSquaresCore } from './types';

/**
 * Condition estimates of the design from its QR factors: κ₁(R) = ‖R‖₁·‖R⁻¹‖₁ and the same
 * for the column-equilibrated R·D⁻¹ (D = the original column norms), which is what limits
 * the accuracy of a column-pivoted Householder solve.
 *
 * Formula: 1-norms are the largest absolute column sums; (R·D⁻¹)⁻¹ = D·R⁻¹. κ₁(R) is within
 * a factor k of κ₂(X) = κ₂(R).
 * Reference: Higham, N. J. (2002), Accuracy and Stability of Numerical Algorithms, 2nd ed.,
 * SIAM, §7.2 and §19.4 (column scaling and Householder QR).
 *
 * Throws: nothing; needs core.r and core.rinv (full rank).
 *
 * Example: R = [[2, 1], [0, 4]], R⁻¹ = [[0.5, −0.125], [0, 0.25]], unit column norms
 *   // → { raw: 5 · 0.5 = 2.5, scaled: 2.5 }
 */
export function conditionEstimates(core: Pick<LeastSquaresCore, 'k' | 'r' | 'rinv' | 'columnNorms'>): {
  raw: number;
  scaled: number;
} {
  const { k, r, rinv, columnNorms } = core;
  let rn = 0,
    rsn = 0,
    in1 = 0,
    isn = 0;
  for (let c = 0; c < k; c++) {
    let s = 0,
      ss = 0,
      t = 0,
      ts = 0;
    for (let i = 0; i <= c; i++) {
      s += Math.abs(r[c * k + i]);
      ss += Math.abs(r[c * k + i]) / columnNorms[c];
      t += Math.abs(rinv[c * k + i]);
      ts += Math.abs(rinv[c * k + i]) * columnNorms[i];
    }
    rn = Math.max(rn, s);
    rsn = Math.max(rsn, ss);
    in1 = Math.max(in1, t);
    isn = Math.max(isn, ts);
  }
  return { raw: rn * in1, scaled: rsn * isn };
}
