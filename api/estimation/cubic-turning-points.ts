import { realPolynomialRoots } from './real-polynomial-roots';

/**
 * Turning points of the cubic y = b0 + b1·x + b2·x² + b3·x³ with delta-method standard errors.
 *
 * Formula: real roots of s(x) = b1 + 2·b2·x + 3·b3·x² (none, one or two); a root is a peak
 * when s′(x) = 2·b2 + 6·b3·x < 0, a trough when > 0 (a double root, s′ = 0, is an
 * inflection and is not returned). Delta gradient by the implicit function rule:
 * ∂x* / ∂(b1, b2, b3) = −(1, 2x*, 3x*²)/s′(x*); Var(x*) ≈ gᵀ V g with V the 3 × 3 block of
 * (b1, b2, b3). The roots are found with x scaled by `scale` (the largest |x| of the data;
 * real-polynomial-roots.ts), so a small b3 in large units is never taken for zero. With b3 = 0 this is the quadratic case (turning-point.ts).
 * Reference: the implicit function theorem with the delta method (Oehlert 1992, The
 * American Statistician 46(1), 27–29).
 *
 * Throws: nothing; `se` is null when the variance is not a positive finite number.
 *
 * Example:
 *   cubicTurningPoints(-3, 0, 1, identity3)   // s(x) = −3 + 3x² → roots ±1
 *   // → [{ x: -1, kind: 'peak', … }, { x: 1, kind: 'trough', … }]
 */
export function cubicTurningPoints(
  b1: number,
  b2: number,
  b3: number,
  v: ReadonlyArray<ArrayLike<number>>,
  scale?: number,
): Array<{ x: number; kind: 'peak' | 'trough'; gradient: [number, number, number]; se: number | null }> {
  const roots = realPolynomialRoots([b1, 2 * b2, 3 * b3], scale);
  const out: Array<{ x: number; kind: 'peak' | 'trough'; gradient: [number, number, number]; se: number | null }> = [];
  for (const x of roots) {
    const ds = 2 * b2 + 6 * b3 * x;
    if (ds === 0 || !Number.isFinite(x)) continue;
    const g: [number, number, number] = [-1 / ds, (-2 * x) / ds, (-3 * x * x) / ds];
    let s = 0;
    for (let a = 0; a < 3; a++) for (let b = 0; b < 3; b++) s += g[a] * v[a][b] * g[b];
    out.push({
      x,
      kind: ds < 0 ? 'peak' : 'trough',
      gradient: g,
      se: s >= 0 && Number.isFinite(s) ? Math.sqrt(s) : null,
    });
  }
  return out;
}
