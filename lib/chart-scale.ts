// Axis helpers for the card's charts: log-scale domains and ticks in real units.

/** Ticks at 1, 2 and 5 times powers of ten inside [min, max]; at least two. */
export function logTicks(min: number, max: number): number[] {
  if (!(min > 0) || !(max > min)) return min > 0 ? [min] : [];
  const out: number[] = [];
  for (let p = Math.floor(Math.log10(min)); p <= Math.ceil(Math.log10(max)); p++) {
    for (const m of [1, 2, 5]) {
      const v = m * 10 ** p;
      if (v >= min * 0.999 && v <= max * 1.001) out.push(v);
    }
  }
  if (out.length >= 2) return out;
  // A narrow range (less than ×2): ticks at its ends and middle, rounded to 2 digits.
  const mid = Math.sqrt(min * max);
  return [min, mid, max].map((v) => Number(v.toPrecision(2)));
}

/** Compact real units for tick labels: 8k, 12k, 1.2M, 0.5, 7. */
export function formatTick(v: number): string {
  const abs = Math.abs(v);
  if (abs >= 1e6) return `${Number((v / 1e6).toPrecision(2))}M`;
  if (abs >= 1e3) return `${Number((v / 1e3).toPrecision(3))}k`;
  if (abs >= 1) return String(Number(v.toPrecision(2)));
  return String(Number(v.toPrecision(1)));
}

/** [lo, hi] padded by a factor on a log scale, so marks do not sit on the frame. */
export function padLog(lo: number, hi: number, factor = 1.08): [number, number] {
  if (!(lo > 0) || !(hi > 0)) return [1, 10];
  if (hi <= lo) return [lo / 1.5, hi * 1.5];
  return [lo / factor, hi * factor];
}

/**
 * The x range a chart shows: the observed incomes, widened to include the threshold (and
 * the ends of a bounded band) when they lie beyond it, but never past `maxStretch` times
 * the observed range on either side (an absurd interval end is cut at the frame).
 */
export function incomeDomain(observed: number[], extra: (number | null)[], maxStretch = 3): [number, number] {
  const finite = observed.filter((v) => v > 0 && Number.isFinite(v));
  if (finite.length === 0) return [1, 10];
  let lo = Math.min(...finite);
  let hi = Math.max(...finite);
  const floor = lo / maxStretch;
  const ceil = hi * maxStretch;
  for (const v of extra) {
    if (v === null || !(v > 0) || !Number.isFinite(v)) continue;
    lo = Math.min(lo, Math.max(v, floor));
    hi = Math.max(hi, Math.min(v, ceil));
  }
  return padLog(lo, hi);
}

/** Clamp v into [lo, hi]. */
export const clamp = (v: number, lo: number, hi: number) => Math.min(hi, Math.max(lo, v));
