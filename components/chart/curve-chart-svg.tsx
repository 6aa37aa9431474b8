// The curve chart's drawing (victory-native 36 on react-native-svg). Loaded on its own,
// after the card has mounted, so the SVG code never delays the headline.
import { VictoryArea } from 'victory-native/lib/components/victory-area';
import { VictoryAxis } from 'victory-native/lib/components/victory-axis';
import { VictoryChart } from 'victory-native/lib/components/victory-chart';
import { VictoryLine } from 'victory-native/lib/components/victory-line';
import { VictoryScatter } from 'victory-native/lib/components/victory-scatter';

import { chartColors, type } from '@/components/theme';
import { formatTick } from '@/lib/chart-scale';
import type { CurveChartModel } from '@/lib/chart-model';

import { axisStyle, chartPadding } from './chart-styles';

export type CurveChartSvgProps = {
  model: CurveChartModel;
  width: number;
  height: number;
  /** Axis titles, drawn inside at the default text size (null: the frame shows them as text). */
  xTitle: string | null;
  yTitle: string | null;
  textScale?: number;
};

export default function CurveChartSvg({ model: m, width, height, xTitle, yTitle, textScale = 1 }: CurveChartSvgProps) {
  const [y0, y1] = m.yDomain;
  return (
    <VictoryChart
      width={width}
      height={height}
      padding={chartPadding(textScale)}
      scale={{ x: 'log', y: 'log' }}
      domain={{ x: m.xDomain, y: m.yDomain }}
    >
      <VictoryAxis
        tickValues={m.xTicks}
        tickFormat={(t: number) => formatTick(t)}
        label={xTitle ?? undefined}
        style={axisStyle(true, textScale)}
      />
      <VictoryAxis
        dependentAxis
        tickValues={m.yTicks}
        tickFormat={(t: number) => formatTick(t)}
        label={yTitle ?? undefined}
        style={axisStyle(false, textScale)}
      />
      {m.band ? (
        <VictoryArea
          name="threshold-band"
          data={[
            { x: m.band.lo, y: y1, y0 },
            { x: m.band.hi, y: y1, y0 },
          ]}
          style={{ data: { fill: chartColors.band, stroke: chartColors.threshold, strokeWidth: 1, fillOpacity: 1 } }}
        />
      ) : null}
      {m.threshold !== null ? (
        <VictoryLine
          name="threshold-line"
          data={[
            { x: m.threshold, y: y0 },
            { x: m.threshold, y: y1 },
          ]}
          style={{ data: { stroke: chartColors.threshold, strokeWidth: 2, strokeDasharray: '6,3' } }}
        />
      ) : null}
      {m.reference.length > 1 ? (
        <VictoryLine
          name="regional-reference"
          data={m.reference}
          style={{ data: { stroke: chartColors.pooled, strokeWidth: 1.5, strokeDasharray: '3,4' } }}
        />
      ) : null}
      {m.curve.length > 1 ? (
        <VictoryLine
          name="fitted-curve"
          data={m.curve}
          style={{
            data: {
              stroke: m.curveIsRegional ? chartColors.pooled : chartColors.curve,
              strokeWidth: 3,
              strokeDasharray: m.curveIsRegional ? '8,4' : undefined,
            },
          }}
        />
      ) : null}
      <VictoryScatter name="observed" data={m.points} size={3} style={{ data: { fill: chartColors.points } }} />
      {m.latest ? (
        <VictoryScatter
          name="latest"
          data={[m.latest]}
          size={7}
          labels={[String(m.latest.year)]}
          style={{
            data: { fill: chartColors.surface, stroke: chartColors.latest, strokeWidth: 3 },
            labels: { fill: chartColors.axis, fontSize: 12 * textScale, fontFamily: type.label.fontFamily },
          }}
        />
      ) : null}
    </VictoryChart>
  );
}
