import tCdf from '@stdlib/stats-base-dists-t-cdf';

/**
 * Upper tail P(T > t) of Student's t with ν degrees of freedom, for t ≥ 0 and integer ν, by
 * finite and convergent series in θ = atan(t/√ν) with only positive terms (so p-values such
 * as 1e-20 keep full relative accuracy); non-integer or large ν (> 200) falls back to @stdlib.
 *
 * Formula: with x = cos²θ = ν/(ν + t²), s = sinθ, c = cosθ (Abramowitz & Stegun 1964, 26.7.3–4):
 * - even ν = 2m: P(|T| < t) = s·Σ_{j<m} a_j x^j with a_0 = 1, a_j = a_{j−1}(2j − 1)/(2j); since
 *   Σ_{j≥0} a_j x^j = 1/s, the upper tail is ½(1 − s·Σ_{j<m} a_j x^j), used when that is
 *   > 1e-3 (the subtraction then costs at most 3 digits), else ½·s·Σ_{j≥m} a_j x^j;
 * - odd ν = 2m + 1: P(|T| < t) = (2/π)(θ + s·c·Σ_{j<m} d_j x^j), d_0 = 1, d_j = d_{j−1}·2j/(2j + 1);
 *   the upper tail is (1/π)(atan(√ν/t) − s·c·Σ_{j<m} d_j x^j) when > 1e-3, else (1/π)·s·c·Σ_{j≥m} d_j x^j.
 * Reference: Abramowitz, M. and Stegun, I. A. (1964), Handbook of Mathematical Functions,
 * National Bureau of Standards, formulas 26.7.3 and 26.7.4.
 *
 * Throws: nothing.
 *
 * Example:
 *   studentTUpperTail(2, 31)                    // → 0.027163607683587…  (= 1 − pt(2, 31))
 *   studentTUpperTail(15.572622024655365, 31)   // → 1.65687000915978e-16
 */
export function studentTUpperTail(t: number, nu: number): number {
  if (!(t >= 0) || !Number.isInteger(nu) || nu < 1 || nu > 200) return tCdf(-t, nu);
  if (t === Infinity) return 0;
  const x = nu / (nu + t * t);
  const s = t / Math.sqrt(nu + t * t);
  const c = Math.sqrt(x);
  const even = nu % 2 === 0;
  const m = even ? nu / 2 : (nu - 1) / 2;
  // finite sum Σ_{j<m}; its complement is accurate while the tail is not small
  let coef = 1,
    xp = 1,
    sum = 0;
  for (let j = 0; j < m; j++) {
    sum += coef * xp;
    const jj = j + 1;
    coef *= even ? (2 * jj - 1) / (2 * jj) : (2 * jj) / (2 * jj + 1);
    xp *= x;
  }
  const direct = even ? 0.5 * (1 - s * sum) : (Math.atan(Math.sqrt(nu) / t) - s * c * sum) / Math.PI;
  if (direct > 1e-3) return direct;
  // small tail: the convergent positive series Σ_{j≥m}, starting from coef = a_m (d_m), xp = x^m
  let tail = 0;
  for (let j = m; j < m + 20000; j++) {
    const term = coef * xp;
    tail += term;
    if (term <= 1e-17 * tail) break;
    const jj = j + 1;
    coef *= even ? (2 * jj - 1) / (2 * jj) : (2 * jj) / (2 * jj + 1);
    xp *= x;
  }
  return even ? 0.5 * s * tail : (s * c * tail) / Math.PI;
}
