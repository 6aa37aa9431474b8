import { lazy, useMemo } from 'react';

import { chartColors, layout } from '@/components/theme';
import { useTextScale } from '@/hooks/use-text-scale';
import { pathChartModel } from '@/lib/chart-model';
import { pathChartSummary } from '@/lib/chart-summary';
import type { EstimateRecord } from '@/contracts/estimates';
import { levelPercent, METHOD_LABEL, notBoundedText } from '@/lib/estimate-words';
import { nameWithUnit, UNKNOWN_UNITS, type RunUnits } from '@/lib/units';

import { ChartFrame } from './chart-frame';
import { axisTitlesInside, chartHeight } from './chart-styles';
import { ChartLegend, type LegendItem } from './chart-legend';
import { loadDrawings } from './load-drawings';

const PathChartSvg = lazy(() => loadDrawings().then((m) => ({ default: m.PathChartSvg })));

/** Income over the years against the threshold line and its band; the projection dashed. */
export function PathChart({ record, units = UNKNOWN_UNITS }: { record: EstimateRecord; units?: RunUnits }) {
  const model = useMemo(() => pathChartModel(record), [record]);
  const summary = useMemo(() => pathChartSummary(record, units), [record, units]);
  const level = record.model.level;
  const textScale = useTextScale();
  const height = chartHeight(layout.pathChartHeight, textScale);
  const titles = { x: 'Year', y: `${units.incomeName} (log)` };
  const inside = axisTitlesInside(textScale);
  const items: LegendItem[] = [
    { key: 'path', label: nameWithUnit(units.incomeName, units.incomeUnit), swatch: 'line', color: chartColors.curve },
  ];
  if (model.projection.length > 1)
    items.push({
      key: 'projection',
      label: 'Recent trend, carried forward',
      swatch: 'dash',
      color: chartColors.projection,
    });
  if (model.threshold !== null)
    items.push({ key: 'threshold', label: 'Threshold', swatch: 'dash', color: chartColors.threshold });
  if (model.band) {
    items.push({
      key: 'band',
      label: `${levelPercent(level)} ${METHOD_LABEL[record.standing.intervalMethod]} interval`,
      swatch: 'band',
      color: chartColors.band,
    });
  } else if (model.threshold !== null) {
    items.push({ key: 'no-band', label: `No band: ${notBoundedText(level)}`, swatch: 'line', color: chartColors.grid });
  }
  return (
    <ChartFrame
      title="Income over the years"
      summary={summary}
      height={height}
      axisTitles={inside ? undefined : titles}
      testID="path-chart"
      legend={<ChartLegend items={items} />}
    >
      {(width) => (
        <PathChartSvg
          model={model}
          width={width}
          height={height}
          xTitle={inside ? titles.x : null}
          yTitle={inside ? titles.y : null}
          textScale={textScale}
        />
      )}
    </ChartFrame>
  );
}
