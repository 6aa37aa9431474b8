import type { QrFactorisation } from './qr';
import { take, type Workspace } from './workspace';

/**
 * Forms the thin orthonormal factor Q₁ (n × rank, column-major) of a pivoted Householder
 * QR: Q₁ = H_0·H_1···H_{r−1}·[I_r; 0].
 *
 * Formula: backward accumulation of the reflectors (LAPACK dorg2r), so that Q₁ is
 * orthonormal to working precision whatever the conditioning of A. Row i of Q₁ gives
 * the leverage h_i = ‖q_i‖² and, since x_i = R·Pᵀ applied to q_i, every score of the
 * regression can be written in Q₁ coordinates (see robust-covariance.ts).
 * Reference: Golub & Van Loan (2013), Matrix Computations, 4th ed., §5.1.6.
 *
 * Throws: nothing.
 *
 * Example: for the 3×2 matrix with columns (1,1,1) and (1,2,3),
 *   thinQ(pivotedQr(a, 3, 2))  // → column 0 = −(1,1,1)/√3, column 1 = (0.7071…, 0, −0.7071…) up to sign
 */
export function thinQ(f: QrFactorisation, ws?: Workspace): Float64Array {
  const { n, qr, tau, rank: r } = f;
  const q = take(ws, n * r);
  for (let c = 0; c < r; c++) q[c * n + c] = 1;
  for (let j = r - 1; j >= 0; j--) {
    const tj = tau[j];
    if (tj === 0) continue;
    const oj = j * n;
    for (let c = j; c < r; c++) {
      const oc = c * n;
      let w = q[oc + j];
      for (let i = j + 1; i < n; i++) w += qr[oj + i] * q[oc + i];
      w *= tj;
      q[oc + j] -= w;
      for (let i = j + 1; i < n; i++) q[oc + i] -= w * qr[oj + i];
    }
  }
  return q;
}
