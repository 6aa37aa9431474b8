/**
 * The brief charts as vector scenes (contracts/briefs.ts ChartScene):
 * - the curve chart: observed years, the fitted curve, the threshold with its band (the
 *   band only when the interval is bounded), the latest year highlighted, the regional
 *   pooled curve faint behind; log axes in real units under the log form;
 * - the path chart: the driver over the years against the threshold line and band, with
 *   the current trend projected as a dashed line;
 * - the regional pooled curve as an index (100 at the threshold).
 * Pure: the PDF renderer and the app's SVG draw the same scene.
 */
import type { ChartItem, ChartScene } from '../../contracts/briefs';
import { extent, polyline, px, rect, yearTicks } from './chart-axes';
import { buildFrame, clampTo, estimateWidth, inside, LABEL_SIZE, type LegendEntry } from './chart-frame';
import { formatLevel, formatTick } from './format';
import { inSentence } from './words';

export interface ThresholdMark {
  level: number;
  /** interval ends in real units, only when the interval is bounded */
  band: { lo: number; hi: number } | null;
}

/** How far outside the data a threshold may lie and still set the axis (a factor on log axes). */
const REACH = 3;

function axisKind(transform: string): 'log' | 'linear' {
  return transform === 'log' ? 'log' : 'linear';
}

/** Widens [lo, hi] to take in v when v is near enough the data to be worth the room. */
function reach(range: [number, number], v: number, kind: 'log' | 'linear'): [number, number] {
  const [lo, hi] = range;
  const near =
    kind === 'log' ? v > 0 && v >= lo / REACH && v <= hi * REACH : v >= lo - (hi - lo) && v <= hi + (hi - lo);
  return near ? [Math.min(lo, v), Math.max(hi, v)] : range;
}

function offChartNote(items: ChartItem[], text: string, side: 'left' | 'right', x: number, y: number): void {
  items.push({
    kind: 'text',
    x: px(x),
    y: px(y),
    text: side === 'right' ? `${text} →` : `← ${text}`,
    size: LABEL_SIZE,
    tone: 'threshold',
    anchor: side === 'right' ? 'end' : 'start',
    bold: true,
  });
}

export interface CurveChartInput {
  width: number;
  height: number;
  transform: string;
  points: { year: number; x: number; y: number }[];
  curve: { x: number; y: number }[];
  pooledCurve: { x: number; y: number }[];
  /** the pooled curve stands in for the district's own */
  substitute: boolean;
  threshold: ThresholdMark | null;
  levelText: string;
  xLabel: string;
  yLabel: string;
  /** the chart's title (default "Emissions and income"); briefs name the track's indicator */
  title?: string;
}

