import type { FiellerSet } from './types';

/**
 * Fieller confidence set for the turning point x* = −b1/(2·b2) of a quadratic.
 *
 * Formula: the θ with (b1 + 2·b2·θ)² ≤ c²·(V11 + 4θ·V12 + 4θ²·V22), i.e. Aθ² + Bθ + C ≤ 0 with
 * A = 4·b2² − 4c²·V22, B = 4·b1·b2 − 4c²·V12, C = b1² − c²·V11, D = B² − 4AC.
 * A > 0 → bounded [r1, r2]; A < 0, D > 0 → two rays (−∞, r1] ∪ [r2, ∞), reported as
 * kind 'two_rays' with lo = r1, hi = r2; A < 0, D ≤ 0 → the whole line (lo = hi = null);
 * A = 0 to rounding (|A| ≤ A_TOLERANCE·max(4b2², 4c²V22), A_TOLERANCE = 1e-12: A is a
 * difference of two terms each rounded to ~1e-16 of itself, so within 1e-12 of their size its
 * sign is not known and |t(b2)| = c to 12 digits) → one ray Bθ + C ≤ 0, reported as
 * 'two_rays' with the missing end null. Roots by the cancellation-free form
 * q = −(B + sign(B)√D)/2, roots q/A and C/q.
 * Reference: Fieller, E. C. (1954), "Some problems in interval estimation", Journal of the
 * Royal Statistical Society, Series B 16(2), 175–185.
 *
 * Throws: nothing; non-finite inputs give the whole line.
 *
 * Example (PA05, the flat district, classical covariance, c = qt(0.975, 31)):
 *   fiellerInterval(b1, b2, V11, V12, V22, 2.0395134463964077).kind   // → 'whole_line'
 *   fiellerInterval(2, -1, 0.01, 0, 0.0025, 1.96)
 *   // → { kind: 'bounded', lo: 0.87009…, hi: 1.14929…, pieces: [{ lo: 0.87009…, hi: 1.14929… }], A: 3.961584, … }
 */
/** Relative tolerance on A below which the Fieller set is read as one ray (see above). */
export const A_TOLERANCE = 1e-12;

export function fiellerInterval(b1: number, b2: number, v11: number, v12: number, v22: number, c: number): FiellerSet {
  const c2 = c * c;
  const A = 4 * b2 * b2 - 4 * c2 * v22;
  const B = 4 * b1 * b2 - 4 * c2 * v12;
  const C = b1 * b1 - c2 * v11;
  const D = B * B - 4 * A * C;
  const base = { A, B, C, discriminant: D };
  const whole: FiellerSet = { kind: 'whole_line', lo: null, hi: null, pieces: [{ lo: null, hi: null }], ...base };
  if (![A, B, C, D].every(Number.isFinite)) return whole;
  const scale = Math.max(4 * b2 * b2, 4 * c2 * v22);
  if (Math.abs(A) <= A_TOLERANCE * scale) {
    if (B === 0) return C <= 0 ? whole : { kind: 'bounded', lo: null, hi: null, pieces: [], ...base };
    const r = -C / B;
    return B > 0
      ? { kind: 'two_rays', lo: r, hi: null, pieces: [{ lo: null, hi: r }], ...base }
      : { kind: 'two_rays', lo: null, hi: r, pieces: [{ lo: r, hi: null }], ...base };
  }
  if (A > 0) {
    const d = Math.sqrt(Math.max(D, 0));
    const q = -0.5 * (B + (B >= 0 ? d : -d));
    let r1 = q / A,
      r2 = q !== 0 ? C / q : r1;
    if (r1 > r2) {
      const t = r1;
      r1 = r2;
      r2 = t;
    }
    return { kind: 'bounded', lo: r1, hi: r2, pieces: [{ lo: r1, hi: r2 }], ...base };
  }
  if (D <= 0) return whole;
  const d = Math.sqrt(D);
  const q = -0.5 * (B + (B >= 0 ? d : -d));
  let r1 = q / A,
    r2 = C / q;
  if (r1 > r2) {
    const t = r1;
    r1 = r2;
    r2 = t;
  }
  return {
    kind: 'two_rays',
    lo: r1,
    hi: r2,
    pieces: [
      { lo: null, hi: r1 },
      { lo: r2, hi: null },
    ],
    ...base,
  };
}
