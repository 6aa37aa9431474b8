import { hasTurn } from './classify-shape';
import { selectTurningPoint } from './select-turning-point';
import type { IntervalEnds, ShapeName, StandingResult, TurningPoint } from './types';

/**
 * Where a district stands relative to its threshold (turning point).
 *
 * Rule (docs/method.md): for an inverted-U or U shape, take the turning point chosen by
 * select-turning-point.ts and its interval (Fieller by default, delta if asked):
 * 'approaching' when x_now is below the interval's lower end, 'at_turn' inside it,
 * 'past_turn' above its upper end (for a U the turn is a trough, so 'past_turn' means
 * emissions now rise with income: the meaning mirrors, the positions do not). An N or
 * inverted N is read from the turning point inside the range nearest x_now, as a peak
 * (like an inverted U) or a trough (like a U). When the
 * interval is not bounded (Fieller two rays or whole line), the standing follows the point
 * estimate and carries intervalBounded: false with the note "interval not bounded at
 * <level>". Increasing, decreasing and flat shapes give 'no_turn' (the turning point, if
 * any, is still returned for the gap and projection, flagged extrapolated when outside the
 * observed range).
 * Reference: none — the product's definition.
 *
 * Throws: nothing.
 *
 * Example: inverted U, Fieller [9.74, 9.81], x_now = 10.59 → { standing: 'past_turn', intervalBounded: true, … }
 */
export function districtStanding(input: {
  shape: ShapeName;
  turningPoints: ReadonlyArray<TurningPoint>;
  xNow: number;
  levelNow: number;
  method: 'fieller' | 'delta';
  level: number;
}): StandingResult {
  const { shape, turningPoints, xNow, levelNow, method, level } = input;
  const index = selectTurningPoint(turningPoints, shape, xNow);
  const tp = index === null ? null : turningPoints[index];
  const interval: IntervalEnds | null =
    tp === null
      ? null
      : method === 'delta'
        ? { lo: tp.delta.lo, hi: tp.delta.hi, levelLo: tp.delta.levelLo, levelHi: tp.delta.levelHi }
        : { lo: tp.fieller.lo, hi: tp.fieller.hi, levelLo: tp.fieller.levelLo, levelHi: tp.fieller.levelHi };
  const base = {
    turningPointIndex: index,
    intervalMethod: method,
    interval,
    extrapolated: tp ? tp.extrapolated : false,
    xNow,
    levelNow,
  };
  if (!hasTurn(shape)) {
    return { standing: 'no_turn', intervalBounded: tp ? tp.intervalBounded : null, note: null, ...base };
  }
  if (tp === null) {
    return { standing: 'not_estimable', intervalBounded: null, note: 'no turning point', ...base };
  }
  if (tp.intervalBounded && interval && interval.lo !== null && interval.hi !== null) {
    const standing = xNow < interval.lo ? 'approaching' : xNow > interval.hi ? 'past_turn' : 'at_turn';
    return { standing, intervalBounded: true, note: null, ...base };
  }
  const standing = xNow < tp.x ? 'approaching' : xNow > tp.x ? 'past_turn' : 'at_turn';
  const pct = `${Math.round(level * 1000) / 10}%`;
  return { standing, intervalBounded: false, note: `interval not bounded at ${pct}`, ...base };
}
