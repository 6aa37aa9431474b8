import { EstimationInputError, ols, polynomialDesign } from './index';

// Small problems with values that follow from the formulas by hand (noted beside each), and
// robust covariances checked against the textbook sandwich written out with explicit
// inverses of XᵀX (an independent route, fine for well-conditioned test data).

function inv(m: number[][]): number[][] {
  const n = m.length;
  const a = m.map((r, i) => [...r, ...Array.from({ length: n }, (_, j) => (i === j ? 1 : 0))]);
  for (let c = 0; c < n; c++) {
    let p = c;
    for (let r = c + 1; r < n; r++) if (Math.abs(a[r][c]) > Math.abs(a[p][c])) p = r;
    [a[c], a[p]] = [a[p], a[c]];
    const d = a[c][c];
    for (let j = 0; j < 2 * n; j++) a[c][j] /= d;
    for (let r = 0; r < n; r++)
      if (r !== c) {
        const f = a[r][c];
        for (let j = 0; j < 2 * n; j++) a[r][j] -= f * a[c][j];
      }
  }
  return a.map((r) => r.slice(n));
}
const mul = (A: number[][], B: number[][]) =>
  A.map((r) => B[0].map((_, j) => r.reduce((s, v, m) => s + v * B[m][j], 0)));
const tr = (A: number[][]) => A[0].map((_, j) => A.map((r) => r[j]));
function sandwich(X: number[][], w: (i: number, j: number) => number, factor: number): number[][] {
  const bread = inv(mul(tr(X), X));
  const n = X.length,
    k = X[0].length;
  const meat = Array.from({ length: k }, () => new Array(k).fill(0));
  for (let i = 0; i < n; i++)
    for (let j = 0; j < n; j++) {
      const wij = w(i, j);
      if (wij === 0) continue;
      for (let a = 0; a < k; a++) for (let b = 0; b < k; b++) meat[a][b] += wij * X[i][a] * X[j][b];
    }
  return mul(mul(bread, meat), bread).map((r) => r.map((v) => v * factor));
}

const X = Array.from({ length: 12 }, (_, i) => [1, i, Math.sin(i)]);
const y = X.map((r, i) => 1 + 0.5 * r[1] - 2 * r[2] + 0.3 * Math.cos(3 * i));

