/**
 * Real roots of a polynomial of degree ≤ 4 (coefficients in increasing powers), sorted.
 *
 * Formula: the variable is first scaled, x = s·t with s a power of two (exact, so no
 * rounding is added): the caller's `scale` (e.g. the largest |x| of the data) or, without
 * one, the root-size estimate max_i |a_i/a_d|^(1/(d−i)) (Fujiwara's bound without its
 * factor 2); the roots of Σ a_i s^i t^i are found and multiplied back by s. Both choices
 * follow the units of x, so the roots do not depend on them. Only coefficients that are
 * exactly zero lower the degree: a small leading coefficient is a far root, never dropped.
 * Degree 1 and 2 in closed form (quadratic by the cancellation-free
 * q = −(b + sign(b)√D)/2); degree ≥ 3 by isolation: the real roots of p′ (recursively) split
 * the line into intervals on which p is monotone, bounded by Cauchy's bound
 * 1 + max|a_i/a_d|; each interval with a sign change holds one root, found by bisection to
 * the last bit. A critical point where p vanishes exactly is returned as a (double) root.
 * Reference: Cauchy's root bound and Rolle's theorem, e.g. Press, W. H. et al. (2007),
 * Numerical Recipes, 3rd ed., Cambridge University Press, §9.5; Fujiwara, M. (1916),
 * Tohoku Mathematical Journal 10, 167–171 (the root-size estimate).
 *
 * Throws: nothing; the zero polynomial has no isolated roots and gives [].
 *
 * Example:
 *   realPolynomialRoots([-6, 11, -6, 1])  // (x−1)(x−2)(x−3) → [1, 2, 3] (to the last bit)
 *   realPolynomialRoots([1, 0, 1])        // x² + 1 → []
 *   realPolynomialRoots([2, 1e-20])       // → [-2e20] (a tiny leading term is kept)
 */
export function realPolynomialRoots(coefficients: ReadonlyArray<number>, scale?: number): number[] {
  const a = [...coefficients];
  while (a.length > 1 && a[a.length - 1] === 0) a.pop();
  const d = a.length - 1;
  if (d <= 0) return [];
  let s = scale !== undefined && scale > 0 && Number.isFinite(scale) ? scale : 0;
  if (s === 0) {
    for (let i = 0; i < d; i++) if (a[i] !== 0) s = Math.max(s, Math.pow(Math.abs(a[i] / a[d]), 1 / (d - i)));
  }
  const s2 = s > 0 && Number.isFinite(s) ? Math.pow(2, Math.round(Math.log2(s))) : 1;
  let scaled = a;
  if (s2 !== 1) {
    scaled = a.map((c, i) => c * Math.pow(s2, i));
    if (!scaled.every(Number.isFinite) || scaled[d] === 0) scaled = a; // keep the unscaled form on over/underflow
  }
  const t = rootsUnscaled(scaled);
  return scaled === a ? t : t.map((r) => r * s2);
}

function rootsUnscaled(a: number[]): number[] {
  while (a.length > 1 && a[a.length - 1] === 0) a = a.slice(0, -1);
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
  const p = (x: number): number => {
    let v = 0;
    for (let i = d; i >= 0; i--) v = v * x + a[i];
    return v;
  };
  const deriv = a.slice(1).map((c, i) => c * (i + 1));
  const crit = rootsUnscaled(deriv);
  let bound = 0;
  for (let i = 0; i < d; i++) bound = Math.max(bound, Math.abs(a[i] / a[d]));
  bound += 1;
  const edges = [-bound, ...crit.filter((c) => c > -bound && c < bound), bound];
  const roots: number[] = [];
  for (let j = 0; j + 1 < edges.length; j++) {
    let lo = edges[j],
      hi = edges[j + 1];
    const plo = p(lo),
      phi = p(hi);
    if (plo === 0) {
      if (j > 0 && roots[roots.length - 1] !== lo) roots.push(lo);
      continue;
    }
    if (phi === 0) {
      roots.push(hi);
      continue;
    }
    if (plo < 0 === phi < 0) continue;
    const neg = plo < 0;
    for (let it = 0; it < 2200; it++) {
      const mid = 0.5 * (lo + hi);
      if (mid <= lo || mid >= hi) break;
      const pm = p(mid);
      if (pm === 0) {
        lo = hi = mid;
        break;
      }
      if (pm < 0 === neg) lo = mid;
      else hi = mid;
    }
    roots.push(Math.abs(p(lo)) <= Math.abs(p(hi)) ? lo : hi);
  }
  return [...new Set(roots)].sort((x, y) => x - y);
}
