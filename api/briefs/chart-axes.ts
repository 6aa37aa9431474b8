/**
 * Scales and ticks for the brief charts: log axes labelled in real units (ticks at 1, 2, 5
 * × 10ⁿ, or finer when the range is narrow) and linear axes with 1–2–5 steps. Pure.
 */

export interface Scale {
  kind: 'log' | 'linear';
  lo: number;
  hi: number;
  /** pixel positions of lo and hi */
  p0: number;
  p1: number;
  map(v: number): number;
  ticks: number[];
}

const LOG_STEPS: number[][] = [[1], [1, 2, 5], [1, 1.5, 2, 3, 5, 7], [1, 1.2, 1.5, 2, 2.5, 3, 4, 5, 6, 7, 8, 9]];

/** Ticks for a log axis: the coarsest 1–2–5 family that gives at least `min` ticks inside. */
export function logTicks(lo: number, hi: number, min = 3, max = 7): number[] {
  let best: number[] = [];
  for (const steps of LOG_STEPS) {
    const out: number[] = [];
    for (let e = Math.floor(Math.log10(lo)) - 1; e <= Math.ceil(Math.log10(hi)); e++) {
      for (const s of steps) {
        const v = Number((s * 10 ** e).toPrecision(6));
        if (v >= lo && v <= hi) out.push(v);
      }
    }
    if (out.length > max && best.length > 0) break;
    best = out;
    if (out.length >= min) break;
  }
  if (best.length > max) {
    const every = Math.ceil(best.length / max);
    best = best.filter((_, i) => i % every === 0);
  }
  return best;
}

/** Ticks for a linear axis: a 1, 2 or 5 × 10ⁿ step giving about `target` ticks. */
export function linearTicks(lo: number, hi: number, target = 5): number[] {
  if (!(hi > lo)) return [lo];
  const raw = (hi - lo) / target;
  const mag = 10 ** Math.floor(Math.log10(raw));
  const step = [1, 2, 5, 10].map((s) => s * mag).find((s) => s >= raw) ?? 10 * mag;
  const out: number[] = [];
  for (let v = Math.ceil(lo / step) * step; v <= hi + step * 1e-9; v += step) out.push(Number(v.toPrecision(12)));
  return out;
}

/** A scale over [lo, hi] padded by `pad` of its width on each side (in log units on a log axis). */
export function makeScale(kind: 'log' | 'linear', lo: number, hi: number, p0: number, p1: number, pad = 0.04): Scale {
  let a = kind === 'log' ? Math.log(lo) : lo;
  let b = kind === 'log' ? Math.log(hi) : hi;
  if (!(b > a)) {
    const half = kind === 'log' ? 0.1 : Math.max(Math.abs(a) * 0.1, 1);
    a -= half;
    b += half;
  }
  const w = b - a;
  a -= w * pad;
  b += w * pad;
  const plo = kind === 'log' ? Math.exp(a) : a;
  const phi = kind === 'log' ? Math.exp(b) : b;
  const map = (v: number) => {
    const u = kind === 'log' ? Math.log(v) : v;
    return p0 + ((u - a) / (b - a)) * (p1 - p0);
  };
  const ticks = kind === 'log' ? logTicks(plo, phi) : linearTicks(plo, phi);
  return { kind, lo: plo, hi: phi, p0, p1, map, ticks };
}

/** Year ticks: every 1, 2, 5, 10 or 20 years, about five of them. */
export function yearTicks(first: number, last: number): number[] {
  const span = Math.max(1, last - first);
  const step = [1, 2, 5, 10, 20, 50].find((s) => span / s <= 6) ?? 100;
  const out: number[] = [];
  for (let y = Math.ceil(first / step) * step; y <= last; y += step) out.push(y);
  return out;
}

/** Min and max of the finite, (for log axes) positive values. */
export function extent(values: Iterable<number>, positiveOnly: boolean): [number, number] | null {
  let lo = Infinity;
  let hi = -Infinity;
  for (const v of values) {
    if (!Number.isFinite(v) || (positiveOnly && v <= 0)) continue;
    if (v < lo) lo = v;
    if (v > hi) hi = v;
  }
  return lo <= hi ? [lo, hi] : null;
}

/** Two-decimal coordinates keep the path data short. */
export const px = (v: number) => Math.round(v * 100) / 100;

export function polyline(points: { x: number; y: number }[]): string {
  return points.map((p, i) => `${i ? 'L' : 'M'}${px(p.x)} ${px(p.y)}`).join(' ');
}

export function rect(x0: number, y0: number, x1: number, y1: number): string {
  const [l, r] = x0 < x1 ? [x0, x1] : [x1, x0];
  const [t, b] = y0 < y1 ? [y0, y1] : [y1, y0];
  return `M${px(l)} ${px(t)} L${px(r)} ${px(t)} L${px(r)} ${px(b)} L${px(l)} ${px(b)} Z`;
}
