import { EstimationInputError, fitCurve, ols, type CurveFit, type CurveRow, type FitCurveResult } from './index';

// Synthetic districts with known structure; expected values follow from the model's
// definition (an exact curve, the same fit by ols, or the docs/method.md conventions).

function district(
  n: number,
  opts: { tp?: number; b2?: number; start?: number; growth?: number; noise?: number; cubic?: number } = {},
): CurveRow[] {
  const { tp = 10, b2 = -0.5, start = 9, growth = 0.05, noise = 0.01, cubic = 0 } = opts;
  const rows: CurveRow[] = [];
  for (let t = 0; t < n; t++) {
    const lx = start + growth * t + 0.02 * Math.sin(3 * t);
    const ld = 5 + 0.01 * t + 0.03 * Math.cos(2 * t);
    const ly = 1 + b2 * (lx - tp) ** 2 + cubic * (lx - tp) ** 3 + 0.3 * ld + noise * Math.sin(7.3 * t + 1);
    rows.push({ year: 1990 + t, y: Math.exp(ly), x: Math.exp(lx), controls: { density: Math.exp(ld) } });
  }
  return rows;
}
const M = { form: 'quadratic', transform: 'log', covariance: 'newey_west' } as const;
const ok = (r: FitCurveResult): CurveFit => {
  if (r.status !== 'ok') throw new Error(r.reason.message);
  return r;
};
const errorOf = (f: () => unknown): EstimationInputError => {
  try {
    f();
  } catch (e) {
    if (e instanceof EstimationInputError) return e;
    throw e;
  }
  throw new Error('expected an EstimationInputError');
};

