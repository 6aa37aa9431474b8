import type { TrendResult } from './types';

/**
 * Recent growth trend of the driver: OLS slope of ln(driver) on year over the rows with
 * year > last_year − window (default window 10, i.e. the last ten calendar years).
 *
 * Formula: g = Σ(t − t̄)(l_t − l̄) / Σ(t − t̄)² with l_t = ln(driver_t), centred sums.
 * Reference: simple least squares (any regression text); window per docs/method.md.
 *
 * Throws: nothing; null with a reason when fewer than 2 rows fall in the window or a
 * driver value in it is not positive (level-form data).
 *
 * Example (PA01, 2015–2024): incomeTrend(years, income).slopePerYear   // → 0.04502327494381345
 */
export function incomeTrend(years: ArrayLike<number>, driver: ArrayLike<number>, window = 10): TrendResult {
  const n = years.length;
  let last = -Infinity;
  for (let i = 0; i < n; i++) if (years[i] > last) last = years[i];
  const idx: number[] = [];
  for (let i = 0; i < n; i++) if (years[i] > last - window) idx.push(i);
  const none = (reason: string): TrendResult => ({
    slopePerYear: null,
    nUsed: idx.length,
    firstYear: null,
    lastYear: null,
    window,
    reason,
  });
  if (idx.length < 2) return none('fewer than 2 years in the trend window');
  let tm = 0,
    lm = 0,
    first = Infinity;
  for (const i of idx) {
    if (!(driver[i] > 0)) return none('driver not positive in the trend window');
    tm += years[i];
    lm += Math.log(driver[i]);
    if (years[i] < first) first = years[i];
  }
  tm /= idx.length;
  lm /= idx.length;
  let sxy = 0,
    sxx = 0;
  for (const i of idx) {
    const dt = years[i] - tm;
    sxy += dt * (Math.log(driver[i]) - lm);
    sxx += dt * dt;
  }
  if (!(sxx > 0)) return none('all trend years equal');
  return { slopePerYear: sxy / sxx, nUsed: idx.length, firstYear: first, lastYear: last, window, reason: null };
}
