import chisquareCdf from '@stdlib/stats-base-dists-chisquare-cdf';
import fCdf from '@stdlib/stats-base-dists-f-cdf';
import tCdf from '@stdlib/stats-base-dists-t-cdf';
import { chiSquareUpperTail, criticalValue, fUpperTail, studentTUpperTail, twoSidedP, upperTail } from './index';
import { ddAdd, ddDiv, ddMul, ddSqrt, twoProd, twoSum } from './index';

describe('distribution tails and critical values', () => {
  test('critical values: qt(0.975, 31) and qnorm(0.975) as written in the panel A fixture (R 4.2.2)', () => {
    expect(Math.abs(criticalValue(0.95, 31) - 2.039513446396408)).toBeLessThan(1e-15); // R: qt(0.975, 31), panel_A_results.json (1 ulp)
    expect(Math.abs(criticalValue(0.95, null) - 1.9599639845400536)).toBeLessThan(4e-16); // R: qnorm(0.975)
    expect(criticalValue(0.95, 7)).toBeCloseTo(2.3646242515927844, 14); // R: qt(0.975, 7) (pooled fixture critical_value)
  });

  test('studentTUpperTail agrees with @stdlib to 1e-12 relative over df 1..200 and t in [0, 40]', () => {
    let worst = 0;
    for (const nu of [1, 2, 3, 4, 5, 7, 10, 16, 31, 36, 57, 100, 151, 200]) {
      for (let t = 0; t < 40; t = t * 1.07 + 0.013) {
        const ref = tCdf(-t, nu);
        if (ref < 1e-300) continue;
        worst = Math.max(worst, Math.abs(studentTUpperTail(t, nu) - ref) / ref);
      }
    }
    expect(worst).toBeLessThan(1e-12);
  });

  test('upper tails keep relative accuracy where 1 − cdf cannot (t = 40, df 31: tail ≈ 1e-28)', () => {
    const p = studentTUpperTail(40, 31);
    expect(p).toBeGreaterThan(0);
    expect(Math.abs(p - tCdf(-40, 31)) / tCdf(-40, 31)).toBeLessThan(1e-12);
    expect(upperTail(-2, 31)).toBeCloseTo(1 - studentTUpperTail(2, 31), 15);
    expect(twoSidedP(-2, 31)).toBeCloseTo(2 * studentTUpperTail(2, 31), 15);
    expect(Number.isNaN(upperTail(NaN, 31))).toBe(true);
    expect(studentTUpperTail(2, 2.5)).toBeCloseTo(tCdf(-2, 2.5), 14); // non-integer df: @stdlib path
  });

  test('chi-square closed forms (Abramowitz & Stegun 26.4.4–5) agree with @stdlib where 1 − cdf is accurate', () => {
    for (const df of [1, 2, 3, 4, 5, 9, 30]) {
      for (const x of [0.01, 0.5, 1, 3, 8, 15]) {
        const ref = 1 - chisquareCdf(x, df);
        expect(Math.abs(chiSquareUpperTail(x, df) - ref)).toBeLessThan(1e-13);
      }
    }
    expect(chiSquareUpperTail(4, 2)).toBeCloseTo(Math.exp(-2), 15); // χ²(2) tail = e^(−x/2)
    expect(chiSquareUpperTail(0, 3)).toBe(1);
    expect(chiSquareUpperTail(3, 31)).toBeCloseTo(1 - chisquareCdf(3, 31), 14); // df > 30: @stdlib path
  });

  test('F(2, ν) closed form (1 + 2f/ν)^(−ν/2) agrees with @stdlib', () => {
    for (const d2 of [3, 31, 100])
      for (const f of [0.1, 1, 5, 40]) {
        const ref = fCdf(1 / f, d2, 2);
        expect(Math.abs(fUpperTail(f, 2, d2) - ref) / ref).toBeLessThan(1e-12);
      }
    expect(Math.abs(fUpperTail(2.5, 3, 31) - fCdf(1 / 2.5, 31, 3))).toBeLessThan(1e-15);
    expect(fUpperTail(0, 3, 31)).toBe(1);
  });
});

describe('double-double arithmetic', () => {
  test('twoSum and twoProd are exact (Knuth; Dekker 1971)', () => {
    expect(twoSum(1, 1e-17)).toEqual([1, 1e-17]);
    const [p, e] = twoProd(1 + 2 ** -30, 1 + 2 ** -30); // = 1 + 2^-29 + 2^-60 exactly
    expect(p).toBe(1 + 2 ** -29);
    expect(e).toBe(2 ** -60);
  });

  test('division and square root reach ~32 digits', () => {
    const [qh, ql] = ddDiv(1, 0, 3, 0);
    const [rh, rl] = ddMul(qh, ql, 3, 0);
    expect(Math.abs(rh - 1 + rl)).toBeLessThan(1e-31);
    const [sh, sl] = ddSqrt(2, 0);
    const [s2h, s2l] = ddMul(sh, sl, sh, sl);
    const [dh, dl] = ddAdd(s2h, s2l, -2, 0);
    expect(Math.abs(dh + dl)).toBeLessThan(1e-30);
  });
});
