import type { ShapeResult, SignRuleReading, UTestResult, WaldTestResult } from './types';

/**
 * The shape of the fitted curve over the observed range, decided in a fixed order at α.
 *
 * Rule (DOMAIN.md): (1) the Lind–Mehlum test rejects for its orientation → 'inverted_u'
 * or 'u'; (2) else the Wald F test that all slope coefficients are zero does not reject
 * → 'flat'; (3) else the sign of the slope at the middle of the range, (x_min + x_max)/2,
 * → 'increasing' or 'decreasing'. When the shape is not a U or inverted U and a turning
 * point exists outside [x_min, x_max], the note "turn beyond observed range" is added (the
 * point and its interval stay visible). For a cubic the same steps apply over the range with
 * the cubic slope; when the slope changes sign twice inside the range (an N or inverted N,
 * which none of the five names describes) the end slopes share a sign, the U-test does not
 * reject, the shape falls to steps 2–3 and the note "two turning points inside observed
 * range" says so. A Wald test that cannot be computed falls through to (3) with a note.
 * References: Lind & Mehlum (2010), Oxford Bulletin of Economics and Statistics 72(1),
 * 109–118; Wald (1943), Transactions of the AMS 54(3), 426–482.
 *
 * Throws: nothing.
 *
 * Example (PA04: b1 < 0, b2 > 0 but the turn at 15.4 is far above the data):
 *   classifyShape({ uTest, wald, slopeAtMidpoint: { x: 10.24, value: -0.55, se: 0.05 },
 *     turningPoints: [{ x: 15.44, inRange: false }], signRule }).shape   // → 'decreasing'
 */
export function classifyShape(input: {
  uTest: UTestResult;
  wald: WaldTestResult;
  slopeAtMidpoint: { x: number; value: number; se: number | null };
  turningPoints: ReadonlyArray<{ x: number; inRange: boolean }>;
  signRule: SignRuleReading | null;
}): ShapeResult {
  const { uTest, wald, slopeAtMidpoint, turningPoints, signRule } = input;
  const notes: string[] = [];
  const inside = turningPoints.filter((t) => t.inRange).length;
  if (inside >= 2) notes.push('two turning points inside observed range');
  let shape: ShapeResult['shape'];
  let decidedBy: ShapeResult['decidedBy'];
  if (uTest.rejects) {
    shape = uTest.orientation;
    decidedBy = 'u_test';
  } else if (wald.rejects === false) {
    shape = 'flat';
    decidedBy = 'wald_flat';
  } else {
    if (wald.rejects === null) notes.push(`joint test of the slope terms not available (${wald.reason ?? 'unknown'})`);
    shape = slopeAtMidpoint.value >= 0 ? 'increasing' : 'decreasing';
    decidedBy = 'slope_at_midpoint';
  }
  if (shape !== 'inverted_u' && shape !== 'u' && turningPoints.some((t) => !t.inRange)) {
    notes.push('turn beyond observed range');
  }
  return { shape, decidedBy, notes, slopeAtMidpoint, signRule };
}
