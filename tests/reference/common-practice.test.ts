import { fitCurve, signRuleReading, type CurveFit } from '../../api/estimation';
import { loadPanelA } from './panel-a-loader';

// Rules of the trade, marked "common practice" (no external source): the five sign readings
// of b1 and b2; the antilog turning point is always positive; a turning point outside the
// observed range means the curve is monotone where there is data.

describe('common practice', () => {
  test('the five sign readings of b1 and b2 (common practice)', () => {
    expect(signRuleReading(2, -0.1, 0.001, 0.001, 0.05).reading).toBe('inverted_u'); // b1 > 0, b2 < 0
    expect(signRuleReading(-2, 0.1, 0.001, 0.001, 0.05).reading).toBe('u'); // b1 < 0, b2 > 0
    expect(signRuleReading(2, 0.1, 0.001, 0.001, 0.05).reading).toBe('increasing'); // both > 0
    expect(signRuleReading(-2, -0.1, 0.001, 0.001, 0.05).reading).toBe('decreasing'); // both < 0
    expect(signRuleReading(2, -0.1, 0.4, 0.3, 0.05).reading).toBe('flat'); // both insignificant
  });

  const rows = loadPanelA();
  const fits: Record<string, CurveFit> = {};
  for (const code of [...new Set(rows.map((r) => r.district))]) {
    const r = fitCurve(
      rows
        .filter((x) => x.district === code)
        .map((x) => ({ year: x.year, y: x.emissions, x: x.income, controls: { d: x.density } })),
      { form: 'quadratic', transform: 'log', covariance: 'newey_west' },
    );
    if (r.status === 'ok') fits[code] = r;
  }

  test('the antilog turning point is always positive, including for a negative log-scale x* (common practice)', () => {
    for (const f of Object.values(fits)) expect(f.turningPoints[0].level!).toBeGreaterThan(0);
    // a U with its trough at x* = −3 on the log scale: exp(−3) > 0
    const synthetic = Array.from({ length: 20 }, (_, t) => {
      const lx = -4 + 0.1 * t;
      return { year: 2000 + t, y: Math.exp(1 + 0.5 * (lx + 3) ** 2 + 0.01 * Math.sin(5 * t)), x: Math.exp(lx) };
    });
    const f = fitCurve(synthetic, { form: 'quadratic', transform: 'log', covariance: 'hc1' }) as CurveFit;
    expect(f.turningPoints[0].x).toBeLessThan(0);
    expect(f.turningPoints[0].level!).toBeGreaterThan(0);
    expect(f.turningPoints[0].level).toBeCloseTo(Math.exp(f.turningPoints[0].x), 12);
  });

  test('a turning point outside the observed range means a monotone curve where there is data (common practice)', () => {
    expect(Object.keys(fits)).toHaveLength(8);
    for (const f of Object.values(fits)) {
      const tp = f.turningPoints[0];
      if (tp.inRange) continue;
      // the slope keeps one sign over [x_min, x_max] …
      expect(Math.sign(f.uTest.slopeAtMin)).toBe(Math.sign(f.uTest.slopeAtMax));
      // … so the shape is monotone or flat, never a U or inverted U, and says why
      expect(['increasing', 'decreasing', 'flat']).toContain(f.shape.shape);
      expect(f.shape.notes).toContain('turn beyond observed range');
      expect(f.standing.standing).toBe('no_turn');
      expect(f.gap.extrapolated).toBe(true);
    }
    // PA04: b1 < 0, b2 > 0 reads as a U by signs, but the turn (15.4) is far above the data: decreasing
    expect(fits.PA04.coefficients[1]).toBeLessThan(0);
    expect(fits.PA04.coefficients[2]).toBeGreaterThan(0);
    expect(fits.PA04.shape.shape).toBe('decreasing');
    // PA03: b1 > 0, b2 < 0 reads as an inverted U by signs; the turn at 18.2 is far above: increasing
    expect(fits.PA03.shape.shape).toBe('increasing');
    // PA06: significant curvature, bounded Fieller set wholly above the range: still increasing here
    expect(fits.PA06.turningPoints[0].fieller.kind).toBe('bounded');
    expect(fits.PA06.turningPoints[0].fieller.lo!).toBeGreaterThan(fits.PA06.range.xMax);
    expect(fits.PA06.shape.shape).toBe('increasing');
  });
});
