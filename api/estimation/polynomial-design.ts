import { ddMul } from './double-double';
import type { DesignMatrix } from './types';

/**
 * Raw-power polynomial design [1, x, x², …, x^degree] (column-major), with each power
 * computed in double-double so that data + dataLo is x^p to about 32 digits. Rounding
 * x^p to double perturbs a high-degree design by one unit in the last place per entry,
 * which on NIST Filip alone caps any solver at about 7.6 correct digits; keeping the low
 * parts lets the double-double solver reach the digits the data hold.
 *
 * Formula: p_0 = 1, p_j = p_{j−1} · x in double-double (ddMul).
 * Reference: Dekker (1971), Numerische Mathematik 18(3), 224–242.
 *
 * Throws: nothing (non-finite x propagate; ols rejects them).
 *
 * Example:
 *   polynomialDesign([0.1, 2], 2).data    // → Float64Array [1, 1, 0.1, 2, 0.010000000000000002, 4]
 *   polynomialDesign([0.1, 2], 2).dataLo  // → Float64Array [0, 0, 0, 0, -8.326672684688674e-19, 0]
 */
export function polynomialDesign(x: ArrayLike<number>, degree: number, intercept = true): DesignMatrix {
  const n = x.length;
  const first = intercept ? 0 : 1;
  const k = degree + 1 - first;
  const data = new Float64Array(n * k);
  const dataLo = new Float64Array(n * k);
  for (let i = 0; i < n; i++) {
    let ph = 1,
      pl = 0;
    for (let p = 0; p <= degree; p++) {
      if (p > 0) [ph, pl] = ddMul(ph, pl, x[i], 0);
      if (p >= first) {
        data[(p - first) * n + i] = ph;
        dataLo[(p - first) * n + i] = pl;
      }
    }
  }
  return { nRows: n, nCols: k, data, dataLo };
}
