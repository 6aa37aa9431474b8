import type { ShapeName } from './types';

/**
 * Which turning point sets a district's standing, gap and projection.
 *
 * Rule (docs/method.md): among the turning points (for a U or inverted-U shape, those of the
 * matching kind — trough or peak — when there are any), the one inside [x_min, x_max]
 * nearest x_now; when none is inside, the nearest one overall (the caller flags it
 * extrapolated). A quadratic has at most one, so this only chooses for a cubic.
 * Reference: none — a convention of this product.
 *
 * Throws: nothing; returns null when there is no turning point.
 *
 * Example:
 *   selectTurningPoint([{ x: 8, kind: 'peak', inRange: false }, { x: 10, kind: 'trough', inRange: true }], 'u', 9.5)  // → 1
 */
export function selectTurningPoint(
  points: ReadonlyArray<{ x: number; kind: 'peak' | 'trough'; inRange: boolean }>,
  shape: ShapeName,
  xNow: number,
): number | null {
  if (points.length === 0) return null;
  const want = shape === 'inverted_u' ? 'peak' : shape === 'u' ? 'trough' : null;
  let idx = points.map((_, i) => i);
  if (want && idx.some((i) => points[i].kind === want)) idx = idx.filter((i) => points[i].kind === want);
  const inside = idx.filter((i) => points[i].inRange);
  const pool = inside.length > 0 ? inside : idx;
  let best = pool[0];
  for (const i of pool) if (Math.abs(points[i].x - xNow) < Math.abs(points[best].x - xNow)) best = i;
  return best;
}
