import type { GapResult } from './types';

/**
 * Gap between the latest driver value and the threshold, in percent of the threshold.
 *
 * Formula: 100·(X_now/X* − 1) with X_now and X* in real units (exp of the log values in
 * log form, the values themselves in level form).
 * Reference: none — the product's definition (docs/method.md).
 *
 * Throws: nothing; null with a reason when X* is missing, not positive or not finite.
 *
 * Example:
 *   thresholdGap(39898.97, 17597.711464345546, false).percent   // → 126.728… (PA01)
 */
export function thresholdGap(levelNow: number, threshold: number | null, extrapolated: boolean): GapResult {
  if (threshold === null || !Number.isFinite(threshold))
    return { percent: null, extrapolated, reason: 'no finite threshold' };
  if (!(threshold > 0)) return { percent: null, extrapolated, reason: 'threshold is not positive' };
  const percent = 100 * (levelNow / threshold - 1);
  return Number.isFinite(percent)
    ? { percent, extrapolated, reason: null }
    : { percent: null, extrapolated, reason: 'gap not finite' };
}
