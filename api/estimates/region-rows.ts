/**
 * The region answer's district rows: what the region list, map and counts show, at the
 * precision they show it (a 3,000-district region fits in 150 KB gzipped this way).
 */
import type { RegionEstimate } from '../../contracts/estimates';

/**
 * The gap as the list shows it (lib/estimate-words.ts gapShort): whole percent below
 * +200 %, then a factor with one decimal, i.e. tens of percent.
 */
export function shownGap(gapPercent: number | null): number | null {
  if (gapPercent === null) return null;
  return Math.abs(gapPercent) < 200 ? Math.round(gapPercent) : Math.round(gapPercent / 10) * 10;
}

/**
 * The list and map only ask whether a threshold exists and is positive (a gap is shown
 * then); three significant digits keep that answer and the sign.
 */
export function shownThreshold(threshold: number | null): number | null {
  return threshold === null ? null : Number(threshold.toPrecision(3));
}

/** A published estimate summary cut to the region row's fields. */
export function regionEstimate(e: RegionEstimate): RegionEstimate {
  return {
    status: e.status,
    standing: e.standing,
    intervalBounded: e.intervalBounded,
    shape: e.shape,
    threshold: shownThreshold(e.threshold),
    gapPercent: shownGap(e.gapPercent),
    crossingYear: e.crossingYear,
    projectionStatus: e.projectionStatus,
  };
}
