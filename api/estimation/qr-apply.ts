import type { QrFactorisation } from './qr';

/**
 * Applies Qᵀ = H_{r−1}···H_1·H_0 of a pivoted Householder QR (see qr.ts) to a vector, in
 * place: v ← Qᵀ·v, using only the first `rank` reflectors.
 *
 * Formula: H_j·v = v − τ_j·u_j·(u_jᵀv) with u_j = (0,…,0, 1, qr(j+1:n, j)).
 * Reference: Golub, G. H. and Van Loan, C. F. (2013), Matrix Computations, 4th ed.,
 * Johns Hopkins University Press, §5.1.
 *
 * Throws: nothing; v must have length n.
 *
 * Example: with f = pivotedQr([1,1,1, 1,2,3], 3, 2) and v = [1,2,3] (the second column),
 *   applyQt(f, v)  // v → [-3.4641016151377544, -1.414213562373095, 0] (‖v‖ kept)
 */
export function applyQt(f: QrFactorisation, v: Float64Array, offset = 0): void {
  const { n, qr, tau, rank } = f;
  for (let j = 0; j < rank; j++) {
    const tj = tau[j];
    if (tj === 0) continue;
    const oj = j * n;
    let w = v[offset + j];
    for (let i = j + 1; i < n; i++) w += qr[oj + i] * v[offset + i];
    w *= tj;
    v[offset + j] -= w;
    for (let i = j + 1; i < n; i++) v[offset + i] -= w * qr[oj + i];
  }
}
