/**
 * Double-double ("dd") arithmetic: a number is the unevaluated sum hi + lo of two doubles
 * with |lo| ≤ ulp(hi)/2, giving about 32 significant digits.
 *
 * Formulas: Knuth's TwoSum and Dekker's TwoProduct with Veltkamp splitting
 * (Dekker, T. J. 1971, "A floating-point technique for extending the available precision",
 * Numerische Mathematik 18(3), 224–242); addition, multiplication, division and square root
 * as in Hida, Li & Bailey (2001), "Algorithms for quad-double precision floating point
 * arithmetic", Proc. 15th IEEE Symposium on Computer Arithmetic, 155–162.
 *
 * This file is the engine's arithmetic kernel and, unlike the estimator files, exports a few
 * small primitives together (they are meaningless one at a time). Each returns a fresh
 * `[hi, lo]` pair; the hot paths that need speed inline TwoSum/TwoProduct instead.
 *
 * Throws nothing; NaN and Infinity propagate as in double arithmetic.
 *
 * Example:
 *   ddAdd(1, 0, 1e-20, 0)           // → [1, 1e-20]   (1 + 1e-20 kept exactly)
 *   ddMul(0.1, 0, 10, 0)            // → [1, 5.551115123125783e-17] (the exact product of the double 0.1 and 10)
 */
export type DD = [number, number];

const SPLITTER = 134217729; // 2^27 + 1

/** Exact a + b = s + e (Knuth). */
export function twoSum(a: number, b: number): DD {
  const s = a + b;
  const bb = s - a;
  const e = a - (s - bb) + (b - bb);
  return [s, e];
}

/** Exact a · b = p + e (Dekker, Veltkamp split; no fused multiply-add needed). */
export function twoProd(a: number, b: number): DD {
  const p = a * b;
  let t = SPLITTER * a;
  const ah = t - (t - a);
  const al = a - ah;
  t = SPLITTER * b;
  const bh = t - (t - b);
  const bl = b - bh;
  const e = ah * bh - p + ah * bl + al * bh + al * bl;
  return [p, e];
}

/** (ah + al) + (bh + bl). */
export function ddAdd(ah: number, al: number, bh: number, bl: number): DD {
  let s = ah + bh;
  let v = s - ah;
  let e = ah - (s - v) + (bh - v);
  let t = al + bl;
  v = t - al;
  const f = al - (t - v) + (bl - v);
  e += t;
  t = s + e;
  e = e - (t - s);
  s = t;
  e += f;
  t = s + e;
  return [t, e - (t - s)];
}

/** (ah + al) · (bh + bl). */
export function ddMul(ah: number, al: number, bh: number, bl: number): DD {
  const [p, e] = twoProd(ah, bh);
  const e2 = e + (ah * bl + al * bh);
  const s = p + e2;
  return [s, e2 - (s - p)];
}

/** (ah + al) / (bh + bl). */
export function ddDiv(ah: number, al: number, bh: number, bl: number): DD {
  const q1 = ah / bh;
  let [rh, rl] = ddMul(q1, 0, bh, bl);
  [rh, rl] = ddAdd(ah, al, -rh, -rl);
  const q2 = rh / bh;
  const [ph, pl] = ddMul(q2, 0, bh, bl);
  [rh, rl] = ddAdd(rh, rl, -ph, -pl);
  const q3 = rh / bh;
  const [sh, sl] = twoSum(q1, q2);
  return ddAdd(sh, sl, q3, 0);
}

/** sqrt(ah + al) for ah ≥ 0 (one Newton step on the double square root). */
export function ddSqrt(ah: number, al: number): DD {
  if (ah <= 0) return [Math.sqrt(ah), 0];
  const s = Math.sqrt(ah);
  const [ph, pl] = twoProd(s, s);
  const [dh, dl] = ddAdd(ah, al, -ph, -pl);
  const c = (dh + dl) / (2 * s);
  return twoSum(s, c);
}