describe('fitCurve', () => {
  test('equals ols on the logged design (terms const, x, x2, then controls)', () => {
    const rows = district(30);
    const f = ok(fitCurve(rows, M));
    expect(f.terms).toEqual(['const', 'x', 'x2', 'density']);
    const X = rows.map((r) => [1, Math.log(r.x), Math.log(r.x) ** 2, Math.log(r.controls!.density)]);
    const o = ols(
      X,
      rows.map((r) => Math.log(r.y)),
      { covariance: 'newey_west' },
    );
    f.coefficients.forEach((b, j) => expect(b).toBeCloseTo(o.coefficients[j], 12));
    f.standardErrors.forEach((s, j) => expect(s).toBeCloseTo(o.standardErrors[j], 12));
    expect(f.turningPoints[0].x).toBeCloseTo(10, 2); // the curve's true peak (ln scale)
    expect(f.turningPoints[0].level).toBeCloseTo(Math.exp(f.turningPoints[0].x), 6);
    expect(f.shape.shape).toBe('inverted_u');
    expect(f.critical).toEqual({ kind: 't', df: 26, value: expect.any(Number), level: 0.95 });
  });

  test('row order does not matter: unsorted rows give the same fit, residuals by year in year order', () => {
    const rows = district(25);
    const shuffled = [...rows].reverse();
    const a = ok(fitCurve(rows, M)),
      b = ok(fitCurve(shuffled, M));
    expect(b.coefficients).toEqual(a.coefficients);
    expect(b.diagnostics!.residualsByYear.map((r) => r.year)).toEqual(rows.map((r) => r.year));
  });

  test('results are plain JSON: no NaN or Infinity anywhere, round-trips through JSON', () => {
    for (const rows of [district(30), district(30, { b2: 0, noise: 0.05 }), district(30, { tp: 30 })]) {
      const f = fitCurve(rows, { ...M, form: 'cubic' });
      const walk = (v: unknown): void => {
        if (typeof v === 'number') expect(Number.isFinite(v)).toBe(true);
        else if (Array.isArray(v)) v.forEach(walk);
        else if (v && typeof v === 'object') Object.values(v).forEach(walk);
      };
      walk(f);
      expect(JSON.parse(JSON.stringify(f))).toEqual(f);
    }
  });

  test('results do not alias pooled scratch memory: a second fit leaves the first unchanged', () => {
    const a = ok(fitCurve(district(30), M));
    const copy = JSON.parse(JSON.stringify(a));
    fitCurve(district(28, { tp: 11 }), M);
    expect(a).toEqual(copy);
  });

  test('too few rows is not_estimable with the reason (default minimum k + 5)', () => {
    const r = fitCurve(district(8), M);
    expect(r.status).toBe('not_estimable');
    if (r.status !== 'not_estimable') return;
    expect(r.minYears).toBe(9); // k = 4 (const, x, x2, density) + 5
    expect(r.reason.code).toBe('too_few_rows');
    expect(r.standing.standing).toBe('not_estimable');
    expect(fitCurve(district(8), { ...M, minYears: 6 }).status).toBe('ok');
  });

  test('a constant control is rank deficient: not_estimable naming the column', () => {
    const rows = district(20).map((r) => ({ ...r, controls: { density: 100 } }));
    const r = fitCurve(rows, M);
    expect(r.status).toBe('not_estimable');
    if (r.status !== 'not_estimable') return;
    expect(r.reason.code).toBe('rank_deficient');
    expect(r.reason.details.dependent).toEqual(['density']);
  });

  test('bad rows are errors naming the row: non-finite, ≤ 0 under logs, duplicate year, missing control', () => {
    const rows = district(20);
    let e = errorOf(() =>
      fitCurve(
        rows.map((r, i) => (i === 4 ? { ...r, y: NaN } : r)),
        M,
      ),
    );
    expect([e.code, e.details.row, e.details.year, e.details.column]).toEqual(['non_finite_value', 4, 1994, 'y']);
    e = errorOf(() =>
      fitCurve(
        rows.map((r, i) => (i === 7 ? { ...r, x: 0 } : r)),
        M,
      ),
    );
    expect([e.code, e.details.row, e.details.column, e.details.value]).toEqual(['non_positive_under_log', 7, 'x', 0]);
    e = errorOf(() =>
      fitCurve(
        rows.map((r, i) => (i === 3 ? { ...r, controls: { density: -1 } } : r)),
        M,
      ),
    );
    expect([e.code, e.details.row, e.details.column]).toEqual(['non_positive_under_log', 3, 'density']);
    e = errorOf(() =>
      fitCurve(
        rows.map((r, i) => (i === 9 ? { ...r, year: 1991 } : r)),
        M,
      ),
    );
    expect([e.code, e.details.row, e.details.firstRow, e.details.year]).toEqual(['duplicate_year', 9, 1, 1991]);
    e = errorOf(() =>
      fitCurve(
        rows.map((r, i) => (i === 5 ? { year: r.year, y: r.y, x: r.x } : r)),
        M,
      ),
    );
    expect([e.code, e.details.row, e.details.column]).toEqual(['missing_control', 5, 'density']);
    e = errorOf(() =>
      fitCurve(
        rows.map((r, i) => (i === 2 ? { ...r, year: 1992.5 } : r)),
        M,
      ),
    );
    expect([e.code, e.details.row, e.details.column]).toEqual(['invalid_argument', 2, 'year']);
    // the level form accepts zero and negative values
    expect(
      fitCurve(
        rows.map((r, i) => (i === 7 ? { ...r, y: -1 } : r)),
        { ...M, transform: 'level' },
      ).status,
    ).toBe('ok');
  });

  test('levelControls keeps a control in levels under the log transform; controls selects and orders', () => {
    const rows = district(25).map((r, i) => ({
      ...r,
      controls: { density: r.controls!.density, share: 0.2 + 0.01 * i + 0.02 * Math.sin(i) },
    }));
    const f = ok(fitCurve(rows, { ...M, levelControls: ['share'] }));
    expect(f.terms).toEqual(['const', 'x', 'x2', 'density', 'share']);
    const X = rows.map((r) => [1, Math.log(r.x), Math.log(r.x) ** 2, Math.log(r.controls.density), r.controls.share]);
    const o = ols(
      X,
      rows.map((r) => Math.log(r.y)),
    );
    f.coefficients.forEach((b, j) => expect(b).toBeCloseTo(o.coefficients[j], 10));
    expect(ok(fitCurve(rows, { ...M, controls: ['share', 'density'] })).terms).toEqual([
      'const',
      'x',
      'x2',
      'share',
      'density',
    ]);
    expect(errorOf(() => fitCurve(rows, { ...M, levelControls: ['nope'] })).code).toBe('invalid_argument');
  });

  test('model spec errors and cluster covariance for one district are invalid_argument', () => {
    expect(errorOf(() => fitCurve(district(20), { ...M, form: 'quartic' } as never)).details.reason).toBe('model');
    expect(errorOf(() => fitCurve(district(20), { ...M, covariance: 'cluster' })).details.reason).toBe('covariance');
    expect(errorOf(() => fitCurve(district(20), { ...M, lag: 25 })).code).toBe('invalid_argument');
  });

  test('normal critical values: t replaced by N(0,1) in intervals and tests', () => {
    const f = ok(fitCurve(district(30), { ...M, criticalValue: 'normal' }));
    expect(f.critical.df).toBeNull();
    expect(f.critical.value).toBeCloseTo(1.959963984540054, 14);
    expect(f.uTest.df).toBeNull();
    expect(f.wald.df).toBeNull();
  });

  test('level form: turning point in raw units, point elasticity (b1 + 2b2X)X/ŷ', () => {
    const rows = Array.from({ length: 30 }, (_, t) => {
      const x = 10 + t;
      return { year: 2000 + t, y: 5 + 2 * x - 0.05 * x * x + 0.3 * Math.sin(t), x };
    });
    const f = ok(fitCurve(rows, { form: 'quadratic', transform: 'level', covariance: 'hc1' }));
    const [, b1, b2] = f.coefficients;
    expect(f.turningPoints[0].x).toBeCloseTo(-b1 / (2 * b2), 12);
    expect(f.turningPoints[0].level).toBe(f.turningPoints[0].x);
    const X = 39,
      yhat = f.fitted[29];
    expect(f.elasticity.value).toBeCloseTo(((b1 + 2 * b2 * X) * X) / yhat, 12);
    expect(f.elasticity.se).toBeGreaterThan(0);
    expect(f.trend.slopePerYear).toBeCloseTo((Math.log(39) - Math.log(30)) / 9, 2); // ln driver on year over 2020–2029
  });

  test('cubic: terms include x3, turning points are roots of the slope, U-test uses the cubic slope', () => {
    const f = ok(fitCurve(district(40, { start: 8.5, growth: 0.08, cubic: 0.3, b2: -0.6 }), { ...M, form: 'cubic' }));
    expect(f.terms).toEqual(['const', 'x', 'x2', 'x3', 'density']);
    const [, b1, b2, b3] = f.coefficients;
    expect(f.turningPoints.map((t) => t.kind)).toEqual(['peak', 'trough']); // the N shape generated: peak at 10, trough above
    expect(f.turningPoints[0].x).toBeCloseTo(10, 1);
    expect(f.shape.shape).toBe('n_shape'); // two turns inside the range, peak first (docs/method.md)
    for (const tp of f.turningPoints) {
      expect(Math.abs(b1 + 2 * b2 * tp.x + 3 * b3 * tp.x * tp.x)).toBeLessThan(1e-9 * (Math.abs(b1) + 1));
      expect(tp.kind).toBe(2 * b2 + 6 * b3 * tp.x < 0 ? 'peak' : 'trough');
    }
    expect(f.wald.q).toBe(3);
    const x = f.range.xMin;
    expect(f.uTest.slopeAtMin).toBeCloseTo(b1 + 2 * b2 * x + 3 * b3 * x * x, 10);
    expect(f.shape.signRule).toBeNull();
  });

  test('diagnostics can be switched off', () => {
    expect(ok(fitCurve(district(20), M, { diagnostics: false })).diagnostics).toBeNull();
  });
});

describe('exact Durbin–Watson p-value on request', () => {
  test('null by default, a probability when asked; agrees with the approximation to a few hundredths', () => {
    const rows = Array.from({ length: 30 }, (_, t) => ({
      year: 2000 + t,
      y: Math.exp(1 + 0.1 * t + 0.05 * Math.sin(t * 1.3) + 0.03 * Math.cos(t * 0.4)),
      x: Math.exp(9 + 0.05 * t + 0.01 * Math.sin(2 * t)),
    }));
    const spec = { form: 'quadratic', transform: 'log', covariance: 'hc1' } as const;
    const a = fitCurve(rows, spec) as CurveFit;
    expect(a.diagnostics!.durbinWatson.pValueExact).toBeNull();
    const b = fitCurve(rows, spec, { exactDurbinWatson: true }) as CurveFit;
    const p = b.diagnostics!.durbinWatson.pValueExact!;
    expect(p).toBeGreaterThanOrEqual(0);
    expect(p).toBeLessThanOrEqual(1);
    expect(Math.abs(p - b.diagnostics!.durbinWatson.pValue!)).toBeLessThan(0.05);
  });
});
