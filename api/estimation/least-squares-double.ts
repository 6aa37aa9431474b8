import { applyQt } from './qr-apply';
import { compensatedResiduals } from './compensated-residuals';
import { conditionEstimates } from './condition-estimate';
import { pivotedQr, type QrFactorisation } from './qr';
import { thinQ } from './thin-q';
import type { LeastSquaresCore } from './types';
import { upperTriangularInverse } from './upper-triangular-inverse';
import { take, type Workspace } from './workspace';

/**
 * Least squares min ‖y − Xb‖ in double precision: pivoted Householder QR (qr.ts), then
 * iterative refinement with residuals computed in twice the working precision.
 *
 * Formula: b₀ = P·R⁻¹·(Qᵀy)(0:k); repeat e = y − X·b (compensated, see
 * compensated-residuals.ts), δ = P·R⁻¹·(Qᵀe)(0:k), b ← b + δ, until ‖δ‖∞ ≤ 2⁻⁵³‖b‖∞ or
 * `maxRefinement` steps, or until a correction is not at most half the previous one
 * (the rounding level is reached). Each step removes the rounding error of the triangular solve and
 * of Qᵀy; the final residuals are the compensated ones for the final b. (XᵀX)⁻¹ is formed
 * as P·R⁻¹R⁻ᵀ·Pᵀ, never from XᵀX.
 * Reference: Golub, G. H. and Wilkinson, J. H. (1966), "Note on the iterative refinement of
 * least squares solution", Numerische Mathematik 9(2), 139–148; Businger & Golub (1965).
 *
 * `xLo` (optional) are low-order parts of a double-double design, used in the residuals;
 * `ws` (optional) supplies scratch memory (workspace.ts).
 *
 * Throws: nothing; rank < k is reported in the result (R, pivots) for the caller to name.
 *
 * Example: on NIST Longley (16 × 7, κ ≈ 4.9e9) the coefficients agree with the certified
 * values to about 15 digits (tests/reference/nist.test.ts).
 */
export function leastSquaresDouble(
  x: Float64Array,
  y: Float64Array,
  n: number,
  k: number,
  rankTolerance: number,
  maxRefinement = 3,
  xLo?: Float64Array,
  ws?: Workspace,
): LeastSquaresCore {
  const a = take(ws, n * k);
  a.set(x);
  const f = pivotedQr(a, n, k, rankTolerance);
  const { rank, perm } = f;
  const rDiagonal = new Float64Array(rank);
  for (let j = 0; j < rank; j++) rDiagonal[j] = a[j * n + j];
  const r = take(ws, k * k);
  for (let c = 0; c < k; c++) for (let i = 0; i <= Math.min(c, rank - 1); i++) r[c * k + i] = a[c * n + i];
  const core: LeastSquaresCore = {
    n,
    k,
    rank,
    perm,
    columnNorms: f.columnNorms,
    relativePivots: f.relativePivots,
    precision: 'double',
    refinementSteps: 0,
    coefficients: new Float64Array(k),
    residuals: take(ws, n),
    q1: EMPTY,
    rinv: EMPTY,
    xtxInv: EMPTY,
    rDiagonal,
    r,
  };
  if (rank < k) return core;
  const rinv = upperTriangularInverse(a, k, n, ws);
  const work = take(ws, n);
  work.set(y);
  const z = new Float64Array(k);
  const b = core.coefficients;
  solveStep(f, rinv, work, z, b, false);
  const e = core.residuals;
  compensatedResiduals(x, y, b, n, k, e, xLo);
  // refinement contracts errors by about κ·u per step: stop when the next correction is
  // predicted to fall below the last bit, or when corrections stop shrinking
  const contraction = Math.max(
    conditionEstimates({ k, r, rinv, columnNorms: f.columnNorms }).scaled * 1.1102230246251565e-16,
    1e-16,
  );
  let previous = Infinity;
  for (let step = 0; step < maxRefinement; step++) {
    work.set(e);
    const maxDelta = solveStep(f, rinv, work, z, b, true);
    core.refinementSteps = step + 1;
    compensatedResiduals(x, y, b, n, k, e, xLo);
    let maxB = 0;
    for (let c = 0; c < k; c++) if (Math.abs(b[c]) > maxB) maxB = Math.abs(b[c]);
    const ulp = 1.1102230246251565e-16 * maxB;
    if (!(maxDelta > ulp) || maxDelta * contraction * 4 < ulp || maxDelta > 0.5 * previous) break;
    previous = maxDelta;
  }
  const xtx = take(ws, k * k);
  for (let p = 0; p < k; p++) {
    for (let q = p; q < k; q++) {
      let s = 0;
      for (let m = q; m < k; m++) s += rinv[m * k + p] * rinv[m * k + q];
      xtx[perm[p] * k + perm[q]] = s;
      xtx[perm[q] * k + perm[p]] = s;
    }
  }
  core.rinv = rinv;
  core.xtxInv = xtx;
  core.q1 = thinQ(f, ws);
  return core;
}

const EMPTY = new Float64Array(0);

/** target (±)= P·R⁻¹·(Qᵀ·work)(0:k); returns max |correction|. */
function solveStep(
  f: QrFactorisation,
  rinv: Float64Array,
  work: Float64Array,
  z: Float64Array,
  target: Float64Array,
  add: boolean,
): number {
  const { k, perm } = f;
  applyQt(f, work);
  let maxDelta = 0;
  for (let i = 0; i < k; i++) {
    let s = 0;
    for (let m = i; m < k; m++) s += rinv[m * k + i] * work[m];
    z[i] = s;
  }
  for (let i = 0; i < k; i++) {
    const d = z[i];
    if (add) target[perm[i]] += d;
    else target[perm[i]] = d;
    if (Math.abs(d) > maxDelta) maxDelta = Math.abs(d);
  }
  return maxDelta;
}
