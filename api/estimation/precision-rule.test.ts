import { fitLeastSquares, forwardErrorEstimate, FORWARD_ERROR_THRESHOLD } from './index';

// The 'auto' precision rule: the forward-error estimate u·κ·(1 + κ‖r‖/(‖X‖‖b‖)) (Higham
// 2002, §20.1) decides, not κ alone. Expected values: a double-double solve of the same
// problem (the engine's own higher-precision path) and the estimate's definition.

/** mulberry32, seeded: invented data (plumbing), not a reference dataset. */
function rng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

function degree5(seed: number): { data: Float64Array; y: Float64Array; n: number; k: number } {
  const u = rng(seed);
  const n = 21,
    k = 6;
  const data = new Float64Array(n * k);
  const y = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < k; j++) data[j * n + i] = i ** j; // x = 0…20, exact powers
    y[i] = u() - 0.5; // pure noise about 0: R² near 0
  }
  return { data, y, n, k };
}

describe("'auto' precision from the forward-error bound", () => {
  test('degree-5 polynomial on x = 0…20 with R² near 0: small κ, large residual term, auto matches double-double', () => {
    const { data, y, n, k } = degree5(12);
    const X = { nRows: n, nCols: k, data };
    const plain = fitLeastSquares(X, y, { precision: 'double' });
    const dd = fitLeastSquares(X, y, { precision: 'double-double' });
    const auto = fitLeastSquares(X, y);
    expect(plain.result.condition.scaledEstimate).toBeLessThan(1e5); // the old κ > 1e7 switch never fired here
    expect(plain.result.rSquared).toBeLessThan(0.5);
    expect(forwardErrorEstimate(plain.core, plain.result.condition.scaledEstimate)).toBeGreaterThan(
      FORWARD_ERROR_THRESHOLD,
    );
    const rel = (a: number[], b: number[]) => Math.max(...a.map((v, j) => Math.abs(v - b[j]) / Math.abs(b[j])));
    expect(rel(auto.result.coefficients, dd.result.coefficients)).toBeLessThan(1e-11);
    expect(rel(auto.result.standardErrors, dd.result.standardErrors)).toBeLessThan(1e-10);
  });

  test('a well-conditioned, well-fitting problem stays in plain double with no extra steps', () => {
    const n = 30;
    const data = new Float64Array(n * 2);
    const y = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      data[i] = 1;
      data[n + i] = i / n;
      y[i] = 2 + 3 * (i / n) + 0.01 * Math.sin(i);
    }
    const f = fitLeastSquares({ nRows: n, nCols: 2, data }, y);
    expect(f.result.condition.precision).toBe('double');
    expect(forwardErrorEstimate(f.core, f.result.condition.scaledEstimate)).toBeLessThan(FORWARD_ERROR_THRESHOLD);
  });

  test('the estimate follows its definition: u·κ·(1 + κ·‖r‖/‖D·b‖)·‖D·b‖/min|D_j·b_j| (‖X·D⁻¹‖ taken as 1)', () => {
    const { data, y, n, k } = degree5(3);
    const f = fitLeastSquares({ nRows: n, nCols: k, data }, y, { precision: 'double' });
    const kappa = 1e3;
    let nb = 0;
    const scaled: number[] = [];
    for (let j = 0; j < k; j++) {
      let cn = 0;
      for (let i = 0; i < n; i++) cn += data[j * n + i] ** 2;
      nb += cn * f.result.coefficients[j] ** 2;
      scaled.push(Math.sqrt(cn) * Math.abs(f.result.coefficients[j]));
    }
    // Every coefficient here carries far more than 1e-8 of ‖D·b‖, so all count for the smallest.
    const amplification = Math.sqrt(nb) / Math.min(...scaled);
    expect(amplification).toBeGreaterThan(1);
    const expected = 2 ** -53 * kappa * (1 + (kappa * Math.sqrt(f.result.rss)) / Math.sqrt(nb)) * amplification;
    expect(forwardErrorEstimate(f.core, kappa) / expected).toBeCloseTo(1, 10);
  });
});

test('plain double really loses digits on that problem (why the rule exists)', () => {
  const { data, y, n, k } = degree5(12);
  const X = { nRows: n, nCols: k, data };
  const plain = fitLeastSquares(X, y, { precision: 'double' }).result.coefficients;
  const dd = fitLeastSquares(X, y, { precision: 'double-double' }).result.coefficients;
  const worst = Math.max(...plain.map((v, j) => Math.abs(v - dd[j]) / Math.abs(dd[j])));
  expect(worst).toBeGreaterThan(1e-11);
});
