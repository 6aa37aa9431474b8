import { cubicFieller } from './cubic-fieller';
import { cubicTurningPoints } from './cubic-turning-points';
import { deltaMethod } from './delta-method';
import { EstimationInputError } from './errors';
import { fiellerInterval } from './fieller';
import { quadraticTurningPoint } from './turning-point';
import type { FiellerSet, TurningPoint } from './types';

/**
 * The turning points of a fitted quadratic or cubic, each with its delta-method and
 * Fieller intervals on the model's x scale and in real units.
 *
 * Formula: quadratic x* = −b1/(2b2) (turning-point.ts) with Fieller's interval
 * (fieller.ts); cubic roots of b1 + 2b2x + 3b3x² (cubic-turning-points.ts) with the
 * quartic Fieller-type set (cubic-fieller.ts). Delta interval x* ∓ c·se (delta-method.ts).
 * Real units: under the log transform every value is exponentiated (ends of the log-scale
 * intervals, never ± on the level; exp overflow → null); in level form they are the same.
 * inRange: x_min ≤ x* ≤ x_max; extrapolated = !inRange; intervalBounded refers to the
 * standing's interval (Fieller 'bounded', or a finite delta se).
 * References: Fieller (1954), JRSS B 16(2), 175–185; Oehlert (1992), The American
 * Statistician 46(1), 27–29.
 *
 * Throws: EstimationInputError `numerical_failure` when a cubic's Fieller-type set does not
 * contain its turning point (impossible in exact arithmetic; the caller reports the district
 * not_estimable rather than print a set that is wrong).
 *
 * Example (PA01, classical, c = qt(0.975, 31)):
 *   buildTurningPoints({ slope: [12.1077, -0.61929], slopeCovariance: V, xMin: 9, xMax: 10.59, critical: 2.0395,
 *     transform: 'log', intervalMethod: 'fieller' })[0]
 *   // → { x: 9.7755…, level: 17597.7…, kind: 'peak', inRange: true, fieller: { kind: 'bounded', … }, … }
 */
export function buildTurningPoints(input: {
  slope: ReadonlyArray<number>;
  slopeCovariance: ReadonlyArray<ReadonlyArray<number>>;
  xMin: number;
  xMax: number;
  critical: number;
  transform: 'log' | 'level';
  intervalMethod: 'fieller' | 'delta';
}): TurningPoint[] {
  const { slope, slopeCovariance: V, xMin, xMax, critical: c, transform, intervalMethod } = input;
  const out: TurningPoint[] = [];
  if (slope.length === 2) {
    const tp = quadraticTurningPoint(slope[0], slope[1], V[0][0], V[0][1], V[1][1]);
    if (tp)
      out.push(
        assemble(
          tp.x,
          tp.kind,
          tp.gradient,
          fiellerInterval(slope[0], slope[1], V[0][0], V[0][1], V[1][1], c),
          V,
          c,
          xMin,
          xMax,
          transform,
          intervalMethod,
        ),
      );
  } else {
    const scale = Math.max(Math.abs(xMin), Math.abs(xMax));
    for (const tp of cubicTurningPoints(slope[0], slope[1], slope[2], V, scale)) {
      const set = cubicFieller(slope[0], slope[1], slope[2], V, c, tp.x, scale);
      if (set.containsTurningPoint === false) {
        throw new EstimationInputError(
          'numerical_failure',
          `The Fieller-type set of the ${tp.kind} at x = ${tp.x} does not contain it; the interval cannot be trusted`,
          { reason: 'fieller_set_excludes_turning_point', x: tp.x, kind: tp.kind, pieces: set.pieces },
        );
      }
      out.push(assemble(tp.x, tp.kind, tp.gradient, set, V, c, xMin, xMax, transform, intervalMethod));
    }
  }
  return out;
}

function assemble(
  x: number,
  kind: 'peak' | 'trough',
  gradient: number[],
  fieller: FiellerSet,
  V: ReadonlyArray<ReadonlyArray<number>>,
  c: number,
  xMin: number,
  xMax: number,
  transform: 'log' | 'level',
  intervalMethod: 'fieller' | 'delta',
): TurningPoint {
  const d = deltaMethod(gradient, V, x, c);
  const inRange = x >= xMin && x <= xMax;
  const log = transform === 'log';
  return {
    x,
    level: toLevel(x, log),
    kind,
    inRange,
    gradient,
    delta: { se: d.se, lo: d.lo, hi: d.hi, levelLo: toLevel(d.lo, log), levelHi: toLevel(d.hi, log) },
    fieller: {
      kind: fieller.kind,
      lo: fieller.lo,
      hi: fieller.hi,
      pieces: fieller.pieces,
      ...(fieller.A !== undefined
        ? { A: fieller.A, B: fieller.B, C: fieller.C, discriminant: fieller.discriminant }
        : {}),
      levelLo: toLevel(fieller.lo, log),
      levelHi: toLevel(fieller.hi, log),
    },
    intervalBounded: intervalMethod === 'delta' ? d.se !== null : fieller.kind === 'bounded',
    extrapolated: !inRange,
  };
}

/** Real units: exp under the log transform (null on overflow), the value itself in level form. */
function toLevel(v: number | null, log: boolean): number | null {
  if (v === null) return null;
  if (!log) return v;
  const e = Math.exp(v);
  return Number.isFinite(e) ? e : null;
}
