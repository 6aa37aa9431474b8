import type { ProjectionResult } from './types';

/**
 * Projected year in which the driver reaches the threshold on its current trend.
 *
 * Formula: years = (ln X* − ln X_now)/g with g the trend of ln(driver) per year
 * (income-trend.ts); crossing year = last_year + ceil(years); its range from the ends of
 * the standing's interval, ln X_lo and ln X_hi in place of ln X* (earliest and latest of
 * the two). Status: 'projected' when years ≥ 0; 'already_past' when the driver has already
 * passed the threshold in the direction of its trend (years < 0; the crossing year is then
 * the back-projected one; ceil with a tolerance of 1e-9 year, YEAR_TOLERANCE); 'not_on_current_trend' when g is zero or missing, or moves the
 * driver away from a threshold not yet reached; 'no_threshold' without a positive threshold.
 * An interval end that is unbounded (or not positive in real units) gives a null end of
 * the range with the note "not on current trend" for that end.
 * Reference: none — the product's definition (docs/method.md).
 *
 * Throws: nothing.
 *
 * Example (PA06: ln X* = 11.4265, ln X_now = 10.4718, g = 0.04104):
 *   projectCrossing({ lnThreshold: 11.4265, lnNow: 10.4718, lnLo, lnHi, trend: 0.04104, lastYear: 2024, extrapolated: true })
 *   // → { status: 'projected', yearsToThreshold: 23.26…, crossingYear: 2048, … }
 */
/**
 * Whole years up to a crossing: ceil with a tolerance of 1e-9 year, so a value a rounding
 * error above a whole number (e.g. 3.0000000000004 from ln ratios) counts as that number
 * and the year does not depend on the units the data came in.
 */
export const YEAR_TOLERANCE = 1e-9;
function ceilYears(years: number): number {
  return Math.ceil(years - YEAR_TOLERANCE);
}

export function projectCrossing(input: {
  lnThreshold: number | null;
  lnNow: number;
  lnLo: number | null;
  lnHi: number | null;
  trend: number | null;
  lastYear: number;
  extrapolated: boolean;
}): ProjectionResult {
  const { lnThreshold, lnNow, lnLo, lnHi, trend: g, lastYear, extrapolated } = input;
  if (lnThreshold === null || !Number.isFinite(lnThreshold)) {
    return {
      status: 'no_threshold',
      yearsToThreshold: null,
      crossingYear: null,
      range: null,
      extrapolated,
      note: 'no positive threshold',
    };
  }
  if (g === null || g === 0 || !Number.isFinite(g)) {
    return {
      status: 'not_on_current_trend',
      yearsToThreshold: null,
      crossingYear: null,
      range: null,
      extrapolated,
      note: 'not on current trend (no income trend)',
    };
  }
  const years = (lnThreshold - lnNow) / g;
  if (years < 0 && lnNow < lnThreshold) {
    return {
      status: 'not_on_current_trend',
      yearsToThreshold: years,
      crossingYear: null,
      range: null,
      extrapolated,
      note: 'not on current trend (income moving away from the threshold)',
    };
  }
  const status = years >= 0 ? 'projected' : 'already_past';
  const crossingYear = lastYear + ceilYears(years);
  const endYear = (ln: number | null): number | null =>
    ln === null || !Number.isFinite(ln) ? null : lastYear + ceilYears((ln - lnNow) / g);
  const a = endYear(lnLo),
    b = endYear(lnHi);
  let range: ProjectionResult['range'];
  let note: string | null = null;
  if (a !== null && b !== null) range = { earliest: Math.min(a, b), latest: Math.max(a, b) };
  else {
    range = { earliest: g > 0 ? a : b, latest: g > 0 ? b : a };
    note = 'range not on current trend (interval not bounded)';
  }
  return { status, yearsToThreshold: years, crossingYear, range, extrapolated, note };
}
