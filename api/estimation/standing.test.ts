import {
  classifyShape,
  districtStanding,
  incomeTrend,
  projectCrossing,
  selectTurningPoint,
  thresholdGap,
  type TurningPoint,
  type UTestResult,
  type WaldTestResult,
} from './index';

// Conventions from docs/method.md ("Where a district stands"); each case is constructed so the
// expected reading follows from the stated rule.

function tp(
  x: number,
  lo: number | null,
  hi: number | null,
  kind: 'peak' | 'trough' = 'peak',
  inRange = true,
  fkind: 'bounded' | 'two_rays' | 'whole_line' = 'bounded',
): TurningPoint {
  return {
    x,
    level: Math.exp(x),
    kind,
    inRange,
    gradient: [0, 0],
    delta: { se: 0.1, lo: x - 0.2, hi: x + 0.2, levelLo: Math.exp(x - 0.2), levelHi: Math.exp(x + 0.2) },
    fieller: {
      kind: fkind,
      lo,
      hi,
      pieces: [],
      levelLo: lo === null ? null : Math.exp(lo),
      levelHi: hi === null ? null : Math.exp(hi),
    },
    intervalBounded: fkind === 'bounded',
    extrapolated: !inRange,
  };
}
const base = { levelNow: 1, method: 'fieller' as const, level: 0.95 };

describe('districtStanding', () => {
  test.each([
    [9.0, 'approaching'],
    [9.95, 'at_turn'],
    [10.5, 'past_turn'],
  ] as const)('inverted U, bounded Fieller [9.9, 10.1], x_now = %s → %s', (xNow, expected) => {
    const s = districtStanding({ ...base, shape: 'inverted_u', turningPoints: [tp(10, 9.9, 10.1)], xNow });
    expect(s.standing).toBe(expected);
    expect(s.intervalBounded).toBe(true);
  });

  test('U shape: same positions relative to the trough', () => {
    expect(
      districtStanding({ ...base, shape: 'u', turningPoints: [tp(10, 9.9, 10.1, 'trough')], xNow: 9 }).standing,
    ).toBe('approaching');
    expect(
      districtStanding({ ...base, shape: 'u', turningPoints: [tp(10, 9.9, 10.1, 'trough')], xNow: 11 }).standing,
    ).toBe('past_turn');
  });

  test('interval not bounded: standing follows the point estimate, intervalBounded false with the note', () => {
    const s = districtStanding({
      ...base,
      shape: 'inverted_u',
      turningPoints: [tp(10, 9.5, 10.5, 'peak', true, 'two_rays')],
      xNow: 10.2,
    });
    expect(s.standing).toBe('past_turn'); // 10.2 > x* = 10 (inside the gap between the rays)
    expect(s.intervalBounded).toBe(false);
    expect(s.note).toBe('interval not bounded at 95%');
  });

  test('delta interval when the spec says so', () => {
    const s = districtStanding({
      ...base,
      method: 'delta',
      shape: 'inverted_u',
      turningPoints: [{ ...tp(10, 9.99, 10.01), intervalBounded: true }],
      xNow: 10.15,
    });
    expect(s.standing).toBe('at_turn'); // delta [9.8, 10.2]; Fieller [9.99, 10.01] would say past_turn
    expect(s.intervalMethod).toBe('delta');
  });

  test('monotone and flat shapes are no_turn; the turning point is still chosen for the gap', () => {
    const s = districtStanding({
      ...base,
      shape: 'increasing',
      turningPoints: [tp(15, 14, 16, 'peak', false)],
      xNow: 10,
    });
    expect(s.standing).toBe('no_turn');
    expect(s.turningPointIndex).toBe(0);
    expect(s.extrapolated).toBe(true);
    expect(districtStanding({ ...base, shape: 'flat', turningPoints: [], xNow: 10 }).standing).toBe('no_turn');
  });

  test('cubic: the root inside the range nearest x_now, of the kind the shape needs (docs/method.md)', () => {
    const pts = [
      { x: 8, kind: 'peak' as const, inRange: false },
      { x: 10, kind: 'trough' as const, inRange: true },
      { x: 10.8, kind: 'peak' as const, inRange: true },
    ];
    expect(selectTurningPoint(pts, 'u', 10.6)).toBe(1);
    expect(selectTurningPoint(pts, 'inverted_u', 9)).toBe(2);
    expect(selectTurningPoint(pts, 'increasing', 10.6)).toBe(2);
    expect(
      selectTurningPoint(
        [
          { x: 8, kind: 'peak', inRange: false },
          { x: 13, kind: 'trough', inRange: false },
        ],
        'increasing',
        12,
      ),
    ).toBe(1);
    expect(selectTurningPoint([], 'flat', 1)).toBeNull();
  });
});

