/**
 * Eigenvalues of a real symmetric matrix (column-major n × n, only the lower triangle read),
 * ascending.
 *
 * Formula: Householder reduction to tridiagonal form, then the implicit QL algorithm with
 * Wilkinson shifts (eigenvalues only), as in the EISPACK routines tred1/tql1.
 * Reference: Martin, R. S., Reinsch, C. and Wilkinson, J. H. (1968), "Householder's
 * tridiagonalization of a symmetric matrix", Numerische Mathematik 11(3), 181–195; Bowdler,
 * H., Martin, R. S., Reinsch, C. and Wilkinson, J. H. (1968), "The QR and QL algorithms for
 * symmetric matrices", Numerische Mathematik 11(4), 293–306.
 *
 * Throws: nothing; returns NaNs if QL fails to converge in 60 iterations per eigenvalue
 * (not seen for symmetric input).
 *
 * Example:
 *   symmetricEigenvalues(Float64Array.from([2, 1, 1, 2]), 2)   // → [1, 3]
 */
export function symmetricEigenvalues(matrix: Float64Array, n: number): number[] {
  const a: number[][] = [];
  for (let i = 0; i < n; i++) {
    const row = new Array<number>(n);
    for (let j = 0; j < n; j++) row[j] = i >= j ? matrix[j * n + i] : matrix[i * n + j];
    a.push(row);
  }
  const d = new Array<number>(n).fill(0);
  const e = new Array<number>(n).fill(0);
  // tridiagonalisation (tred2 without accumulating transformations)
  for (let i = n - 1; i > 0; i--) {
    const l = i - 1;
    let h = 0;
    if (l > 0) {
      let scale = 0;
      for (let k = 0; k <= l; k++) scale += Math.abs(a[i][k]);
      if (scale === 0) e[i] = a[i][l];
      else {
        for (let k = 0; k <= l; k++) {
          a[i][k] /= scale;
          h += a[i][k] * a[i][k];
        }
        let f = a[i][l];
        const g = f >= 0 ? -Math.sqrt(h) : Math.sqrt(h);
        e[i] = scale * g;
        h -= f * g;
        a[i][l] = f - g;
        f = 0;
        for (let j = 0; j <= l; j++) {
          let gg = 0;
          for (let k = 0; k <= j; k++) gg += a[j][k] * a[i][k];
          for (let k = j + 1; k <= l; k++) gg += a[k][j] * a[i][k];
          e[j] = gg / h;
          f += e[j] * a[i][j];
        }
        const hh = f / (h + h);
        for (let j = 0; j <= l; j++) {
          const ff = a[i][j];
          const gg = e[j] - hh * ff;
          e[j] = gg;
          for (let k = 0; k <= j; k++) a[j][k] -= ff * e[k] + gg * a[i][k];
        }
      }
    } else e[i] = a[i][l];
    d[i] = h;
  }
  for (let i = 0; i < n; i++) d[i] = a[i][i];
  // implicit QL on the tridiagonal (d diagonal, e sub-diagonal)
  for (let i = 1; i < n; i++) e[i - 1] = e[i];
  e[n - 1] = 0;
  for (let l = 0; l < n; l++) {
    let iter = 0;
    let m: number;
    do {
      for (m = l; m < n - 1; m++) {
        const dd = Math.abs(d[m]) + Math.abs(d[m + 1]);
        if (Math.abs(e[m]) <= Number.EPSILON * dd) break;
      }
      if (m !== l) {
        if (iter++ === 60) return new Array<number>(n).fill(NaN);
        let g = (d[l + 1] - d[l]) / (2 * e[l]);
        let r = Math.hypot(g, 1);
        g = d[m] - d[l] + e[l] / (g + (g >= 0 ? Math.abs(r) : -Math.abs(r)));
        let s = 1,
          c = 1,
          p = 0;
        let i: number;
        for (i = m - 1; i >= l; i--) {
          let f = s * e[i];
          const b = c * e[i];
          r = Math.hypot(f, g);
          e[i + 1] = r;
          if (r === 0) {
            d[i + 1] -= p;
            e[m] = 0;
            break;
          }
          s = f / r;
          c = g / r;
          g = d[i + 1] - p;
          r = (d[i] - g) * s + 2 * c * b;
          p = s * r;
          d[i + 1] = g + p;
          g = c * r - b;
          f = 0;
        }
        if (r === 0 && i >= l) continue;
        d[l] -= p;
        e[l] = g;
        e[m] = 0;
      }
    } while (m !== l);
  }
  return d.sort((x, y) => x - y);
}
