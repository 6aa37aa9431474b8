import { realPolynomialRoots } from './real-polynomial-roots';
import type { FiellerSet, SetPiece } from './types';

/**
 * Fieller-type confidence set for a turning point of a cubic, and the part of it that
 * belongs to one turning point.
 *
 * Formula: with s(θ) = b1 + 2·b2·θ + 3·b3·θ² and a(θ) = (1, 2θ, 3θ²), the set
 * {θ : s(θ)² ≤ c²·a(θ)ᵀ V a(θ)} is {q ≤ 0} for the quartic
 * q(θ) = s(θ)² − c²·a(θ)ᵀVa(θ), whose coefficients are
 * [b1² − c²V11, 4b1b2 − 4c²V12, 4b2² + 6b1b3 − c²(4V22 + 6V13), 12b2b3 − 12c²V23, 9b3² − 9c²V33];
 * its real roots (real-polynomial-roots.ts) split the line and the sign of q between them
 * gives the pieces. For the turning point at x*, `kind` describes the set as seen from x*:
 * 'bounded' with [lo, hi] the piece that contains x* when that piece is bounded; otherwise
 * 'whole_line' when the set is all of ℝ, or 'two_rays' with lo = the end of the ray from −∞
 * and hi = the start of the ray to +∞ (null where there is no such ray). `pieces` lists the
 * whole set. The variable is scaled by `scale` (the largest |x| of the data; default |x*|)
 * before the roots are found, so the set does not depend on the units of x; pieces that
 * touch within PIECE_TOLERANCE·scale are merged. The set always contains x* in exact
 * arithmetic (q(x*) = −c²·Var s(x*) ≤ 0); `containsTurningPoint: false` reports a
 * numerical failure, which the caller must not print as an interval.
 * Reference: Fieller, E. C. (1954), Journal of the Royal Statistical Society B 16(2),
 * 175–185, applied to the root of s(θ) (a linear-in-b condition at each θ).
 *
 * Throws: nothing.
 *
 * Example: b = (−3, 0, 1) with a small V: two bounded pieces, one around −1 and one around +1
 *   cubicFieller(-3, 0, 1, 0.001·I, 1.96, 1)
 *   // → { kind: 'bounded', lo: 0.96287…, hi: 1.04034…, pieces: [[−1.0403, −0.9629], [0.9629, 1.0403]] }
 */
export function cubicFieller(
  b1: number,
  b2: number,
  b3: number,
  v: ReadonlyArray<ArrayLike<number>>,
  c: number,
  xStar: number,
  scale?: number,
): FiellerSet {
  const c2 = c * c;
  const q = [
    b1 * b1 - c2 * v[0][0],
    4 * b1 * b2 - 4 * c2 * v[0][1],
    4 * b2 * b2 + 6 * b1 * b3 - c2 * (4 * v[1][1] + 6 * v[0][2]),
    12 * b2 * b3 - 12 * c2 * v[1][2],
    9 * b3 * b3 - 9 * c2 * v[2][2],
  ];
  const qAt = (x: number): number => (((q[4] * x + q[3]) * x + q[2]) * x + q[1]) * x + q[0];
  const s =
    scale !== undefined && scale > 0 && Number.isFinite(scale) ? scale : Math.max(Math.abs(xStar), Number.MIN_VALUE);
  const tol = PIECE_TOLERANCE * s;
  const roots = realPolynomialRoots(q, s);
  const edges: Array<number | null> = [null, ...roots, null];
  const pieces: SetPiece[] = [];
  for (let j = 0; j + 1 < edges.length; j++) {
    const lo = edges[j],
      hi = edges[j + 1];
    const probe =
      lo === null && hi === null
        ? 0
        : lo === null
          ? (hi as number) - s - Math.abs(hi as number)
          : hi === null
            ? lo + s + Math.abs(lo)
            : 0.5 * (lo + hi);
    if (qAt(probe) <= 0) {
      const last = pieces[pieces.length - 1];
      if (last && last.hi !== null && lo !== null && lo - last.hi <= tol) last.hi = hi;
      else pieces.push({ lo, hi });
    }
  }
  if (pieces.length === 1 && pieces[0].lo === null && pieces[0].hi === null) {
    return { kind: 'whole_line', lo: null, hi: null, pieces, containsTurningPoint: true };
  }
  const own = pieces.find((p) => (p.lo === null || p.lo - tol <= xStar) && (p.hi === null || xStar <= p.hi + tol));
  if (!own) return { kind: 'two_rays', lo: null, hi: null, pieces, containsTurningPoint: false };
  if (own.lo !== null && own.hi !== null)
    return { kind: 'bounded', lo: own.lo, hi: own.hi, pieces, containsTurningPoint: true };
  const left = pieces.find((p) => p.lo === null);
  const right = pieces.find((p) => p.hi === null);
  return {
    kind: 'two_rays',
    lo: left ? left.hi : null,
    hi: right ? right.lo : null,
    pieces,
    containsTurningPoint: true,
  };
}

/**
 * Relative tolerance (times the x scale) within which two pieces of the set that touch are
 * merged and x* counts as inside a piece: the quartic's roots are found to about 1e-15 of
 * the scale, so 1e-12 absorbs their rounding and nothing wider.
 */
export const PIECE_TOLERANCE = 1e-12;
