import chisquareCdf from '@stdlib/stats-base-dists-chisquare-cdf';
import fCdf from '@stdlib/stats-base-dists-f-cdf';
import normalCdf from '@stdlib/stats-base-dists-normal-cdf';
import normalQuantile from '@stdlib/stats-base-dists-normal-quantile';
import tQuantile from '@stdlib/stats-base-dists-t-quantile';
import { studentTUpperTail } from './student-t-tail';

/**
 * The distribution functions the engine needs, as thin wrappers over @stdlib (accurate to
 * near machine precision, unlike jstat's t quantile; see PLATFORM.md). `df = null` means
 * the standard normal. Upper tails are computed as lower tails of the mirrored argument
 * so that p-values like 1e-20 keep their digits.
 *
 * Student t tails for integer df use the positive-term series of student-t-tail.ts.
 *
 * Like double-double.ts this is a kernel file and exports a few small functions together.
 *
 * References: the algorithms are @stdlib's (regularised incomplete beta and gamma
 * functions; Wichura, M. J. (1988), "Algorithm AS 241: The percentage points of the normal
 * distribution", Applied Statistics 37(3), 477–484, for the normal quantile).
 *
 * Throws: nothing; invalid arguments give NaN (callers check).
 *
 * Example:
 *   criticalValue(0.95, 31)     // → 2.0395134463964077   (qt(0.975, 31))
 *   criticalValue(0.95, null)   // → 1.959963984540054
 *   upperTail(2, 31)            // → 0.027171…             (P(T₃₁ > 2))
 */

const criticalCache = new Map<string, number>();

/** Two-sided critical value c with P(|T| ≤ c) = level (t with df, or normal when df is null). */
export function criticalValue(level: number, df: number | null): number {
  const key = `${level}|${df}`;
  let c = criticalCache.get(key);
  if (c === undefined) {
    const p = 0.5 + level / 2;
    c = df === null ? normalQuantile(p, 0, 1) : tQuantile(p, df);
    if (criticalCache.size > 10000) criticalCache.clear();
    criticalCache.set(key, c);
  }
  return c;
}

/** P(T > t) for t with df degrees of freedom, or N(0,1) when df is null. */
export function upperTail(t: number, df: number | null): number {
  if (df === null) return normalCdf(-t, 0, 1);
  if (Number.isNaN(t)) return NaN;
  return t >= 0 ? studentTUpperTail(t, df) : 1 - studentTUpperTail(-t, df);
}

/** Two-sided p-value P(|T| > |t|). */
export function twoSidedP(t: number, df: number | null): number {
  return 2 * upperTail(Math.abs(t), df);
}

/** P(F > f) for F(d1, d2); for d1 = 2 in closed form, (1 + 2f/d2)^(−d2/2). */
export function fUpperTail(f: number, d1: number, d2: number): number {
  if (!(f > 0)) return 1;
  if (d1 === 2) return Math.exp(-0.5 * d2 * Math.log1p((2 * f) / d2));
  // P(F > f) = P(F' < 1/f) with F' ~ F(d2, d1): keeps small upper tails accurate
  return fCdf(1 / f, d2, d1);
}

/**
 * P(X > x) for a chi-square with df degrees of freedom. For integer df ≤ 30 by the finite
 * sums of Abramowitz & Stegun (1964) 26.4.4–26.4.5 (all terms positive, so small tails keep
 * their digits): even df e^(−x/2)·Σ_{i<df/2} (x/2)^i/i!; odd df 2·Q(√x) + 2φ(√x)·Σ_{r=1}^{(df−1)/2}
 * x^(r−1/2)/(1·3···(2r−1)); otherwise @stdlib.
 */
export function chiSquareUpperTail(x: number, df: number): number {
  if (!(x > 0)) return 1;
  if (Number.isInteger(df) && df >= 1 && df <= 30) {
    const h = x / 2;
    if (df % 2 === 0) {
      let term = 1,
        sum = 1;
      for (let i = 1; i < df / 2; i++) {
        term *= h / i;
        sum += term;
      }
      return Math.exp(-h) * sum;
    }
    const z = Math.sqrt(x);
    let p = 2 * normalCdf(-z, 0, 1);
    if (df > 1) {
      let term = z,
        sum = z;
      for (let r = 2; r <= (df - 1) / 2; r++) {
        term *= x / (2 * r - 1);
        sum += term;
      }
      p += 2 * (Math.exp(-h) / Math.sqrt(2 * Math.PI)) * sum;
    }
    return Math.min(1, p);
  }
  return 1 - chisquareCdf(x, df);
}