describe('ols', () => {
  test('a line through three points (by hand: b = (−2/3, 3/2), s² = 1/6)', () => {
    const f = ols(
      [
        [1, 1],
        [1, 2],
        [1, 3],
      ],
      [1, 2, 4],
    );
    expect(f.coefficients[0]).toBeCloseTo(-2 / 3, 15);
    expect(f.coefficients[1]).toBeCloseTo(1.5, 15);
    f.residuals.forEach((e, i) => expect(e).toBeCloseTo([1 / 6, -1 / 3, 1 / 6][i], 15));
    expect(f.rss).toBeCloseTo(1 / 6, 15);
    expect(f.covariance[0][0]).toBeCloseTo(7 / 18, 14); // s²·(XᵀX)⁻¹₁₁ = (1/6)(7/3)
    expect(f.covariance[0][1]).toBeCloseTo(-1 / 6, 14);
    expect(f.df).toBe(1);
    expect(f.rank).toBe(2);
    expect(f.rSquared).toBeCloseTo(1 - 1 / 6 / (14 / 3), 14); // TSS about the mean = 14/3
    f.leverage.forEach((h, i) => expect(h).toBeCloseTo([5 / 6, 1 / 3, 5 / 6][i], 14)); // 1/n + (x−x̄)²/Sxx
  });

  test('accepts a column-major DesignMatrix and gives the same fit as rows', () => {
    const d = polynomialDesign(
      X.map((r) => r[1]),
      2,
    );
    const a = ols(d, y);
    const b = ols(
      X.map((r) => [1, r[1], r[1] * r[1]]),
      y,
    );
    a.coefficients.forEach((v, j) => expect(Math.abs(v - b.coefficients[j])).toBeLessThan(1e-13 * (1 + Math.abs(v))));
  });

  test('R² about zero without a constant column, as R summary.lm (no intercept: 1 − RSS/Σy²)', () => {
    const f = ols(
      X.map((r) => [r[1], r[2]]),
      y,
    );
    const rss = f.residuals.reduce((s, e) => s + e * e, 0);
    expect(f.rSquared).toBeCloseTo(1 - rss / y.reduce((s, v) => s + v * v, 0), 14);
    expect(f.adjRSquared).toBeCloseTo(1 - (1 - f.rSquared) * (12 / 10), 14);
  });

  test.each([
    ['hc0', (i: number, j: number, e: number[]) => (i === j ? e[i] ** 2 : 0), 1],
    ['hc1', (i: number, j: number, e: number[]) => (i === j ? e[i] ** 2 : 0), 12 / 9],
  ] as const)(
    "%s equals the explicit sandwich (X'X)⁻¹ X'ΩX (X'X)⁻¹ · factor (MacKinnon & White 1985)",
    (type, w, factor) => {
      const f = ols(X, y, { covariance: type });
      const V = sandwich(X, (i, j) => w(i, j, f.residuals), factor);
      for (let a = 0; a < 3; a++)
        for (let b = 0; b < 3; b++)
          expect(Math.abs(f.covariance[a][b] - V[a][b])).toBeLessThan(1e-12 * Math.sqrt(V[a][a] * V[b][b]));
    },
  );

  test('hc3 weights e²/(1 − h)² (MacKinnon & White 1985)', () => {
    const f = ols(X, y, { covariance: 'hc3' });
    const V = sandwich(X, (i, j) => (i === j ? f.residuals[i] ** 2 / (1 - f.leverage[i]) ** 2 : 0), 1);
    for (let a = 0; a < 3; a++) expect(Math.abs(f.covariance[a][a] - V[a][a])).toBeLessThan(1e-12 * V[a][a]);
  });

  test('Newey–West: Bartlett weights 1 − |i−j|/(L+1), factor n/(n−k) (Newey & West 1987); lag 0 equals HC1', () => {
    const f = ols(X, y, { covariance: 'newey_west', lag: 2 });
    expect(f.covarianceInfo).toEqual({ type: 'newey_west', factor: 12 / 9, lag: 2, clusters: null });
    const V = sandwich(
      X,
      (i, j) => (Math.abs(i - j) <= 2 ? (1 - Math.abs(i - j) / 3) * f.residuals[i] * f.residuals[j] : 0),
      12 / 9,
    );
    for (let a = 0; a < 3; a++)
      for (let b = 0; b < 3; b++)
        expect(Math.abs(f.covariance[a][b] - V[a][b])).toBeLessThan(1e-12 * Math.sqrt(V[a][a] * V[b][b]));
    const nw0 = ols(X, y, { covariance: 'newey_west', lag: 0 });
    const hc1 = ols(X, y, { covariance: 'hc1' });
    nw0.standardErrors.forEach((s, j) => expect(s).toBeCloseTo(hc1.standardErrors[j], 14));
    expect(ols(X, y, { covariance: 'newey_west' }).covarianceInfo.lag).toBe(2); // floor(4·(12/100)^(2/9)) = 2
    const noAdjust = ols(X, y, { covariance: 'newey_west', lag: 2, adjust: false });
    expect(noAdjust.covariance[1][1]).toBeCloseTo((f.covariance[1][1] * 9) / 12, 14);
  });

  test('cluster: each factor option (Arellano 1987 sandwich, factors by definition)', () => {
    const clusters = X.map((_, i) => `g${i % 4}`);
    const sameGroup = (i: number, j: number) => i % 4 === j % 4;
    const base = ols(X, y, { covariance: 'cluster', clusters, clusterAdjustment: 'none' });
    const V = sandwich(X, (i, j) => (sameGroup(i, j) ? base.residuals[i] * base.residuals[j] : 0), 1);
    for (let a = 0; a < 3; a++) expect(Math.abs(base.covariance[a][a] - V[a][a])).toBeLessThan(1e-12 * V[a][a]);
    const factors = { n_over_n_minus_k: 12 / 9, g_over_g_minus_1: 4 / 3, combined: (4 / 3) * (11 / 9) } as const;
    for (const [adj, fac] of Object.entries(factors)) {
      const f = ols(X, y, { covariance: 'cluster', clusters, clusterAdjustment: adj as keyof typeof factors });
      expect(f.covarianceInfo.factor).toBeCloseTo(fac, 15);
      expect(f.covarianceInfo.clusters).toBe(4);
      expect(f.covariance[2][2]).toBeCloseTo(base.covariance[2][2] * fac, 14);
    }
    const k2 = ols(X, y, { covariance: 'cluster', clusters, clusterParameterCount: 2 });
    expect(k2.covarianceInfo.factor).toBeCloseTo(12 / 10, 15);
  });

  test('rank deficiency is an error naming the dependent column and what it depends on', () => {
    const rows = [
      [1, 1, 2],
      [1, 2, 4],
      [1, 3, 6],
      [1, 4, 8],
    ];
    try {
      ols(rows, [1, 2, 4, 5], { names: ['const', 'a', 'b'] });
      throw new Error('no error');
    } catch (e) {
      expect(e).toBeInstanceOf(EstimationInputError);
      const err = e as EstimationInputError;
      expect(err.code).toBe('rank_deficient');
      expect(err.details).toEqual({ rank: 2, k: 3, dependent: ['b'], dependsOn: { b: ['a'] } });
      expect(err.message).toContain("column 'b' is a linear combination of 'a'");
    }
    expect(() =>
      ols(
        [
          [1, 1, 0],
          [1, 2, 0],
          [1, 3, 0],
          [1, 4, 0],
        ],
        [1, 2, 4, 5],
        { names: ['const', 'a', 'z'] },
      ),
    ).toThrow("column 'z' is all zeros");
    // dummies that add up to the constant
    expect(() =>
      ols(
        [
          [1, 1, 0, 1],
          [1, 0, 1, 2],
          [1, 1, 0, 3],
          [1, 0, 1, 4],
          [1, 1, 0, 2],
        ],
        [1, 2, 4, 5, 3],
        { names: ['const', 'd1', 'd2', 'x'] },
      ),
    ).toThrow(/column 'd1' is a linear combination of 'const', 'd2'/);
  });

  test('bad input: non-finite values name the row and column; ragged rows; n ≤ k; bad options', () => {
    const code = (f: () => unknown) => {
      try {
        f();
      } catch (e) {
        return [(e as EstimationInputError).code, (e as EstimationInputError).details];
      }
      return null;
    };
    expect(
      code(() =>
        ols(
          [
            [1, 1],
            [1, NaN],
            [1, 3],
          ],
          [1, 2, 3],
          { names: ['const', 'x'] },
        ),
      ),
    ).toEqual(['non_finite_value', { row: 1, column: 'x', value: 'NaN' }]);
    expect(
      code(() =>
        ols(
          [
            [1, 1],
            [1, 2],
            [1, 3],
          ],
          [1, Infinity, 3],
        ),
      )?.[0],
    ).toBe('non_finite_value');
    expect(code(() => ols([[1, 1], [1], [1, 3]], [1, 2, 3]))?.[0]).toBe('invalid_argument');
    expect(
      code(() =>
        ols(
          [
            [1, 1],
            [1, 2],
          ],
          [1, 2],
        ),
      ),
    ).toEqual(['invalid_argument', { reason: 'too_few_rows', n: 2, k: 2 }]);
    expect(
      code(() =>
        ols(
          [
            [1, 1],
            [1, 2],
            [1, 3],
          ],
          [1, 2],
        ),
      )?.[0],
    ).toBe('invalid_argument');
    expect(code(() => ols(X, y, { covariance: 'newey_west', lag: 12 }))?.[0]).toBe('invalid_argument');
    expect(code(() => ols(X, y, { covariance: 'newey_west', lag: 1.5 }))?.[0]).toBe('invalid_argument');
    expect(code(() => ols(X, y, { covariance: 'cluster' }))?.[0]).toBe('invalid_argument');
    expect(code(() => ols(X, y, { covariance: 'cluster', clusters: X.map(() => 'one') }))?.[0]).toBe(
      'invalid_argument',
    );
  });

  test('HC3 with a row of leverage 1 is covariance_undefined, naming the row', () => {
    // row 3 is the only one with a non-zero third column: it is fitted exactly (h = 1)
    const Xs = [
      [1, 0, 0],
      [1, 1, 0],
      [1, 2, 0],
      [1, 3, 1],
      [1, 4, 0],
    ];
    expect(() => ols(Xs, [1, 2, 3, 9, 5], { covariance: 'hc3' })).toThrow(
      expect.objectContaining({ code: 'covariance_undefined', details: expect.objectContaining({ row: 3 }) }),
    );
  });

  test('refinement: residuals are orthogonal to the columns to working accuracy', () => {
    const f = ols(X, y);
    for (let j = 0; j < 3; j++) {
      const s = X.reduce((acc, r, i) => acc + r[j] * f.residuals[i], 0);
      expect(Math.abs(s)).toBeLessThan(1e-13 * Math.max(...X.map((r) => Math.abs(r[j]))) * 12);
    }
    expect(f.condition.precision).toBe('double');
    expect(f.condition.scaledEstimate).toBeGreaterThanOrEqual(1);
    expect(f.condition.estimate).toBeGreaterThanOrEqual(f.condition.scaledEstimate / 100);
  });
});
