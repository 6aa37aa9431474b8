import { cubicFieller, defaultNeweyWestLag, fitCurve, lindMehlumTest, type CurveRow } from '../../api/estimation';

// Tests aimed at one-character slips in the inference formulas. Each uses a covariance
// with non-zero off-diagonal entries (a diagonal V hides a wrong factor on V12, V13 or V23)
// and values worked by hand, written out beside each assertion.

// A positive-definite 3 × 3 covariance of (b1, b2, b3) with every off-diagonal entry non-zero
// (leading minors 1, 0.49, 0.098: worked by hand).
const V3 = [
  [1, 0.1, 0.2],
  [0.1, 0.5, 0.3],
  [0.2, 0.3, 0.4],
];

describe('cubic U-test variance of the slope, non-diagonal covariance (worked by hand)', () => {
  test('se of s(x) = b1 + 2b2x + 3b3x² at x = 1 and x = 2', () => {
    // a(1) = (1, 2, 3): a'Va = 1 + 4·0.5 + 9·0.4 + 2·(2·0.1) + 2·(3·0.2) + 2·(6·0.3) = 11.8
    // a(2) = (1, 4, 12): a'Va = 1 + 16·0.5 + 144·0.4 + 2·(4·0.1) + 2·(12·0.2) + 2·(48·0.3) = 101
    const u = lindMehlumTest([3, -2, 0.1], V3, 1, 2, 20, 0.05);
    expect(u.seAtMin).toBeCloseTo(Math.sqrt(11.8), 13);
    expect(u.seAtMax).toBeCloseTo(Math.sqrt(101), 13);
    // s(1) = 3 − 4 + 0.3 = −0.7; s(2) = 3 − 8 + 1.2 = −3.8 (hand)
    expect(u.slopeAtMin).toBeCloseTo(-0.7, 14);
    expect(u.slopeAtMax).toBeCloseTo(-3.8, 14);
    expect(u.tAtMax).toBeCloseTo(-3.8 / Math.sqrt(101), 13);
  });
  test('quadratic: se of b1 + 2b2x with V12 ≠ 0 (hand: 1 + 4·2·0.1 + 16·0.5 = 9.8 at x = 2)', () => {
    const V2 = [
      [1, 0.1],
      [0.1, 0.5],
    ];
    const u = lindMehlumTest([3, -1], V2, 0, 2, 20, 0.05);
    expect(u.seAtMin).toBeCloseTo(1, 14); // a(0) = (1, 0): V11 = 1
    expect(u.seAtMax).toBeCloseTo(Math.sqrt(9.8), 13);
  });
});

describe('cubic Fieller quartic, non-diagonal covariance', () => {
  // b = (−3, 0, 1): s(θ) = −3 + 3θ², turning points ±1; V = 0.001·V3, c = 2.
  const b: [number, number, number] = [-3, 0, 1];
  const V = V3.map((r) => r.map((v) => v * 0.001));
  const c = 2;
  const varS = (t: number): number => {
    const a = [1, 2 * t, 3 * t * t];
    let v = 0;
    for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) v += a[i] * V[i][j] * a[j];
    return v;
  };
  const s = (t: number): number => b[0] + 2 * b[1] * t + 3 * b[2] * t * t;
  test('every end of the set solves s(θ)² = c²·a(θ)ᵀVa(θ) (the definition, Fieller 1954)', () => {
    const f = cubicFieller(b[0], b[1], b[2], V, c, 1);
    expect(f.kind).toBe('bounded');
    expect(f.containsTurningPoint).toBe(true);
    const ends = f.pieces.flatMap((p) => [p.lo, p.hi]).filter((e): e is number => e !== null);
    expect(ends).toHaveLength(4); // two bounded pieces, around −1 and +1
    for (const e of ends) expect(Math.abs(s(e) ** 2 - c * c * varS(e)) / (c * c * varS(e))).toBeLessThan(1e-9);
    // the quartic's coefficients, by hand: q = [8.996, −0.0016, −18.0128, −0.0144, 8.9856];
    // q(1) = 8.996 − 0.0016 − 18.0128 − 0.0144 + 8.9856 = −0.0472 < 0, so +1 is inside
    expect(s(1) ** 2 - c * c * varS(1)).toBeCloseTo(-0.0472, 12);
    expect(f.lo! < 1 && 1 < f.hi!).toBe(true);
  });
  test('membership on a grid matches the defining inequality', () => {
    const f = cubicFieller(b[0], b[1], b[2], V, c, -1);
    for (let t = -2; t <= 2; t += 0.002) {
      const inside = f.pieces.some((p) => (p.lo === null || t >= p.lo) && (p.hi === null || t <= p.hi));
      const near = f.pieces.some((p) => [p.lo, p.hi].some((e) => e !== null && Math.abs(e - t) < 1e-9));
      if (!near) expect(inside).toBe(s(t) ** 2 <= c * c * varS(t));
    }
  });
});

describe('default Newey–West lag floor(4·(n/100)^(2/9)) (docs/method.md)', () => {
  test('n = 20: 4·0.2^(2/9) = 2.797…, floor 2 (round would give 3); hand arithmetic', () => {
    expect(defaultNeweyWestLag(20)).toBe(2);
    // n = 35: 4·0.35^(2/9) = 3.166… → 3; n = 100: 4 → 4; n = 10: 2.394… → 2 (hand)
    expect(defaultNeweyWestLag(35)).toBe(3);
    expect(defaultNeweyWestLag(100)).toBe(4);
    expect(defaultNeweyWestLag(10)).toBe(2);
  });
  test('a 20-year district fitted with Newey–West records lag 2', () => {
    const rows: CurveRow[] = Array.from({ length: 20 }, (_, t) => {
      const lx = 9 + 0.07 * t + 0.02 * Math.sin(3 * t);
      return { year: 2000 + t, x: Math.exp(lx), y: Math.exp(1 - 0.5 * (lx - 10) ** 2 + 0.01 * Math.sin(7.3 * t)) };
    });
    const f = fitCurve(rows, { form: 'quadratic', transform: 'log', covariance: 'newey_west', controls: [] });
    if (f.status !== 'ok') throw new Error(f.reason.message);
    expect(f.covarianceInfo.lag).toBe(2);
  });
});
