import type { ShapeResult, SignRuleReading, UTestResult, WaldTestResult } from './types';

/**
 * The shape of the fitted curve over the observed range, decided in a fixed order at α.
 *
 * Rule (docs/method.md): (1) the Lind–Mehlum test rejects for its orientation → 'inverted_u'
 * or 'u'; (2) else the Wald F test that all slope coefficients are zero does not reject
 * → 'flat'; (3) else the sign of the slope at the middle of the range, (x_min + x_max)/2,
 * → 'increasing' or 'decreasing'. When the shape is not a U or inverted U and a turning
 * point exists outside [x_min, x_max], the note "turn beyond observed range" is added (the
 * point and its interval stay visible). For a cubic the same steps apply over the range with
 * the cubic slope, and a cubic whose slope changes sign twice inside the range (both turning
 * points inside [x_min, x_max], the end slopes then share a sign so the U-test cannot
 * reject) is, after step 2, 'n_shape' when the lower turn is a peak (rises, falls, rises
 * again) or 'inverted_n' when it is a trough (falls, rises, falls). A Wald test that cannot
 * be computed falls through to the next step with a note.
 * References: Lind & Mehlum (2010), Oxford Bulletin of Economics and Statistics 72(1),
 * 109–118; Wald (1943), Transactions of the AMS 54(3), 426–482.
 *
 * Throws: nothing.
 *
 * Example (PA04: b1 < 0, b2 > 0 but the turn at 15.4 is far above the data):
 *   classifyShape({ uTest, wald, slopeAtMidpoint: { x: 10.24, value: -0.55, se: 0.05 },
 *     turningPoints: [{ x: 15.44, inRange: false }], signRule }).shape   // → 'decreasing'
 */
/** Shapes whose reading has a turning point to stand against. */
export function hasTurn(shape: ShapeResult['shape']): boolean {
  return shape === 'inverted_u' || shape === 'u' || shape === 'n_shape' || shape === 'inverted_n';
}

export function classifyShape(input: {
  uTest: UTestResult;
  wald: WaldTestResult;
  slopeAtMidpoint: { x: number; value: number; se: number | null };
  turningPoints: ReadonlyArray<{ x: number; inRange: boolean; kind?: 'peak' | 'trough' }>;
  signRule: SignRuleReading | null;
}): ShapeResult {
  const { uTest, wald, slopeAtMidpoint, turningPoints, signRule } = input;
  const notes: string[] = [];
  const inside = turningPoints.filter((t) => t.inRange).sort((a, b) => a.x - b.x);
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
    if (inside.length >= 2 && inside[0].kind !== undefined && inside[0].kind !== inside[1].kind) {
      shape = inside[0].kind === 'peak' ? 'n_shape' : 'inverted_n';
      decidedBy = 'two_turns_in_range';
    } else {
      shape = slopeAtMidpoint.value >= 0 ? 'increasing' : 'decreasing';
      decidedBy = 'slope_at_midpoint';
    }
  }
  if (!hasTurn(shape) && turningPoints.some((t) => !t.inRange)) {
    notes.push('turn beyond observed range');
  }
  return { shape, decidedBy, notes, slopeAtMidpoint, signRule };
}
