import {
  cubicFieller,
  cubicTurningPoints,
  deltaMethod,
  fiellerInterval,
  lindMehlumTest,
  quadraticTurningPoint,
  realPolynomialRoots,
  waldTest,
} from './index';

// Expected values follow from each definition: Fieller sets are checked point by point
// against their defining inequality, gradients against finite differences.

const inFieller = (b1: number, b2: number, V: number[][], c: number, t: number) =>
  (b1 + 2 * b2 * t) ** 2 <= c * c * (V[0][0] + 4 * t * V[0][1] + 4 * t * t * V[1][1]);

describe('quadratic turning point and delta method', () => {
  test('x* = −b1/(2b2), kind by the sign of b2, gradient matches finite differences', () => {
    const V = [
      [0.04, -0.002],
      [-0.002, 0.0002],
    ];
    const tp = quadraticTurningPoint(2, -0.1, V[0][0], V[0][1], V[1][1])!;
    expect(tp.x).toBe(10);
    expect(tp.kind).toBe('peak');
    expect(quadraticTurningPoint(-2, 0.1, 1, 0, 1)!.kind).toBe('trough');
    const h = 1e-6;
    const xs = (b1: number, b2: number) => -b1 / (2 * b2);
    expect(tp.gradient[0]).toBeCloseTo((xs(2 + h, -0.1) - xs(2 - h, -0.1)) / (2 * h), 6);
    expect(tp.gradient[1]).toBeCloseTo((xs(2, -0.1 + h) - xs(2, -0.1 - h)) / (2 * h), 4);
    const d = deltaMethod(tp.gradient, V, tp.x, 2);
    expect(d.se).toBeCloseTo(tp.se!, 15);
    expect(d.hi! - tp.x).toBeCloseTo(tp.x - d.lo!, 12);
    expect(quadraticTurningPoint(1, 0, 1, 0, 1)).toBeNull(); // b2 = 0: no turning point
  });

  test('delta method returns nulls for a negative variance', () => {
    expect(
      deltaMethod(
        [1, 1],
        [
          [1, 0],
          [0, -2],
        ],
        0,
        2,
      ),
    ).toEqual({ se: null, lo: null, hi: null });
  });
});

describe('Fieller sets (Fieller 1954): every kind, checked against the defining inequality', () => {
  const grid = Array.from({ length: 2001 }, (_, i) => -50 + i * 0.05);
  test.each([
    [
      'bounded',
      2,
      -0.1,
      [
        [0.01, 0],
        [0, 0.0001],
      ],
    ],
    [
      'two_rays',
      2,
      -0.1,
      [
        [0.5, 0],
        [0, 0.004],
      ],
    ],
    [
      'whole_line',
      0.1,
      -0.01,
      [
        [4, 0],
        [0, 0.04],
      ],
    ],
  ] as const)('%s', (kind, b1, b2, V) => {
    const c = 1.96;
    const f = fiellerInterval(b1, b2, V[0][0], V[0][1], V[1][1], c);
    expect(f.kind).toBe(kind);
    for (const t of grid) {
      const inside = f.pieces.some((p) => (p.lo === null || t >= p.lo) && (p.hi === null || t <= p.hi));
      if (
        Math.min(
          ...f.pieces
            .flatMap((p) => [p.lo, p.hi])
            .filter((v): v is number => v !== null)
            .map((v) => Math.abs(v - t)),
          Infinity,
        ) > 1e-9
      ) {
        expect(inside).toBe(inFieller(b1, b2, V as unknown as number[][], c, t));
      }
    }
    if (kind === 'two_rays') {
      expect(f.pieces[0].lo).toBeNull();
      expect(f.pieces[1].hi).toBeNull();
      expect(f.lo).toBe(f.pieces[0].hi);
      expect(f.hi).toBe(f.pieces[1].lo);
    }
    if (kind === 'whole_line') {
      expect(f.lo).toBeNull();
      expect(f.hi).toBeNull();
    }
  });

  test('A = 0 to rounding gives one ray, reported as two_rays with one end null (docs/method.md)', () => {
    // 4b2² = 4c²V22 exactly: b2 = 0.1, c = 2, V22 = 0.0025
    const f = fiellerInterval(1, 0.1, 0.01, 0, 0.0025, 2);
    expect(f.kind).toBe('two_rays');
    expect(f.pieces).toHaveLength(1);
    expect([f.lo, f.hi].filter((v) => v === null)).toHaveLength(1);
  });

  test('a bounded set contains x*', () => {
    const f = fiellerInterval(2, -0.1, 0.01, 0.0001, 0.0001, 2.04);
    expect(f.lo! < 10 && 10 < f.hi!).toBe(true);
  });
});

