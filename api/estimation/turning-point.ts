/**
 * Turning point of the quadratic y = b0 + b1·x + b2·x² and its delta-method standard error.
 *
 * Formula: slope b1 + 2·b2·x = 0 at x* = −b1/(2·b2); a peak when b2 < 0, a trough when
 * b2 > 0. Gradient of x* in (b1, b2): g = (−1/(2·b2), b1/(2·b2²)); Var(x*) ≈ gᵀ V g with V
 * the 2 × 2 covariance block of (b1, b2).
 * Reference: delta method as in Oehlert, G. W. (1992), "A note on the delta method", The
 * American Statistician 46(1), 27–29; the turning point of a quadratic is elementary.
 *
 * Throws: nothing; returns null when b2 = 0 (no turning point) and `se: null` when the
 * variance is not a positive finite number.
 *
 * Example (district PA01 of the reference panel, classical covariance):
 *   quadraticTurningPoint(12.107672759949965, -0.6192850932545283, V11, V12, V22)
 *   // → { x: 9.775524142136641, kind: 'peak', gradient: [0.80738…, 15.78517…], se: 0.0297288… }
 */
export function quadraticTurningPoint(
  b1: number,
  b2: number,
  v11: number,
  v12: number,
  v22: number,
): { x: number; kind: 'peak' | 'trough'; gradient: [number, number]; se: number | null } | null {
  if (b2 === 0 || !Number.isFinite(b1) || !Number.isFinite(b2)) return null;
  const x = -b1 / (2 * b2);
  const g1 = -1 / (2 * b2);
  const g2 = b1 / (2 * b2 * b2);
  const v = g1 * g1 * v11 + 2 * g1 * g2 * v12 + g2 * g2 * v22;
  return {
    x,
    kind: b2 < 0 ? 'peak' : 'trough',
    gradient: [g1, g2],
    se: v >= 0 && Number.isFinite(v) ? Math.sqrt(v) : null,
  };
}