export function curveChart(input: CurveChartInput): ChartScene {
  const kind = axisKind(input.transform);
  const positive = kind === 'log';
  const main = input.substitute ? input.pooledCurve : input.curve;
  const faint = input.substitute ? [] : input.pooledCurve;
  const xr0 = extent(
    [...input.points.map((p) => p.x), ...main.map((p) => p.x), ...faint.map((p) => p.x)],
    positive,
  ) ?? [1, 10];
  const xr = input.threshold ? reach(xr0, input.threshold.level, kind) : xr0;
  const yr = extent([...input.points.map((p) => p.y), ...main.map((p) => p.y), ...faint.map((p) => p.y)], positive) ?? [
    1, 10,
  ];
  const legend: LegendEntry[] = [
    { label: 'observed years', tone: 'point', mark: 'dot' },
    { label: 'latest year', tone: 'latest', mark: 'dot' },
  ];
  if (main.length)
    legend.push({
      label: input.substitute ? 'regional curve (stands in)' : 'fitted curve',
      tone: 'curve',
      mark: 'line',
    });
  if (faint.length) legend.push({ label: 'regional pooled curve', tone: 'pooled', mark: 'faint' });
  if (input.threshold)
    legend.push(
      input.threshold.band
        ? { label: `threshold, ${input.levelText} band`, tone: 'band', mark: 'band' }
        : { label: 'threshold (not bounded)', tone: 'threshold', mark: 'dash' },
    );
  const f = buildFrame(
    input.width,
    input.height,
    legend,
    { kind, lo: xr[0], hi: xr[1], label: `${input.xLabel}${kind === 'log' ? ' (log scale)' : ''}`, format: formatTick },
    { kind, lo: yr[0], hi: yr[1], label: `${input.yLabel}${kind === 'log' ? ' (log scale)' : ''}`, format: formatTick },
  );
  const { xs, ys, plot, items } = f;
  const t = input.threshold;
  if (t?.band && t.band.hi > xs.lo && t.band.lo < xs.hi && (!positive || t.band.hi > 0)) {
    const lo = clampTo(xs, positive ? Math.max(t.band.lo, xs.lo) : t.band.lo);
    items.push({
      kind: 'path',
      d: rect(xs.map(lo), plot.top, xs.map(clampTo(xs, t.band.hi)), plot.bottom),
      fill: 'band',
      opacity: 0.35,
    });
  }
  if (faint.length)
    items.push({
      kind: 'path',
      d: polyline(faint.map((p) => ({ x: xs.map(p.x), y: ys.map(clampTo(ys, p.y)) }))),
      stroke: 'pooled',
      width: 1.4,
      opacity: 0.55,
    });
  if (main.length)
    items.push({
      kind: 'path',
      d: polyline(main.map((p) => ({ x: xs.map(p.x), y: ys.map(clampTo(ys, p.y)) }))),
      stroke: 'curve',
      width: 1.6,
    });
  if (t) {
    if (inside(xs, t.level)) {
      const x = xs.map(t.level);
      items.push({
        kind: 'path',
        d: `M${px(x)} ${px(plot.top)} L${px(x)} ${px(plot.bottom)}`,
        stroke: 'threshold',
        width: 0.9,
        dash: [3, 2],
      });
      const label = `threshold ${formatLevel(t.level)}`;
      const right = x + 3 + estimateWidth(label, LABEL_SIZE) < plot.right;
      // The label goes where the curve is not: at the foot of the line when the curve runs
      // high there (a peak), at the top otherwise.
      const near = main.length
        ? main.reduce((a, b) => (Math.abs(b.x - t.level) < Math.abs(a.x - t.level) ? b : a))
        : null;
      const high = near !== null && ys.map(clampTo(ys, near.y)) < (plot.top + plot.bottom) / 2;
      items.push({
        kind: 'text',
        x: px(right ? x + 3 : x - 3),
        y: px(high ? plot.bottom - 4 : plot.top + LABEL_SIZE + 1),
        text: label,
        size: LABEL_SIZE,
        tone: 'threshold',
        anchor: right ? 'start' : 'end',
        bold: true,
      });
    } else {
      const side = t.level > xs.hi ? 'right' : 'left';
      offChartNote(
        items,
        `threshold ${formatLevel(t.level)}`,
        side,
        side === 'right' ? plot.right - 2 : plot.left + 2,
        plot.top + LABEL_SIZE + 1,
      );
    }
  }
  const pts = input.points.filter((p) => !positive || (p.x > 0 && p.y > 0));
  for (const p of pts.slice(0, -1))
    items.push({ kind: 'circle', cx: px(xs.map(p.x)), cy: px(ys.map(p.y)), r: 1.7, fill: 'point', opacity: 0.8 });
  const last = pts[pts.length - 1];
  if (last) {
    const cx = xs.map(last.x);
    const cy = ys.map(last.y);
    items.push({ kind: 'circle', cx: px(cx), cy: px(cy), r: 3.2, fill: 'latest', stroke: 'ink', width: 0.6 });
    const label = String(last.year);
    const left = cx + 5 + estimateWidth(label, LABEL_SIZE) > plot.right;
    items.push({
      kind: 'text',
      x: px(left ? cx - 5 : cx + 5),
      y: px(cy - 4),
      text: label,
      size: LABEL_SIZE,
      tone: 'ink',
      anchor: left ? 'end' : 'start',
      bold: true,
    });
  }
  const description = `${input.yLabel} against ${inSentence(input.xLabel)} for each observed year, ${main.length ? (input.substitute ? 'with the regional pooled curve standing in' : 'with the fitted curve') : 'without a fitted curve'}${t ? (t.band ? ` and the threshold ${formatLevel(t.level)} with its ${input.levelText} band` : ` and the threshold ${formatLevel(t.level)} (interval not bounded)`) : ''}.`;
  return { width: input.width, height: input.height, title: input.title ?? 'Emissions and income', description, items };
}