describe('gap, trend and projected crossing', () => {
  test('gap 100·(X_now/X* − 1); null for a threshold that is not positive', () => {
    expect(thresholdGap(150, 100, false).percent).toBeCloseTo(50, 12);
    expect(thresholdGap(50, -10, false)).toEqual({
      percent: null,
      extrapolated: false,
      reason: 'threshold is not positive',
    });
    expect(thresholdGap(50, null, false).percent).toBeNull();
  });

  test('trend: OLS slope of ln(driver) on year over the last 10 years only', () => {
    const years = Array.from({ length: 20 }, (_, i) => 2000 + i);
    const driver = years.map((y) => Math.exp(y < 2010 ? 0.5 * (y - 2000) : 5 + 0.03 * (y - 2010)));
    const t = incomeTrend(years, driver);
    expect(t.slopePerYear).toBeCloseTo(0.03, 12);
    expect(t.nUsed).toBe(10);
    expect([t.firstYear, t.lastYear]).toEqual([2010, 2019]);
    expect(incomeTrend([2000], [1]).slopePerYear).toBeNull();
    expect(incomeTrend([2000, 2001], [1, -1]).reason).toBe('driver not positive in the trend window');
  });

  test('crossing year = last year + ceil(years); statuses for each case', () => {
    const p = projectCrossing({
      lnThreshold: 11,
      lnNow: 10,
      lnLo: 10.5,
      lnHi: 11.5,
      trend: 0.04,
      lastYear: 2024,
      extrapolated: false,
    });
    expect(p.status).toBe('projected');
    expect(p.yearsToThreshold).toBeCloseTo(25, 12);
    expect(p.crossingYear).toBe(2049);
    expect(p.range).toEqual({ earliest: 2037, latest: 2062 }); // 12.5 → 13, 37.5 → 38
    const past = projectCrossing({
      lnThreshold: 9,
      lnNow: 10,
      lnLo: 8.9,
      lnHi: 9.1,
      trend: 0.05,
      lastYear: 2024,
      extrapolated: false,
    });
    expect(past.status).toBe('already_past');
    expect(past.crossingYear).toBe(2004);
    const away = projectCrossing({
      lnThreshold: 11,
      lnNow: 10,
      lnLo: null,
      lnHi: null,
      trend: -0.01,
      lastYear: 2024,
      extrapolated: false,
    });
    expect(away.status).toBe('not_on_current_trend');
    expect(away.crossingYear).toBeNull();
    const unbounded = projectCrossing({
      lnThreshold: 11,
      lnNow: 10,
      lnLo: null,
      lnHi: null,
      trend: 0.04,
      lastYear: 2024,
      extrapolated: true,
    });
    expect(unbounded.range).toEqual({ earliest: null, latest: null });
    expect(unbounded.note).toMatch(/not on current trend/);
    expect(
      projectCrossing({
        lnThreshold: null,
        lnNow: 10,
        lnLo: null,
        lnHi: null,
        trend: 0.04,
        lastYear: 2024,
        extrapolated: false,
      }).status,
    ).toBe('no_threshold');
    expect(
      projectCrossing({
        lnThreshold: 11,
        lnNow: 10,
        lnLo: null,
        lnHi: null,
        trend: 0,
        lastYear: 2024,
        extrapolated: false,
      }).status,
    ).toBe('not_on_current_trend');
  });
});

describe('classifyShape: the order U-test → Wald → slope at the midpoint (docs/method.md)', () => {
  const u = (rejects: boolean, orientation: 'inverted_u' | 'u' = 'inverted_u') =>
    ({ rejects, orientation }) as UTestResult;
  const w = (rejects: boolean | null) =>
    ({ rejects, reason: rejects === null ? 'covariance block is not positive definite' : null }) as WaldTestResult;
  const mid = (value: number) => ({ x: 10, value, se: 0.1 });
  test('U-test rejects → its orientation, whatever the Wald test says', () => {
    expect(
      classifyShape({
        uTest: u(true),
        wald: w(false),
        slopeAtMidpoint: mid(1),
        turningPoints: [{ x: 10, inRange: true }],
        signRule: null,
      }).shape,
    ).toBe('inverted_u');
    expect(
      classifyShape({
        uTest: u(true, 'u'),
        wald: w(true),
        slopeAtMidpoint: mid(1),
        turningPoints: [{ x: 10, inRange: true }],
        signRule: null,
      }).shape,
    ).toBe('u');
  });
  test('else Wald does not reject → flat; else the midpoint slope sign, with the note for a turn outside the range', () => {
    expect(
      classifyShape({ uTest: u(false), wald: w(false), slopeAtMidpoint: mid(1), turningPoints: [], signRule: null })
        .decidedBy,
    ).toBe('wald_flat');
    const inc = classifyShape({
      uTest: u(false),
      wald: w(true),
      slopeAtMidpoint: mid(0.5),
      turningPoints: [{ x: 20, inRange: false }],
      signRule: null,
    });
    expect([inc.shape, inc.notes]).toEqual(['increasing', ['turn beyond observed range']]);
    expect(
      classifyShape({ uTest: u(false), wald: w(true), slopeAtMidpoint: mid(-0.5), turningPoints: [], signRule: null })
        .shape,
    ).toBe('decreasing');
    const na = classifyShape({
      uTest: u(false),
      wald: w(null),
      slopeAtMidpoint: mid(-0.5),
      turningPoints: [],
      signRule: null,
    });
    expect(na.shape).toBe('decreasing');
    expect(na.notes[0]).toMatch(/joint test of the slope terms not available/);
  });
});
