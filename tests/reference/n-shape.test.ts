import { classifyShape, fitCurve, type CurveFit, type CurveRow, type FitCurveResult } from '../../api/estimation';

// N-shapes (docs/method.md "Shape"): a cubic whose slope changes sign twice inside the observed
// range is `n_shape` (rises, falls, rises) or `inverted_n` (falls, rises, falls). The series
// are invented (seeded, exact cubics plus a small deterministic wiggle): plumbing for the
// rule, not reference values. Expected turning points follow from the chosen cubic:
// y = 20 ± (x³ − 6x² + 9x) has slope ±3(x − 1)(x − 3), turns at x = 1 and x = 3 (arithmetic).

function series(sign: 1 | -1, n = 30): CurveRow[] {
  return Array.from({ length: n }, (_, t) => {
    const x = 0.3 + (3.5 * t) / (n - 1) + 0.01 * Math.sin(5 * t);
    const y = 20 + sign * (x ** 3 - 6 * x ** 2 + 9 * x) + 0.02 * Math.sin(7.3 * t + 1);
    return { year: 1995 + t, x, y };
  });
}
const spec = (covariance: 'classical' | 'hc1' | 'hc3' | 'newey_west') => ({
  form: 'cubic' as const,
  transform: 'level' as const,
  covariance,
  controls: [] as string[],
});
const ok = (r: FitCurveResult): CurveFit => {
  if (r.status !== 'ok') throw new Error(r.reason.message);
  return r;
};

describe('N-shapes in the engine', () => {
  test.each(['classical', 'hc1', 'hc3', 'newey_west'] as const)(
    'rises, falls, rises → n_shape (%s); both turns keep their intervals',
    (cov) => {
      const f = ok(fitCurve(series(1), spec(cov)));
      expect(f.shape.shape).toBe('n_shape');
      expect(f.shape.decidedBy).toBe('two_turns_in_range');
      expect(f.turningPoints.map((t) => t.kind)).toEqual(['peak', 'trough']);
      expect(f.turningPoints[0].x).toBeCloseTo(1, 1); // chosen cubic: peak at 1
      expect(f.turningPoints[1].x).toBeCloseTo(3, 1); // trough at 3
      for (const tp of f.turningPoints) {
        expect(tp.inRange).toBe(true);
        expect(tp.fieller.kind).toBe('bounded');
        expect(tp.fieller.lo! <= tp.x && tp.x <= tp.fieller.hi!).toBe(true);
        expect(tp.delta.se).not.toBeNull();
      }
      // x_now ≈ 3.8: the nearest turn inside the range is the trough at 3, read like a U: past it
      expect(f.standing.turningPointIndex).toBe(1);
      expect(f.standing.standing).toBe('past_turn');
      expect(f.gap.percent).not.toBeNull();
    },
  );

  test('falls, rises, falls → inverted_n; the standing is read from the peak at 3', () => {
    const f = ok(fitCurve(series(-1), spec('newey_west')));
    expect(f.shape.shape).toBe('inverted_n');
    expect(f.turningPoints.map((t) => t.kind)).toEqual(['trough', 'peak']);
    expect(f.turningPoints[f.standing.turningPointIndex!].kind).toBe('peak');
    expect(f.standing.standing).toBe('past_turn');
  });

  test('x_now between the two turns and nearer the first: the standing uses the first', () => {
    const rows = series(1).filter((r) => r.x < 1.8); // the last x lies between 1 and 3, nearer 1
    rows.push(
      ...series(1)
        .filter((r) => r.x >= 1.8)
        .map((r, i) => ({ ...r, year: 1960 + i })),
    ); // earlier years reach 3.8
    const f = ok(fitCurve(rows, spec('classical')));
    expect(f.shape.shape).toBe('n_shape');
    expect(f.turningPoints[f.standing.turningPointIndex!].kind).toBe('peak');
    expect(f.standing.standing).toBe('past_turn'); // x_now ≈ 1.7 above the peak's interval around 1
  });

  test('classifyShape: U-test first, then flat, then two turns inside the range, then the midpoint slope', () => {
    const base = {
      uTest: { rejects: false, orientation: 'u' } as never,
      slopeAtMidpoint: { x: 2, value: -1, se: 0.1 },
      signRule: null,
    };
    const wald = (rejects: boolean | null) => ({
      statistic: 1,
      q: 3,
      fStatistic: 1,
      df: 20,
      pValue: 0.01,
      rejects,
      reason: null,
      condition: 1,
    });
    const two = [
      { x: 1, inRange: true, kind: 'peak' as const },
      { x: 3, inRange: true, kind: 'trough' as const },
    ];
    expect(classifyShape({ ...base, wald: wald(true), turningPoints: two }).shape).toBe('n_shape');
    expect(classifyShape({ ...base, wald: wald(false), turningPoints: two }).shape).toBe('flat');
    expect(
      classifyShape({
        ...base,
        wald: wald(true),
        turningPoints: [two[1], { x: 5, inRange: true, kind: 'peak' as const }],
      }).shape,
    ).toBe('inverted_n');
    expect(
      classifyShape({
        ...base,
        wald: wald(true),
        turningPoints: [two[0], { x: 5, inRange: false, kind: 'trough' as const }],
      }).shape,
    ).toBe('decreasing');
  });
});