describe('real polynomial roots', () => {
  test('known roots (arithmetic)', () => {
    expect(realPolynomialRoots([-6, 11, -6, 1])).toEqual([1, 2, 3]);
    expect(realPolynomialRoots([1, 0, 1])).toEqual([]);
    expect(realPolynomialRoots([4, -5, 1])).toEqual([1, 4]);
    expect(realPolynomialRoots([0, 0, 0])).toEqual([]);
    const r = realPolynomialRoots([24, -50, 35, -10, 1]); // (x−1)(x−2)(x−3)(x−4)
    [1, 2, 3, 4].forEach((v, i) => expect(r[i]).toBeCloseTo(v, 12));
    expect(realPolynomialRoots([2, 1e-3, 0])).toEqual([-2000]);
    // only exact zeros lower the degree: 2 + 1e-20·x has its root at −2e20 (arithmetic)
    expect(realPolynomialRoots([2, 1e-20, 0])[0] / -2e20).toBeCloseTo(1, 14);
  });

  // A quartic shaped like the level-form cubic Fieller quartic (coefficients spanning
  // 1e-7 … 1e-24, leading one below 1e-14 of the largest): built from chosen roots, so the
  // expected roots are the chosen ones (arithmetic).
  const chosen = [-6751, 20178, 23821, 410000];
  const expand = (roots: number[], lead: number): number[] => {
    let c = [lead];
    for (const r of roots) {
      const n = new Array(c.length + 1).fill(0);
      c.forEach((v, i) => {
        n[i + 1] += v;
        n[i] -= r * v;
      });
      c = n;
    }
    return c;
  };
  test('a tiny leading coefficient is kept: all four roots of a wide-range quartic come back', () => {
    const q = expand(chosen, -1.6e-24);
    expect(Math.abs(q[4]) / Math.max(...q.map(Math.abs))).toBeLessThan(1e-14); // the case the old relative test dropped
    const r = realPolynomialRoots(q, 23821);
    expect(r).toHaveLength(4);
    r.forEach((v, i) => expect(Math.abs(v / chosen[i] - 1)).toBeLessThan(1e-12));
    const auto = realPolynomialRoots(q); // without a scale: the root-size estimate
    auto.forEach((v, i) => expect(Math.abs(v / chosen[i] - 1)).toBeLessThan(1e-12));
  });
  test.each([-3, 0, 3, 7])('roots follow the units of x: x × 10^%i scales every root by 10^k', (k) => {
    const f = 10 ** k;
    const q = expand(
      chosen.map((v) => v * f),
      -1.6e-24,
    );
    const r = realPolynomialRoots(q, 23821 * f);
    expect(r).toHaveLength(4);
    r.forEach((v, i) => expect(Math.abs(v / (chosen[i] * f) - 1)).toBeLessThan(1e-12));
  });
});

describe('cubic turning points and their Fieller-type sets', () => {
  const V = [
    [0.001, 0, 0],
    [0, 0.001, 0],
    [0, 0, 0.001],
  ];
  test('roots of b1 + 2b2x + 3b3x², kinds by the second derivative, implicit-function gradient', () => {
    const tps = cubicTurningPoints(-3, 0, 1, V);
    expect(tps.map((t) => [t.x, t.kind])).toEqual([
      [-1, 'peak'],
      [1, 'trough'],
    ]);
    // finite-difference gradient of the larger root
    const root = (b1: number, b2: number, b3: number) => Math.max(...realPolynomialRoots([b1, 2 * b2, 3 * b3]));
    const h = 1e-6;
    const num = [
      (root(-3 + h, 0, 1) - root(-3 - h, 0, 1)) / (2 * h),
      (root(-3, h, 1) - root(-3, -h, 1)) / (2 * h),
      (root(-3, 0, 1 + h) - root(-3, 0, 1 - h)) / (2 * h),
    ];
    tps[1].gradient.forEach((g, i) => expect(g).toBeCloseTo(num[i], 6));
    expect(cubicTurningPoints(1, 0, 1, V)).toEqual([]); // 1 + 3x² > 0: monotone
  });

  test('the quartic set matches its defining inequality on a grid', () => {
    const c = 1.96;
    const f = cubicFieller(-3, 0, 1, V, c, 1);
    expect(f.kind).toBe('bounded');
    expect(f.lo! < 1 && 1 < f.hi!).toBe(true);
    for (let t = -3; t <= 3; t += 0.001) {
      const s = -3 + 3 * t * t;
      const v = V[0][0] + 4 * t * t * V[1][1] + 9 * t ** 4 * V[2][2];
      const inside = f.pieces.some((p) => (p.lo === null || t >= p.lo) && (p.hi === null || t <= p.hi));
      const near = f.pieces.some((p) => [p.lo, p.hi].some((e) => e !== null && Math.abs(e - t) < 1e-9));
      if (!near) expect(inside).toBe(s * s <= c * c * v);
    }
    // a point no piece contains (0 is not a turning point of −3 + 3x²) is reported, never given a ray
    const stray = cubicFieller(-3, 0, 1, V, c, 0);
    expect(stray.containsTurningPoint).toBe(false);
    expect([stray.lo, stray.hi]).toEqual([null, null]);
    expect(f.containsTurningPoint).toBe(true);
    const wide = cubicFieller(
      -3,
      0,
      1,
      [
        [100, 0, 0],
        [0, 100, 0],
        [0, 0, 100],
      ],
      c,
      1,
    );
    expect(wide.kind).toBe('whole_line');
  });
});

