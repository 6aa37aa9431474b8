import { chartColors, type } from '@/components/theme';

/** Room around the plot for tick labels and axis titles, grown with the reader's text scale. */
export function chartPadding(scale = 1) {
  return { top: 16, right: 16, bottom: Math.round(48 * scale), left: Math.round(56 * scale) };
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
