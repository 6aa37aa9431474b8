// The path chart's drawing: income by year against the threshold line and its band, the
// recent trend carried forward dashed. Loaded on its own after mount, like the curve chart.
import { VictoryArea } from 'victory-native/lib/components/victory-area';
import { VictoryAxis } from 'victory-native/lib/components/victory-axis';
import { VictoryChart } from 'victory-native/lib/components/victory-chart';
import { VictoryLine } from 'victory-native/lib/components/victory-line';
import { VictoryScatter } from 'victory-native/lib/components/victory-scatter';

import { chartColors } from '@/components/theme';
import { formatTick } from '@/lib/chart-scale';
import type { PathChartModel } from '@/lib/chart-model';

import { axisStyle, chartPadding } from './chart-styles';

export type PathChartSvgProps = {
  model: PathChartModel;
  width: number;
  height: number;
  /** the driver's name from the catalogue ("Real income per person") */
  /** Axis titles, drawn inside at the default text size (null: the frame shows them as text). */
  xTitle: string | null;
  yTitle: string | null;
  textScale?: number;
};

export default function PathChartSvg({ model: m, width, height, xTitle, yTitle, textScale = 1 }: PathChartSvgProps) {
  const [t0, t1] = m.yearDomain;
  const last = m.path[m.path.length - 1];
  return (
    <VictoryChart
      width={width}
      height={height}
      padding={chartPadding(textScale)}
      scale={{ x: 'linear', y: 'log' }}
      domain={{ x: m.yearDomain, y: m.incomeDomain }}
    >
      <VictoryAxis
        tickValues={m.yearTicks}
        tickFormat={(t: number) => String(t)}
        label={xTitle ?? undefined}
        style={axisStyle(true, textScale)}
      />
      <VictoryAxis
        dependentAxis
        tickValues={m.incomeTicks}
        tickFormat={(t: number) => formatTick(t)}
        label={yTitle ?? undefined}
        style={axisStyle(false, textScale)}
      />
      {m.band ? (
        <VictoryArea
          name="threshold-band"
          data={[
            { x: t0, y: m.band.hi, y0: m.band.lo },
            { x: t1, y: m.band.hi, y0: m.band.lo },
          ]}
          style={{ data: { fill: chartColors.band, stroke: chartColors.threshold, strokeWidth: 1, fillOpacity: 1 } }}
        />
      ) : null}
      {m.threshold !== null ? (
        <VictoryLine
          name="threshold-line"
          data={[
            { x: t0, y: m.threshold },
            { x: t1, y: m.threshold },
          ]}
          style={{ data: { stroke: chartColors.threshold, strokeWidth: 2, strokeDasharray: '6,3' } }}
        />
      ) : null}
      {m.projection.length > 1 ? (
        <VictoryLine
          name="projection"
          data={m.projection}
          style={{ data: { stroke: chartColors.projection, strokeWidth: 2.5, strokeDasharray: '5,4' } }}
        />
      ) : null}
      {m.path.length > 1 ? (
        <VictoryLine
          name="income-path"
          data={m.path}
          style={{ data: { stroke: chartColors.curve, strokeWidth: 2.5 } }}
        />
      ) : null}
      {last ? (
        <VictoryScatter
          name="latest"
          data={[last]}
          size={6}
          style={{ data: { fill: chartColors.surface, stroke: chartColors.latest, strokeWidth: 3 } }}
        />
      ) : null}
    </VictoryChart>
  );
}
