// What each of the card's charts draws, decided apart from drawing: domains, ticks, the
// band (only for a bounded interval), the curve to use (the regional one for a substitute)
// and the projected path. Pure, so tests can check the rules without an SVG.
import { clamp, incomeDomain, logTicks, padLog } from './chart-scale';
import type { EstimateRecord, XY } from '@/contracts/estimates';

/** Whether the chart may draw a bounded band for the threshold: only a bounded interval. */
export function bandOf(r: EstimateRecord): { lo: number; hi: number } | null {
  const s = r.standing;
  if (!r.threshold || s.intervalBounded !== true || s.levelLo === null || s.levelHi === null) return null;
  if (!(s.levelLo > 0) || !(s.levelHi > s.levelLo)) return null;
  return { lo: s.levelLo, hi: s.levelHi };
}

/** The threshold a chart marks, if it has a positive one in real units. */
export function thresholdOf(r: EstimateRecord): number | null {
  const v = r.threshold?.level ?? null;
  return v !== null && v > 0 && Number.isFinite(v) ? v : null;
}

export type CurveChartModel = {
  xDomain: [number, number];
  yDomain: [number, number];
  xTicks: number[];
  yTicks: number[];
  points: { year: number; x: number; y: number }[];
  latest: { year: number; x: number; y: number } | null;
  /** The district's fitted curve, or the regional curve standing in for a substitute. */
  curve: XY[];
  curveIsRegional: boolean;
  /** The regional reference, drawn faint; empty when it is the main curve already. */
  reference: XY[];
  threshold: number | null;
  /** Present only when the interval is bounded. */
  band: { lo: number; hi: number } | null;
};

const positive = (p: XY) => p.x > 0 && p.y > 0 && Number.isFinite(p.x) && Number.isFinite(p.y);

export function curveChartModel(r: EstimateRecord): CurveChartModel {
  const points = r.points.filter(positive);
  const substitute = r.status === 'substitute';
  const curve = (substitute ? r.pooledCurve : r.curve).filter(positive);
  const reference = substitute ? [] : r.pooledCurve.filter(positive);
  const threshold = r.status === 'not_estimable' ? null : thresholdOf(r);
  const bandRaw = r.status === 'not_estimable' ? null : bandOf(r);
  const xDomain = incomeDomain(
    [...points.map((p) => p.x), ...curve.map((p) => p.x)],
    [threshold, bandRaw?.lo ?? null, bandRaw?.hi ?? null],
  );
  const ys = [...points, ...curve, ...reference].map((p) => p.y);
  const yDomain = ys.length ? padLog(Math.min(...ys), Math.max(...ys), 1.12) : ([1, 10] as [number, number]);
  const band = bandRaw
    ? { lo: clamp(bandRaw.lo, xDomain[0], xDomain[1]), hi: clamp(bandRaw.hi, xDomain[0], xDomain[1]) }
    : null;
  return {
    xDomain,
    yDomain,
    xTicks: logTicks(xDomain[0], xDomain[1]),
    yTicks: logTicks(yDomain[0], yDomain[1]),
    points,
    latest: points.length ? points[points.length - 1] : null,
    curve,
    curveIsRegional: substitute,
    reference,
    threshold: threshold !== null && threshold >= xDomain[0] && threshold <= xDomain[1] ? threshold : null,
    band: band && band.hi > band.lo ? band : null,
  };
}

export type PathChartModel = {
  yearDomain: [number, number];
  incomeDomain: [number, number];
  yearTicks: number[];
  incomeTicks: number[];
  path: { x: number; y: number }[];
  /** The recent trend carried forward from the latest year, dashed. */
  projection: { x: number; y: number }[];
  threshold: number | null;
  band: { lo: number; hi: number } | null;
};

/** How far ahead the dashed path runs: to the crossing (plus a little), else ten years. */
function horizon(r: EstimateRecord, last: number): number {
  const p = r.projection;
  if (p?.status === 'projected' && p.crossingYear !== null && p.crossingYear > last)
    return Math.min(p.crossingYear + 2, last + 30);
  return last + 10;
}

function yearTicks(a: number, b: number): number[] {
  const span = b - a;
  const step = span > 60 ? 20 : span > 30 ? 10 : span > 12 ? 5 : 2;
  const out: number[] = [];
  for (let y = Math.ceil(a / step) * step; y <= b; y += step) out.push(y);
  return out;
}

export function pathChartModel(r: EstimateRecord): PathChartModel {
  const path = r.points.filter((p) => p.x > 0).map((p) => ({ x: p.year, y: p.x }));
  const last = path[path.length - 1];
  const threshold = r.status === 'not_estimable' ? null : thresholdOf(r);
  const bandRaw = r.status === 'not_estimable' ? null : bandOf(r);
  let projection: { x: number; y: number }[] = [];
  if (last && r.trendPerYear !== null && Number.isFinite(r.trendPerYear) && r.status !== 'not_estimable') {
    const end = horizon(r, last.x);
    const g = r.trendPerYear;
    projection = Array.from({ length: end - last.x + 1 }, (_, i) => ({ x: last.x + i, y: last.y * Math.exp(g * i) }));
  }
  const first = path[0]?.x ?? 2000;
  const lastYear = projection.length ? projection[projection.length - 1].x : (last?.x ?? first + 1);
  const incomeDom = incomeDomain(
    [...path, ...projection].map((p) => p.y),
    [threshold, bandRaw?.lo ?? null, bandRaw?.hi ?? null],
    2.5,
  );
  const band = bandRaw
    ? { lo: clamp(bandRaw.lo, incomeDom[0], incomeDom[1]), hi: clamp(bandRaw.hi, incomeDom[0], incomeDom[1]) }
    : null;
  // The projection is cut at the frame (an off-trend path can run away).
  projection = projection.filter((p) => p.y >= incomeDom[0] && p.y <= incomeDom[1]);
  return {
    yearDomain: [first, Math.max(lastYear, first + 1)],
    incomeDomain: incomeDom,
    yearTicks: yearTicks(first, Math.max(lastYear, first + 1)),
    incomeTicks: logTicks(incomeDom[0], incomeDom[1]),
    path,
    projection,
    threshold: threshold !== null && threshold >= incomeDom[0] && threshold <= incomeDom[1] ? threshold : null,
    band: band && band.hi > band.lo ? band : null,
  };
}
