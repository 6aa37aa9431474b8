import { EstimationInputError } from './errors';
import { fitLeastSquares } from './fit-least-squares';
import type { DesignMatrix, OlsOptions, OlsResult } from './types';

/**
 * Ordinary least squares of y on the full design X (the caller includes the column of ones).
 *
 * Formula: b = argmin ‖y − Xb‖² by Householder QR with column pivoting and iterative
 * refinement with compensated residuals (double-double throughout when X is very ill
 * conditioned); never the normal equations. Covariance per `options.covariance`:
 * 'classical' s²(XᵀX)⁻¹; 'hc0', 'hc1' (n/(n−k)), 'hc3'; 'newey_west' (Bartlett, `lag`
 * default floor(4(n/100)^(2/9)), factor n/(n−k)); 'cluster' (`clusters` labels, factor
 * `clusterAdjustment`, default N/(N−k)). See robust-covariance.ts for each formula.
 * References: Businger, P. and Golub, G. H. (1965), Numerische Mathematik 7(3), 269–276;
 * Golub, G. H. and Wilkinson, J. H. (1966), Numerische Mathematik 9(2), 139–148;
 * MacKinnon & White (1985), Journal of Econometrics 29(3), 305–325; Newey & West (1987),
 * Econometrica 55(3), 703–708.
 *
 * Input: X as rows (`number[][]`, n × k) or a column-major `DesignMatrix`; y of length n.
 * Output (plain data, column order of X): coefficients, standardErrors, tStatistics,
 * pValues, covariance (k × k), covarianceInfo, residuals, fitted, leverage, n, k, df, rank,
 * rss, tss, rSquared, adjRSquared, residualStandardError, condition.
 *
 * Throws: EstimationInputError — `non_finite_value` (details: row, column), `invalid_argument`
 * (ragged rows, length mismatch, n ≤ k, bad options), `rank_deficient` (names the dependent
 * columns and those they depend on), `covariance_undefined`.
 *
 * Example:
 *   ols([[1, 1], [1, 2], [1, 3]], [1, 2, 4]).coefficients      // → [-0.6666666666666667, 1.5]
 *   ols([[1, 1, 2], [1, 2, 4], [1, 3, 6], [1, 4, 8]], [1, 2, 4, 5], { names: ['const', 'a', 'b'] })
 *   // throws rank_deficient: "Design matrix is rank deficient (rank 2 of 3): column 'b' is a
 *   //   linear combination of 'a'", details { rank: 2, k: 3, dependent: ['b'], dependsOn: { b: ['a'] } }
 */
export function ols(
  X: ReadonlyArray<ReadonlyArray<number>> | DesignMatrix,
  y: ArrayLike<number>,
  options: OlsOptions = {},
): OlsResult {
  const design = toDesign(X);
  const n = design.nRows;
  if (y.length !== n) {
    throw new EstimationInputError('invalid_argument', `y has ${y.length} values for ${n} rows of X`, {
      reason: 'length_mismatch',
    });
  }
  const yy = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const v = y[i];
    if (typeof v !== 'number' || !Number.isFinite(v)) {
      throw new EstimationInputError('non_finite_value', `y[${i}] is not a finite number`, {
        row: i,
        column: 'y',
        value: String(v),
      });
    }
    yy[i] = v;
  }
  const names = options.names;
  for (let c = 0; c < design.nCols; c++) {
    for (let i = 0; i < n; i++) {
      const v = design.data[c * n + i];
      if (!Number.isFinite(v)) {
        const column = names?.[c] ?? `x${c}`;
        throw new EstimationInputError('non_finite_value', `X[${i}][${c}] (${column}) is not a finite number`, {
          row: i,
          column,
          value: String(v),
        });
      }
    }
  }
  return fitLeastSquares(design, yy, options).result;
}

function toDesign(X: ReadonlyArray<ReadonlyArray<number>> | DesignMatrix): DesignMatrix {
  if (!Array.isArray(X)) {
    const d = X as DesignMatrix;
    if (!(d.data instanceof Float64Array) || d.data.length !== d.nRows * d.nCols) {
      throw new EstimationInputError(
        'invalid_argument',
        'DesignMatrix data must be a Float64Array of nRows·nCols values',
        { reason: 'design' },
      );
    }
    if (
      d.dataLo !== undefined &&
      (!(d.dataLo instanceof Float64Array) || d.dataLo.length !== d.data.length || !d.dataLo.every(Number.isFinite))
    ) {
      throw new EstimationInputError(
        'invalid_argument',
        'DesignMatrix dataLo must be a finite Float64Array of the same length as data',
        { reason: 'design' },
      );
    }
    return d;
  }
  const rows = X as ReadonlyArray<ReadonlyArray<number>>;
  const n = rows.length;
  const k = n > 0 ? rows[0].length : 0;
  const data = new Float64Array(n * k);
  for (let i = 0; i < n; i++) {
    const row = rows[i];
    if (!row || row.length !== k) {
      throw new EstimationInputError(
        'invalid_argument',
        `Row ${i} of X has ${row ? row.length : 0} values, expected ${k}`,
        { reason: 'ragged', row: i },
      );
    }
    for (let c = 0; c < k; c++) {
      const v = row[c];
      data[c * n + i] = typeof v === 'number' ? v : NaN;
    }
  }
  return { nRows: n, nCols: k, data };
}
