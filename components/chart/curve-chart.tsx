import { lazy, useMemo } from 'react';

import { chartColors, layout } from '@/components/theme';
import { useTextScale } from '@/hooks/use-text-scale';
import { curveChartModel } from '@/lib/chart-model';
import { curveChartSummary } from '@/lib/chart-summary';
import type { EstimateRecord } from '@/contracts/estimates';
import { levelPercent, METHOD_LABEL, notBoundedText } from '@/lib/estimate-words';
import { UNKNOWN_UNITS, type RunUnits } from '@/lib/units';

import { ChartFrame } from './chart-frame';
import { axisTitlesInside, chartHeight } from './chart-styles';
import { ChartLegend, type LegendItem } from './chart-legend';
import { loadDrawings } from './load-drawings';

const CurveChartSvg = lazy(() => loadDrawings().then((m) => ({ default: m.CurveChartSvg })));

/**
 * Observed years (emissions against income, log axes in real units), the fitted curve over
 * the observed range, the threshold with its band when the interval is bounded, the latest
 * year ringed and the regional pooled curve as a faint reference.
 */
export function CurveChart({ record, units = UNKNOWN_UNITS }: { record: EstimateRecord; units?: RunUnits }) {
  const model = useMemo(() => curveChartModel(record), [record]);
  const summary = useMemo(() => curveChartSummary(record, units), [record, units]);
  const level = record.model.level;
  const textScale = useTextScale();
  const height = chartHeight(layout.curveChartHeight, textScale);
  const titles = {
    x: `${units.incomeName} (log scale)`,
    y: `${units.emissionsUnit || units.emissionsName} (log scale)`,
  };
  const inside = axisTitlesInside(textScale);
  const items: LegendItem[] = [
    { key: 'observed', label: 'Observed years', swatch: 'dot', color: chartColors.points },
    { key: 'latest', label: `Latest year (${model.latest?.year ?? '—'})`, swatch: 'ring', color: chartColors.latest },
  ];
  if (model.curve.length > 1) {
    items.push(
      model.curveIsRegional
        ? { key: 'curve', label: 'Regional pooled curve (stands in)', swatch: 'dash', color: chartColors.pooled }
        : { key: 'curve', label: 'Fitted curve', swatch: 'line', color: chartColors.curve },
    );
  }
  if (model.reference.length > 1)
    items.push({ key: 'reference', label: 'Regional pooled curve', swatch: 'dash', color: chartColors.pooled });
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
      title={`${units.emissionsName} and income`}
      summary={summary}
      height={height}
      axisTitles={inside ? undefined : titles}
      testID="curve-chart"
      legend={<ChartLegend items={items} />}
    >
      {(width) => (
        <CurveChartSvg
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
