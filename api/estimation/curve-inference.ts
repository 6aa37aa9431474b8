import { buildTurningPoints } from './build-turning-points';
import { classifyShape } from './classify-shape';
import { criticalValue, twoSidedP } from './distributions';
import type { ModelSpec } from './model-spec';
import { signRuleReading } from './sign-rule';
import type { CriticalValueInfo, ShapeResult, TurningPoint, UTestResult, WaldTestResult } from './types';
import { lindMehlumTest } from './u-test';
import { waldTest } from './wald-test';

/**
 * Everything that follows from the slope coefficients of a fitted curve and their
 * covariance, shared by fitCurve (one district, df = n − k) and fitPanel (df = G − 1):
 * the critical value, turning points with delta and Fieller intervals, the Lind–Mehlum
 * U-test, the Wald F test of the slope terms, the common-practice sign reading and the
 * shape over the observed range.
 *
 * Formula: c = t quantile (1 + level)/2 with `df` degrees of freedom, or the normal one
 * when spec.criticalValue = 'normal' (then the U-test uses N(0,1) and the Wald test χ²(q));
 * the rest as in build-turning-points.ts, u-test.ts, wald-test.ts, sign-rule.ts and
 * classify-shape.ts; slope at the midpoint (x_min + x_max)/2 with its delta SE.
 * References: Fieller (1954); Lind & Mehlum (2010); Wald (1943) — see those files.
 *
 * Throws: nothing.
 *
 * Example: curveInference({ coefficients: b, covariance: V, slopeStart: 1, slopeTerms: 2, xMin, xMax, df: 31, spec })
 *   .shape.shape   // → 'inverted_u' for PA01
 */
export function curveInference(input: {
  coefficients: ReadonlyArray<number>;
  covariance: ReadonlyArray<ReadonlyArray<number>>;
  /** index of b1 in the coefficient vector (1 with a constant, 0 for the within panel) */
  slopeStart: number;
  slopeTerms: number;
  xMin: number;
  xMax: number;
  df: number;
  spec: ModelSpec;
}): {
  critical: CriticalValueInfo;
  turningPoints: TurningPoint[];
  uTest: UTestResult;
  wald: WaldTestResult;
  shape: ShapeResult;
} {
  const { coefficients: b, covariance: V, slopeStart: s0, slopeTerms: m, xMin, xMax, spec } = input;
  const df = spec.criticalValue === 'normal' ? null : input.df;
  const c = criticalValue(spec.level, df);
  const slope = b.slice(s0, s0 + m);
  const slopeCov = V.slice(s0, s0 + m).map((row) => row.slice(s0, s0 + m));
  const turningPoints = buildTurningPoints({
    slope,
    slopeCovariance: slopeCov,
    xMin,
    xMax,
    critical: c,
    transform: spec.transform,
    intervalMethod: spec.intervalMethod,
  });
  const uTest = lindMehlumTest(slope, slopeCov, xMin, xMax, df, spec.alpha);
  const wald = waldTest(slope, slopeCov, df, spec.alpha);
  const xm = 0.5 * (xMin + xMax);
  const a = [1, 2 * xm, 3 * xm * xm].slice(0, m);
  let value = 0,
    v = 0;
  for (let i = 0; i < m; i++) {
    value += a[i] * slope[i];
    for (let j = 0; j < m; j++) v += a[i] * slopeCov[i][j] * a[j];
  }
  const signRule =
    m === 2
      ? signRuleReading(
          slope[0],
          slope[1],
          twoSidedP(slope[0] / Math.sqrt(slopeCov[0][0]), df),
          twoSidedP(slope[1] / Math.sqrt(slopeCov[1][1]), df),
          spec.alpha,
        )
      : null;
  const shape = classifyShape({
    uTest,
    wald,
    turningPoints,
    signRule,
    slopeAtMidpoint: { x: xm, value, se: v >= 0 ? Math.sqrt(v) : null },
  });
  return {
    critical: { kind: df === null ? 'normal' : 't', df, value: c, level: spec.level },
    turningPoints,
    uTest,
    wald,
    shape,
  };
}