describe('Lind–Mehlum U-test (Lind & Mehlum 2010)', () => {
  const V = [
    [0.01, -0.0009],
    [-0.0009, 0.0001],
  ];
  test('inverse U inside the range rejects; the statistic is min(t_min, −t_max)', () => {
    const u = lindMehlumTest([2, -0.1], V, 5, 15, 30, 0.05);
    expect(u.orientation).toBe('inverted_u');
    expect(u.statistic).toBe(Math.min(u.tAtMin!, -u.tAtMax!));
    expect(u.slopeAtMin).toBeCloseTo(1, 14); // 2 − 0.2·5
    expect(u.slopeAtMax).toBeCloseTo(-1, 14); // 2 − 0.2·15
    expect(u.extremumInRange).toBe(true);
    expect(u.rejects).toBe(true);
    expect(u.bothOrientations.inverted_u.statistic).toBe(u.statistic);
  });
  test('an extremum outside the range: one slope has the wrong sign, T < 0 and p > 0.5 (trivial non-rejection)', () => {
    const u = lindMehlumTest([2, -0.1], V, 11, 15, 30, 0.05);
    expect(u.extremumInRange).toBe(false);
    expect(u.statistic!).toBeLessThan(0);
    expect(u.pValue!).toBeGreaterThan(0.5);
    expect(u.rejects).toBe(false);
  });
  test('U orientation for b2 > 0, normal reference when df is null', () => {
    const u = lindMehlumTest([-2, 0.1], V, 5, 15, null, 0.05);
    expect(u.orientation).toBe('u');
    expect(u.df).toBeNull();
    expect(u.statistic).toBe(Math.min(-u.tAtMin!, u.tAtMax!));
  });
});

describe('Wald test', () => {
  test('W = bᵀV⁻¹b with F = W/q (Wald 1943); non-positive-definite V gives a reason', () => {
    const w = waldTest(
      [1, 2],
      [
        [2, 0.5],
        [0.5, 1],
      ],
      30,
      0.05,
    );
    // V⁻¹ = [[1, −0.5], [−0.5, 2]] / 1.75 → W = (1 − 2 + 8)/1.75 = 4
    expect(w.statistic).toBeCloseTo(4, 14);
    expect(w.fStatistic).toBeCloseTo(2, 14);
    expect(w.pValue).toBeCloseTo(Math.pow(1 + 4 / 30, -15), 14); // F(2, 30) tail
    const chi = waldTest(
      [1, 2],
      [
        [2, 0.5],
        [0.5, 1],
      ],
      null,
      0.05,
    );
    expect(chi.pValue).toBeCloseTo(Math.exp(-2), 14); // χ²(2) tail at 4
    // equilibrated pivoted Cholesky: C = [[1, 0.5/√2], [0.5/√2, 1]], pivots 1 and 1 − 1/8, condition (1/0.875)
    expect(w.condition).toBeCloseTo(1 / 0.875, 14);
    const bad = waldTest(
      [1, 2],
      [
        [1, 2],
        [2, 1],
      ],
      30,
      0.05,
    );
    expect(bad.statistic).toBeNull();
    expect(bad.reason).toMatch(/not positive definite/);
  });
});