export interface PathChartInput {
  width: number;
  height: number;
  transform: string;
  points: { year: number; x: number }[];
  threshold: ThresholdMark | null;
  levelText: string;
  /** slope of ln(driver) per year over the trend window */
  trendPerYear: number | null;
  projection: { status: string; crossingYear: number | null } | null;
  xLabel: string;
}

/** Longest the dashed projection runs on the chart, in years. */
const PROJECTION_YEARS = 30;
const DEFAULT_PROJECTION_YEARS = 10;

export function pathChart(input: PathChartInput): ChartScene {
  const kind = axisKind(input.transform);
  const positive = kind === 'log';
  const pts = input.points.filter((p) => !positive || p.x > 0);
  const first = pts[0]?.year ?? 2000;
  const lastPoint = pts[pts.length - 1] ?? null;
  const lastYear = lastPoint?.year ?? first;
  const g = input.trendPerYear;
  const crossing = input.projection?.status === 'projected' ? input.projection.crossingYear : null;
  const crossingOnChart = crossing !== null && crossing > lastYear && crossing <= lastYear + PROJECTION_YEARS;
  const endYear =
    lastPoint && g !== null && Number.isFinite(g)
      ? crossingOnChart
        ? crossing!
        : lastYear + DEFAULT_PROJECTION_YEARS
      : lastYear;
  const projected: { year: number; x: number }[] = [];
  if (lastPoint && endYear > lastYear) {
    for (let yr = lastYear; yr <= endYear; yr++)
      projected.push({ year: yr, x: lastPoint.x * Math.exp(g! * (yr - lastYear)) });
  }
  let yr = extent([...pts.map((p) => p.x), ...projected.map((p) => p.x)], positive) ?? [1, 10];
  if (input.threshold) yr = reach(yr, input.threshold.level, kind);
  const legend: LegendEntry[] = [
    { label: inSentence(input.xLabel), tone: 'curve', mark: 'line' },
    { label: 'latest year', tone: 'latest', mark: 'dot' },
  ];
  if (projected.length) legend.push({ label: 'current trend', tone: 'projection', mark: 'dash' });
  if (input.threshold)
    legend.push(
      input.threshold.band
        ? { label: `threshold, ${input.levelText} band`, tone: 'band', mark: 'band' }
        : { label: 'threshold (not bounded)', tone: 'threshold', mark: 'dash' },
    );
  const f = buildFrame(
    input.width,
    input.height,
    legend,
    {
      kind: 'linear',
      lo: first,
      hi: Math.max(endYear, first + 1),
      label: 'year',
      format: (v) => String(v),
      ticks: yearTicks(first, Math.max(endYear, first + 1)),
      pad: 0.03,
    },
    { kind, lo: yr[0], hi: yr[1], label: `${input.xLabel}${kind === 'log' ? ' (log scale)' : ''}`, format: formatTick },
  );
  const { xs, ys, plot, items } = f;
  const t = input.threshold;
  if (t?.band && t.band.hi > ys.lo && t.band.lo < ys.hi) {
    const lo = clampTo(ys, positive ? Math.max(t.band.lo, ys.lo) : t.band.lo);
    items.push({
      kind: 'path',
      d: rect(plot.left, ys.map(lo), plot.right, ys.map(clampTo(ys, t.band.hi))),
      fill: 'band',
      opacity: 0.35,
    });
  }
  if (t) {
    if (inside(ys, t.level)) {
      const y = ys.map(t.level);
      items.push({
        kind: 'path',
        d: `M${px(plot.left)} ${px(y)} L${px(plot.right)} ${px(y)}`,
        stroke: 'threshold',
        width: 0.9,
        dash: [3, 2],
      });
      items.push({
        kind: 'text',
        x: px(plot.left + 3),
        y: px(y - 3),
        text: `threshold ${formatLevel(t.level)}`,
        size: LABEL_SIZE,
        tone: 'threshold',
        anchor: 'start',
        bold: true,
      });
    } else {
      items.push({
        kind: 'text',
        x: px(plot.left + 3),
        y: px(t.level > ys.hi ? plot.top + LABEL_SIZE : plot.bottom - 3),
        text: `${t.level > ys.hi ? '↑' : '↓'} threshold ${formatLevel(t.level)} (off the chart)`,
        size: LABEL_SIZE,
        tone: 'threshold',
        anchor: 'start',
        bold: true,
      });
    }
  }
  if (pts.length)
    items.push({
      kind: 'path',
      d: polyline(pts.map((p) => ({ x: xs.map(p.year), y: ys.map(p.x) }))),
      stroke: 'curve',
      width: 1.5,
    });
  if (projected.length)
    items.push({
      kind: 'path',
      d: polyline(projected.map((p) => ({ x: xs.map(p.year), y: ys.map(clampTo(ys, p.x)) }))),
      stroke: 'projection',
      width: 1.3,
      dash: [3, 2],
    });
  if (t && crossingOnChart && inside(ys, t.level)) {
    const cx = xs.map(crossing!);
    const cy = ys.map(t.level);
    items.push({ kind: 'circle', cx: px(cx), cy: px(cy), r: 2.6, fill: 'projection' });
    // The dashed path reaches the point from below when income grows: label above it then.
    const above = (g ?? 0) > 0;
    items.push({
      kind: 'text',
      x: px(cx - 4),
      y: px(above ? cy - 4 : cy + LABEL_SIZE + 3),
      text: `about ${crossing}`,
      size: LABEL_SIZE,
      tone: 'projection',
      anchor: 'end',
      bold: true,
    });
  } else if (crossing !== null && !crossingOnChart && crossing > lastYear) {
    offChartNote(items, `crossing about ${crossing}`, 'right', plot.right - 2, plot.bottom - 4);
  }
  if (lastPoint) {
    const cx = xs.map(lastPoint.year);
    const cy = ys.map(lastPoint.x);
    items.push({ kind: 'circle', cx: px(cx), cy: px(cy), r: 3.2, fill: 'latest', stroke: 'ink', width: 0.6 });
    const label = `${lastPoint.year}: ${formatLevel(lastPoint.x)}`;
    items.push({
      kind: 'text',
      x: px(cx - 5),
      y: px(cy - 5),
      text: label,
      size: LABEL_SIZE,
      tone: 'ink',
      anchor: 'end',
      bold: true,
    });
  }
  const description = `${input.xLabel} from ${first} to ${lastYear}${projected.length ? `, with the current trend projected to ${endYear}` : ''}${t ? `, against the threshold ${formatLevel(t.level)}${t.band ? ` and its ${input.levelText} band` : ' (interval not bounded)'}` : ''}.`;
  return { width: input.width, height: input.height, title: 'Income over the years', description, items };
}

