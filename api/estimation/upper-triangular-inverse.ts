import { take, type Workspace } from './workspace';

/**
 * Inverse of an upper-triangular r × r matrix stored in the upper triangle of a
 * column-major array with leading dimension `ld` (e.g. the R of a QR factorisation).
 *
 * Formula: column-by-column back substitution, U⁻¹ e_j solved for j = 0..r−1; the result
 * is upper triangular, returned column-major r × r (zeros below the diagonal).
 * Reference: Higham, N. J. (2002), Accuracy and Stability of Numerical Algorithms,
 * 2nd ed., SIAM, §14.2 (method 1); forward error ≈ κ(U)·u per entry.
 *
 * Throws: nothing; a zero diagonal entry yields ±Infinity (callers check the rank first).
 *
 * Example:
 *   upperTriangularInverse(Float64Array.from([2, 0, 1, 4]), 2, 2)  // U = [[2,1],[0,4]]
 *   // → Float64Array [0.5, 0, -0.125, 0.25]   i.e. [[0.5, -0.125], [0, 0.25]]
 */
export function upperTriangularInverse(u: Float64Array, r: number, ld: number, ws?: Workspace): Float64Array {
  const inv = take(ws, r * r);
  for (let j = 0; j < r; j++) {
    inv[j * r + j] = 1 / u[j * ld + j];
    for (let i = j - 1; i >= 0; i--) {
      let s = 0;
      for (let m = i + 1; m <= j; m++) s += u[m * ld + i] * inv[j * r + m];
      inv[j * r + i] = -s / u[i * ld + i];
    }
  }
  return inv;
}
