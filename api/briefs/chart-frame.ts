/**
 * The frame every brief chart shares: a legend row on top, the y-axis label under it, the
 * plot with light grid lines and tick labels in real units, and the x-axis label at the
 * bottom. Returns the scales so a chart can place its marks. Pure: no fonts, no pdfkit.
 */
import type { BriefTone, ChartItem } from '../../contracts/briefs';
import { makeScale, px, type Scale } from './chart-axes';

export type LegendMark = 'dot' | 'line' | 'dash' | 'band' | 'faint';

export interface LegendEntry {
  label: string;
  tone: BriefTone;
  mark: LegendMark;
}

export interface AxisSpec {
  kind: 'log' | 'linear';
  lo: number;
  hi: number;
  label: string;
  format: (v: number) => string;
  /** Ticks to use instead of the scale's own (years). */
  ticks?: number[];
  pad?: number;
}

export interface Frame {
  items: ChartItem[];
  xs: Scale;
  ys: Scale;
  plot: { left: number; right: number; top: number; bottom: number };
}

export const TICK_SIZE = 6.5;
export const LABEL_SIZE = 7;
const LEGEND_SIZE = 7;
/** A rough average glyph width of the sans face, as a fraction of the size (for legend layout). */
const CHAR_WIDTH = 0.53;

/** Width a label will take, estimated (the scene is built without a font at hand). */
export function estimateWidth(text: string, size: number): number {
  return text.length * size * CHAR_WIDTH;
}

function legendSwatch(e: LegendEntry, x: number, baseline: number): ChartItem[] {
  const mid = baseline - LEGEND_SIZE * 0.33;
  switch (e.mark) {
    case 'dot':
      return [{ kind: 'circle', cx: px(x + 5), cy: px(mid), r: 2.2, fill: e.tone }];
    case 'band':
      return [
        {
          kind: 'path',
          d: `M${px(x)} ${px(mid - 3)} L${px(x + 11)} ${px(mid - 3)} L${px(x + 11)} ${px(mid + 3)} L${px(x)} ${px(mid + 3)} Z`,
          fill: e.tone,
          opacity: 0.35,
        },
      ];
    case 'dash':
      return [
        {
          kind: 'path',
          d: `M${px(x)} ${px(mid)} L${px(x + 11)} ${px(mid)}`,
          stroke: e.tone,
          width: 1.2,
          dash: [2.5, 1.5],
        },
      ];
    case 'faint':
      return [
        {
          kind: 'path',
          d: `M${px(x)} ${px(mid)} L${px(x + 11)} ${px(mid)}`,
          stroke: e.tone,
          width: 1.4,
          opacity: 0.55,
        },
      ];
    default:
      return [{ kind: 'path', d: `M${px(x)} ${px(mid)} L${px(x + 11)} ${px(mid)}`, stroke: e.tone, width: 1.4 }];
  }
}

export function buildFrame(width: number, height: number, legend: LegendEntry[], x: AxisSpec, y: AxisSpec): Frame {
  const items: ChartItem[] = [];
  // Legend rows: entries flow left to right and wrap.
  let lx = 0;
  let baseline = LEGEND_SIZE + 1;
  for (const e of legend) {
    const w = 14 + estimateWidth(e.label, LEGEND_SIZE) + 8;
    if (lx > 0 && lx + w > width) {
      lx = 0;
      baseline += LEGEND_SIZE + 4;
    }
    items.push(...legendSwatch(e, lx, baseline));
    items.push({
      kind: 'text',
      x: px(lx + 14),
      y: px(baseline),
      text: e.label,
      size: LEGEND_SIZE,
      tone: 'ink',
      anchor: 'start',
    });
    lx += w;
  }
  const yLabelBaseline = baseline + LABEL_SIZE + 5;
  items.push({
    kind: 'text',
    x: 0,
    y: px(yLabelBaseline),
    text: y.label,
    size: LABEL_SIZE,
    tone: 'muted',
    anchor: 'start',
  });
  const plot = { left: 32, right: width - 6, top: yLabelBaseline + 7, bottom: height - 21 };
  const xs = makeScale(x.kind, x.lo, x.hi, plot.left, plot.right, x.pad ?? 0.04);
  const ys = makeScale(y.kind, y.lo, y.hi, plot.bottom, plot.top, y.pad ?? 0.06);
  const xTicks = (x.ticks ?? xs.ticks).filter((t) => t >= xs.lo && t <= xs.hi);
  const yTicks = ys.ticks.filter((t) => t >= ys.lo && t <= ys.hi);
  const grid: string[] = [];
  for (const t of yTicks) grid.push(`M${px(plot.left)} ${px(ys.map(t))} L${px(plot.right)} ${px(ys.map(t))}`);
  for (const t of xTicks) grid.push(`M${px(xs.map(t))} ${px(plot.top)} L${px(xs.map(t))} ${px(plot.bottom)}`);
  if (grid.length) items.push({ kind: 'path', d: grid.join(' '), stroke: 'grid', width: 0.4 });
  items.push({
    kind: 'path',
    d: `M${px(plot.left)} ${px(plot.top)} L${px(plot.left)} ${px(plot.bottom)} L${px(plot.right)} ${px(plot.bottom)}`,
    stroke: 'muted',
    width: 0.6,
  });
  for (const t of yTicks) {
    items.push({
      kind: 'text',
      x: px(plot.left - 3),
      y: px(ys.map(t) + TICK_SIZE * 0.35),
      text: y.format(t),
      size: TICK_SIZE,
      tone: 'muted',
      anchor: 'end',
    });
  }
  for (const t of xTicks) {
    items.push({
      kind: 'text',
      x: px(xs.map(t)),
      y: px(plot.bottom + TICK_SIZE + 3),
      text: x.format(t),
      size: TICK_SIZE,
      tone: 'muted',
      anchor: 'middle',
    });
  }
  items.push({
    kind: 'text',
    x: px(plot.right),
    y: px(height - 2),
    text: x.label,
    size: LABEL_SIZE,
    tone: 'muted',
    anchor: 'end',
  });
  return { items, xs, ys, plot };
}

/** Clamps a value into a scale's domain. */
export function clampTo(s: Scale, v: number): number {
  return Math.min(s.hi, Math.max(s.lo, v));
}

export function inside(s: Scale, v: number): boolean {
  return v >= s.lo && v <= s.hi;
}
