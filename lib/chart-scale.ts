// Axis helpers for the card's charts: log-scale domains and ticks in real units.

/** Mantissas tried in turn until a range gets at least three ticks. */
const MANTISSAS = [
  [1, 2, 5],
  [1, 2, 3, 5, 7],
];

/** Ticks at 1-2-5 (else 1-2-3-5-7) times powers of ten inside [min, max]. */
export function logTicks(min: number, max: number): number[] {
  if (!(min > 0) || !(max > min)) return min > 0 ? [min] : [];
  let out: number[] = [];
  for (const mantissas of MANTISSAS) {
    out = [];
    for (let p = Math.floor(Math.log10(min)); p <= Math.ceil(Math.log10(max)); p++) {
      for (const m of mantissas) {
        const v = m * 10 ** p;
        if (v >= min * 0.999 && v <= max * 1.001) out.push(v);
      }
    }
    if (out.length >= 3) return out;
  }
  // A narrow range (under ×3 or so): evenly spaced round values, the widest step of 1, 2 or
  // 5 times a power of ten that still gives four of them.
  const power = 10 ** Math.floor(Math.log10((max - min) / 10));
  const evenTicks = (step: number) => {
    const ticks: number[] = [];
    for (let v = Math.ceil(min / step) * step; v <= max * 1.0000001; v += step) ticks.push(Number(v.toPrecision(12)));
    return ticks;
  };
  const steps = [1, 2, 5, 10, 20, 50, 100].map((m) => m * power);
  const step = [...steps].reverse().find((st) => evenTicks(st).length >= 4) ?? steps[0];
  const even = evenTicks(step);
  return even.length >= 2 ? even : out;
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
 * the ends of a bounded band) when they lie beyond it by at most `maxStretch` times; a value
 * further out widens nothing (the chart's text summary says it lies off the chart), and a
 * band end out there is cut at the frame.
 */
export function incomeDomain(observed: number[], extra: (number | null)[], maxStretch = 3): [number, number] {
  const finite = observed.filter((v) => v > 0 && Number.isFinite(v));
  if (finite.length === 0) return [1, 10];
  let lo = Math.min(...finite);
  let hi = Math.max(...finite);
  const floor = lo / maxStretch;
  const ceil = hi * maxStretch;
  for (const v of extra) {
    if (v === null || !(v > 0) || !Number.isFinite(v) || v < floor || v > ceil) continue;
    lo = Math.min(lo, v);
    hi = Math.max(hi, v);
  }
  return padLog(lo, hi);
}

/** Clamp v into [lo, hi]. */
export const clamp = (v: number, lo: number, hi: number) => Math.min(hi, Math.max(lo, v));
