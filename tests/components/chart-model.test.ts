// What the charts draw, decided before drawing: the band only for a bounded interval, the
// regional curve for a substitute, domains that keep an extrapolated threshold in view,
// log ticks in real units. Inputs follow the engine's output shape.
import { curveChartModel, pathChartModel } from '@/lib/chart-model';
import { formatTick, logTicks } from '@/lib/chart-scale';
import { curveChartSummary } from '@/lib/chart-summary';
import { runUnits } from '@/lib/units';

import { estimateRecord, notEstimableRecord, run, wholeLineRecord } from './support/estimates';

describe('curve chart model', () => {
  it('has a band for a bounded Fieller interval, inside the x domain', () => {
    const m = curveChartModel(estimateRecord({}));
    expect(m.band).toEqual({ lo: 26000, hi: 36000 });
    expect(m.threshold).toBe(30000);
    expect(m.xDomain[0]).toBeLessThan(14000);
    expect(m.xDomain[1]).toBeGreaterThan(36000);
    expect(m.latest?.year).toBe(2025);
    expect(m.curveIsRegional).toBe(false);
    expect(m.reference.length).toBe(41);
  });

  it('has no band for the whole line, nor for two rays', () => {
    expect(curveChartModel(wholeLineRecord()).band).toBeNull();
    const r = estimateRecord({});
    const twoRays = {
      ...r,
      threshold: {
        ...r.threshold!,
        intervalBounded: false,
        fieller: { kind: 'two_rays' as const, levelLo: 20000, levelHi: 60000 },
      },
      standing: { ...r.standing, intervalBounded: false, levelLo: 20000, levelHi: 60000 },
    };
    const m = curveChartModel(twoRays);
    expect(m.band).toBeNull();
    expect(m.threshold).toBe(30000);
    expect(pathChartModel(twoRays).band).toBeNull();
  });

  it('draws the regional curve as the main line for a substitute, with no second reference', () => {
    const m = curveChartModel(estimateRecord({ status: 'substitute', curve: [] }));
    expect(m.curveIsRegional).toBe(true);
    expect(m.curve.length).toBe(41);
    expect(m.reference).toEqual([]);
  });

  it('keeps an extrapolated threshold in view, but cuts an absurd interval end at the frame', () => {
    const r = estimateRecord({});
    const far = {
      ...r,
      threshold: { ...r.threshold!, level: 50000, extrapolated: true },
      standing: { ...r.standing, levelLo: 40000, levelHi: 1e12 },
    };
    const m = curveChartModel(far);
    expect(m.threshold).toBe(50000);
    // Observed incomes end near 29,500; the frame stretches at most ×3 beyond (plus padding).
    expect(m.xDomain[1]).toBeLessThan(29500 * 3 * 1.1);
    expect(m.band?.hi).toBe(m.xDomain[1]);
  });

  it('has neither threshold nor band when not estimable', () => {
    const m = curveChartModel(notEstimableRecord());
    expect(m.threshold).toBeNull();
    expect(m.band).toBeNull();
    expect(m.curve).toEqual([]);
    expect(m.points.length).toBe(6);
  });
});

describe('path chart model', () => {
  it('carries the recent trend forward to just past the projected crossing', () => {
    const m = pathChartModel(estimateRecord({}));
    expect(m.path[0]).toEqual({ x: 2006, y: 14000 });
    expect(m.projection[0].x).toBe(2025);
    expect(m.projection[m.projection.length - 1].x).toBe(2033);
    // ln growth 0.04 a year: eight years on, income is exp(0.32) times the latest.
    const last = m.path[m.path.length - 1].y;
    expect(m.projection[8].y / last).toBeCloseTo(Math.exp(0.32), 10);
    expect(m.band).toEqual({ lo: 26000, hi: 36000 });
  });

  it('draws ten years of trend when not on current trend', () => {
    const m = pathChartModel(
      estimateRecord({
        projection: { status: 'not_on_current_trend', crossingYear: null, earliest: null, latest: null, note: null },
        trendPerYear: -0.01,
      }),
    );
    expect(m.projection[m.projection.length - 1].x).toBe(2035);
  });
});

describe('log ticks', () => {
  it('uses 1-2-5 steps inside the range', () => {
    expect(logTicks(8000, 60000)).toEqual([10000, 20000, 50000]);
    expect(logTicks(3, 12)).toEqual([3, 5, 7, 10]);
  });
  it('falls back to evenly spaced round values in a narrow range', () => {
    expect(logTicks(6.1, 8.3)).toEqual([6.5, 7, 7.5, 8]);
    expect(logTicks(13000, 24000)).toEqual([14000, 16000, 18000, 20000, 22000, 24000]);
    expect(logTicks(10500, 23000)).toEqual([12000, 14000, 16000, 18000, 20000, 22000]);
  });
  it('formats ticks compactly in real units', () => {
    expect(formatTick(20000)).toBe('20k');
    expect(formatTick(1500000)).toBe('1.5M');
    expect(formatTick(5)).toBe('5');
    expect(formatTick(0.5)).toBe('0.5');
  });
});

describe('a threshold far outside the observed incomes', () => {
  it('widens nothing, is not marked, and the summary says it lies off the chart', () => {
    const r = estimateRecord({});
    const far = {
      ...r,
      threshold: { ...r.threshold!, level: 119, extrapolated: true },
      standing: { ...r.standing, intervalBounded: false, levelLo: null, levelHi: null },
    };
    const m = curveChartModel(far);
    expect(m.threshold).toBeNull();
    expect(m.band).toBeNull();
    // The frame stays around the observed incomes (14,000–29,540, padded by 8%).
    expect(m.xDomain[0]).toBeCloseTo(14000 / 1.08, 6);
    // The income unit comes from the run's catalogue labels (support/estimates.ts run.units).
    expect(curveChartSummary(far, runUnits(run))).toMatch(
      /The turning point lies at 119 € per person, beyond the observed incomes, too far from the observed incomes to fall inside the chart \(interval not bounded at 95%\)\./,
    );
  });
});
