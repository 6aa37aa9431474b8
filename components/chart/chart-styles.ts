import { chartColors, type } from '@/components/theme';

/** Room around the plot for tick labels and axis titles. */
export const CHART_PADDING = { top: 16, right: 16, bottom: 48, left: 56 } as const;

export function axisStyle(horizontal: boolean) {
  return {
    axis: { stroke: chartColors.axis, strokeWidth: 1 },
    grid: { stroke: chartColors.grid, strokeWidth: 1 },
    ticks: { stroke: chartColors.axis, size: 4 },
    tickLabels: { fill: chartColors.axis, fontSize: 11, fontFamily: type.caption.fontFamily, padding: 4 },
    axisLabel: { fill: chartColors.axis, fontSize: 12, fontFamily: type.label.fontFamily, padding: horizontal ? 30 : 40 },
  };
}
