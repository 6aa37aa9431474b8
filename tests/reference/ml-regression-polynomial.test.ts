/**
 * A second, independent reference for the engine's least squares: ml-regression-polynomial
 * 4.0 (`new PolynomialRegression(x, y, degree)`), which forms the normal equations F'F c = F'y
 * and solves them with ml-matrix's LU — a different algorithm from the engine's pivoted QR.
 *
 * Why the tolerance is 1e-10 relative: solving the normal equations loses about
 * log10(κ(F)²) digits, QR about log10(κ(F)). The designs below are well conditioned by
 * construction (x spread over [−1, 1] or [0, 2], degree ≤ 4: κ(F) < 100, so κ(F)² < 1e4) and
 * both methods then agree to at least 16 − 4 − 1 ≈ 11 significant digits; 1e-10 states that
 * bound with a digit to spare. (An ill-conditioned case is left to the NIST datasets, where
 * the normal equations would be the weaker side.)
 */
import { PolynomialRegression } from 'ml-regression-polynomial';
import { ols, polynomialDesign } from '../../api/estimation';

/** Deterministic, irregular noise: no random seed needed, the same on every machine. */
const wiggle = (i: number) => 0.05 * Math.sin(1.7 * i + 0.3) + 0.02 * Math.cos(5.1 * i);

function series(n: number, lo: number, hi: number, coefficients: number[]) {
  const x = Array.from({ length: n }, (_, i) => lo + ((hi - lo) * i) / (n - 1));
  const y = x.map((v, i) => coefficients.reduce((s, c, p) => s + c * v ** p, 0) + wiggle(i));
  return { x, y };
}

const relative = (a: number, b: number) => Math.abs(a - b) / Math.max(Math.abs(b), 1e-300);

describe('engine OLS agrees with ml-regression-polynomial on well-conditioned polynomial fits', () => {
  const cases = [
    { name: 'quadratic hump on [−1, 1], 30 points', degree: 2, n: 30, lo: -1, hi: 1, beta: [2, 0.8, -1.5] },
    { name: 'cubic on [0, 2], 40 points', degree: 3, n: 40, lo: 0, hi: 2, beta: [1, -0.5, 0.9, -0.3] },
    { name: 'quartic on [−1, 1], 60 points', degree: 4, n: 60, lo: -1, hi: 1, beta: [0.2, 1, -2, 0.5, 1.1] },
    { name: 'straight line on [0, 2], 12 points', degree: 1, n: 12, lo: 0, hi: 2, beta: [3, -1] },
  ];
  test.each(cases)('$name', ({ degree, n, lo, hi, beta }) => {
    const { x, y } = series(n, lo, hi, beta);
    const reference = new PolynomialRegression(x, y, degree);
    const X = x.map((v) => Array.from({ length: degree + 1 }, (_, p) => v ** p));
    const engine = ols(X, y);
    expect(reference.powers).toEqual(Array.from({ length: degree + 1 }, (_, p) => p));
    expect(engine.coefficients).toHaveLength(degree + 1);
    for (let p = 0; p <= degree; p++) {
      expect(relative(engine.coefficients[p], reference.coefficients[p])).toBeLessThan(1e-10);
    }
    // The noise keeps the fit honest: it must not have reproduced the generating coefficients exactly.
    expect(engine.rss).toBeGreaterThan(0);
  });

  test('the design helper the runs use gives the same fit as the plain power columns', () => {
    const { x, y } = series(25, 0.5, 1.5, [1, 2, -1]);
    const reference = new PolynomialRegression(x, y, 2);
    const design = polynomialDesign(x, 2);
    const engine = ols(design, y);
    for (let p = 0; p <= 2; p++)
      expect(relative(engine.coefficients[p], reference.coefficients[p])).toBeLessThan(1e-10);
  });
});
