import { lazy } from 'react';

import { ChartFrame } from '@/components/chart/chart-frame';
import { chartHeight } from '@/components/chart/chart-styles';
import { useTextScale } from '@/hooks/use-text-scale';
import type { Diagnostics } from '@/contracts/runs';

const ResidualPlotSvg = lazy(() => import('./residual-plot-svg'));

const HEIGHT = 180;

/** The residuals in words: how many years, the largest either way, and runs of one sign. */
export function residualSummary(residuals: Diagnostics['residualsByYear']): string {
  if (residuals.length === 0) return 'No residuals to show.';
  const hi = residuals.reduce((a, b) => (b.residual > a.residual ? b : a));
  const lo = residuals.reduce((a, b) => (b.residual < a.residual ? b : a));
  let longest = 1;
  let run = 1;
  for (let i = 1; i < residuals.length; i++) {
    run = Math.sign(residuals[i].residual) === Math.sign(residuals[i - 1].residual) ? run + 1 : 1;
    longest = Math.max(longest, run);
  }
  const fmt = (v: number) => (v >= 0 ? '+' : '−') + Math.abs(v).toFixed(3);
  return `${residuals.length} years, ${residuals[0].year}–${residuals[residuals.length - 1].year}. Largest above the curve ${fmt(hi.residual)} in ${hi.year}, largest below ${fmt(lo.residual)} in ${lo.year}. Longest run of one sign: ${longest} years${longest >= 6 ? ' (a sign of serial correlation)' : ''}.`;
}

/** Residuals year by year (model scale) as bars above and below zero. */
export function ResidualPlot({ residuals }: { residuals: Diagnostics['residualsByYear'] }) {
  const textScale = useTextScale();
  const height = chartHeight(HEIGHT, textScale);
  return (
    <ChartFrame title="Residuals by year" summary={residualSummary(residuals)} height={height} testID="residual-plot">
      {(width) => <ResidualPlotSvg residuals={residuals} width={width} height={height} textScale={textScale} />}
    </ChartFrame>
  );
}
