/**
 * Real roots of a polynomial of degree ≤ 4 (coefficients in increasing powers), sorted.
 *
 * Formula: degree 1 and 2 in closed form (quadratic by the cancellation-free
 * q = −(b + sign(b)√D)/2); degree ≥ 3 by isolation: the real roots of p′ (recursively) split
 * the line into intervals on which p is monotone, bounded by Cauchy's bound
 * 1 + max|a_i/a_d|; each interval with a sign change holds one root, found by bisection to
 * the last bit. A critical point where p vanishes exactly is returned as a (double) root.
 * Leading coefficients below 1e-14 of the largest are treated as zero.
 * Reference: Cauchy's root bound and Rolle's theorem, e.g. Press, W. H. et al. (2007),
 * Numerical Recipes, 3rd ed., Cambridge University Press, §9.5.
 *
 * Throws: nothing; the zero polynomial has no isolated roots and gives [].
 *
 * Example:
 *   realPolynomialRoots([-6, 11, -6, 1])  // (x−1)(x−2)(x−3) → [1, 2, 3] (to the last bit)
 *   realPolynomialRoots([1, 0, 1])        // x² + 1 → []
 */
export function realPolynomialRoots(coefficients: ReadonlyArray<number>): number[] {
  const a = [...coefficients];
  const big = Math.max(...a.map(Math.abs));
  if (!(big > 0)) return [];
  while (a.length > 1 && Math.abs(a[a.length - 1]) <= 1e-14 * big) a.pop();
  const d = a.length - 1;
  if (d <= 0) return [];
  if (d === 1) return [-a[0] / a[1]];
  if (d === 2) {
    const [c0, c1, c2] = a;
    const D = c1 * c1 - 4 * c2 * c0;
    if (D < 0) return [];
    const s = Math.sqrt(D);
    const q = -0.5 * (c1 + (c1 >= 0 ? s : -s));
    if (q === 0) return [0, 0];
    const r = [q / c2, c0 / q].sort((x, y) => x - y);
    return r;
  }
  const p = (x: number): number => { let v = 0; for (let i = d; i >= 0; i--) v = v * x + a[i]; return v; };
  const deriv = a.slice(1).map((c, i) => c * (i + 1));
  const crit = realPolynomialRoots(deriv);
  let bound = 0;
  for (let i = 0; i < d; i++) bound = Math.max(bound, Math.abs(a[i] / a[d]));
  bound += 1;
  const edges = [-bound, ...crit.filter((c) => c > -bound && c < bound), bound];
  const roots: number[] = [];
  for (let j = 0; j + 1 < edges.length; j++) {
    let lo = edges[j], hi = edges[j + 1];
    const plo = p(lo), phi = p(hi);
    if (plo === 0) { if (j > 0 && roots[roots.length - 1] !== lo) roots.push(lo); continue; }
    if (phi === 0) { roots.push(hi); continue; }
    if ((plo < 0) === (phi < 0)) continue;
    const neg = plo < 0;
    for (let it = 0; it < 2000; it++) {
      const mid = 0.5 * (lo + hi);
      if (mid <= lo || mid >= hi) break;
      const pm = p(mid);
      if (pm === 0) { lo = hi = mid; break; }
      if ((pm < 0) === neg) lo = mid; else hi = mid;
    }
    roots.push(Math.abs(p(lo)) <= Math.abs(p(hi)) ? lo : hi);
  }
  return [...new Set(roots)].sort((x, y) => x - y);
}