export interface PooledChartInput {
  width: number;
  height: number;
  transform: string;
  /** slope coefficients of x, x², (x³) on the model scale */
  slopes: number[];
  levelMin: number;
  levelMax: number;
  threshold: ThresholdMark | null;
  levelText: string;
  xLabel: string;
  /** the watched indicator's name inside a sentence (default "emissions") */
  pressure?: string;
}

const POOLED_POINTS = 61;

/**
 * The pooled curve has no intercept (fixed effects absorb the levels), so it is drawn as
 * an index: 100 at the threshold (or at mid-range income when there is none). Log form:
 * 100·exp(P(ln x) − P(ln x*)); level form: P(x) − P(x*), the difference from the value there.
 */
export function pooledChart(input: PooledChartInput): ChartScene {
  const log = input.transform === 'log';
  const kind = axisKind(input.transform);
  const u = (v: number) => (log ? Math.log(v) : v);
  const poly = (x: number) => input.slopes.reduce((s, b, j) => s + b * x ** (j + 1), 0);
  const anchor =
    input.threshold && input.threshold.level > 0
      ? input.threshold.level
      : log
        ? Math.sqrt(input.levelMin * input.levelMax)
        : (input.levelMin + input.levelMax) / 2;
  const base = poly(u(anchor));
  const index = (x: number) => (log ? 100 * Math.exp(poly(u(x)) - base) : poly(u(x)) - base);
  const a = u(input.levelMin);
  const b = u(input.levelMax);
  const curve: { x: number; y: number }[] = [];
  for (let i = 0; i < POOLED_POINTS; i++) {
    const v = a + ((b - a) * i) / (POOLED_POINTS - 1);
    const x = log ? Math.exp(v) : v;
    curve.push({ x, y: index(x) });
  }
  let xr: [number, number] = [input.levelMin, input.levelMax];
  if (input.threshold) xr = reach(xr, input.threshold.level, kind);
  const yr = extent(
    curve.map((p) => p.y),
    false,
  ) ?? [0, 1];
  const atThreshold = input.threshold !== null && input.threshold.level > 0;
  const legend: LegendEntry[] = [{ label: 'regional pooled curve', tone: 'curve', mark: 'line' }];
  if (input.threshold)
    legend.push(
      input.threshold.band
        ? { label: `threshold, ${input.levelText} band`, tone: 'band', mark: 'band' }
        : { label: 'threshold (not bounded)', tone: 'threshold', mark: 'dash' },
    );
  const pressure = input.pressure ?? 'emissions';
  const yLabel = log
    ? `${pressure} index (${atThreshold ? 'at the threshold' : 'at mid-range income'} = 100)`
    : `${pressure}, difference from the value ${atThreshold ? 'at the threshold' : 'at mid-range income'}`;
  const f = buildFrame(
    input.width,
    input.height,
    legend,
    { kind, lo: xr[0], hi: xr[1], label: `${input.xLabel}${log ? ' (log scale)' : ''}`, format: formatTick },
    { kind: 'linear', lo: yr[0], hi: yr[1], label: yLabel, format: formatTick },
  );
  const { xs, ys, plot, items } = f;
  const t = input.threshold;
  if (t?.band && t.band.hi > xs.lo && t.band.lo < xs.hi) {
    const lo = clampTo(xs, log ? Math.max(t.band.lo, xs.lo) : t.band.lo);
    items.push({
      kind: 'path',
      d: rect(xs.map(lo), plot.top, xs.map(clampTo(xs, t.band.hi)), plot.bottom),
      fill: 'band',
      opacity: 0.35,
    });
  }
  items.push({
    kind: 'path',
    d: polyline(curve.map((p) => ({ x: xs.map(p.x), y: ys.map(p.y) }))),
    stroke: 'curve',
    width: 1.8,
  });
  if (t) {
    if (inside(xs, t.level)) {
      const x = xs.map(t.level);
      items.push({
        kind: 'path',
        d: `M${px(x)} ${px(plot.top)} L${px(x)} ${px(plot.bottom)}`,
        stroke: 'threshold',
        width: 0.9,
        dash: [3, 2],
      });
      items.push({
        kind: 'text',
        x: px(x + 3),
        y: px(plot.top + LABEL_SIZE + 1),
        text: `threshold ${formatLevel(t.level)}`,
        size: LABEL_SIZE,
        tone: 'threshold',
        anchor: 'start',
        bold: true,
      });
    } else {
      const side = t.level > xs.hi ? 'right' : 'left';
      offChartNote(
        items,
        `threshold ${formatLevel(t.level)}`,
        side,
        side === 'right' ? plot.right - 2 : plot.left + 2,
        plot.top + LABEL_SIZE + 1,
      );
    }
  }
  const description = `The region's pooled curve over the observed income range, as an index${t ? `, with the threshold ${formatLevel(t.level)}${t.band ? ` and its ${input.levelText} band` : ' (interval not bounded)'}` : ''}.`;
  return { width: input.width, height: input.height, title: 'Regional pooled curve', description, items };
}
