import { chartColors, type } from '@/components/theme';

/**
 * Axis titles sit inside the drawing at the default text size. With a larger text setting a
 * title no longer fits along its axis (the vertical one is longer than the chart is tall), so
 * it moves out of the drawing into text that wraps (ChartFrame's `axisTitles`).
 */
export function axisTitlesInside(scale = 1): boolean {
  return scale <= 1;
}

/** Room around the plot for tick labels (and axis titles inside), grown with the reader's text scale. */
export function chartPadding(scale = 1) {
  const inside = axisTitlesInside(scale);
  return {
    top: Math.round(16 * scale),
    right: Math.round(16 * scale),
    bottom: inside ? 48 : Math.round(22 * scale) + 12,
    left: inside ? 56 : Math.round(40 * scale) + 12,
  };
}

/** A chart's height for the text scale: larger tick labels take room, so the box grows a little. */
export function chartHeight(base: number, scale = 1): number {
  return Math.round(base * (1 + Math.max(0, scale - 1) * 0.25));
}

/** Axis inks and label sizes; SVG text is sized in px, so the text scale is applied here. */
export function axisStyle(horizontal: boolean, scale = 1) {
  return {
    axis: { stroke: chartColors.axis, strokeWidth: 1 },
    grid: { stroke: chartColors.grid, strokeWidth: 1 },
    ticks: { stroke: chartColors.axis, size: 4 },
    tickLabels: { fill: chartColors.axis, fontSize: 11 * scale, fontFamily: type.caption.fontFamily, padding: 4 },
    axisLabel: {
      fill: chartColors.axis,
      fontSize: 12 * scale,
      fontFamily: type.label.fontFamily,
      padding: (horizontal ? 30 : 40) * scale,
    },
  };
}
