import type { SignRuleReading } from './types';

/**
 * The common-practice first reading of a quadratic from the signs of b1 and b2.
 *
 * Rule (common practice, not a test of shape): both coefficients insignificant at α
 * (two-sided p ≥ α) → 'flat'; else b1 > 0, b2 < 0 → 'inverted_u'; b1 < 0, b2 > 0 → 'u';
 * both > 0 → 'increasing'; both < 0 → 'decreasing' (a zero sign reads with the other one).
 * The product decides the shape over the observed range instead (classify-shape.ts): a
 * turning point outside [x_min, x_max] means the curve is monotone where there is data.
 * Reference: none — a rule of the trade, shown beside the shape as the "first read".
 *
 * Throws: nothing.
 *
 * Example:
 *   signRuleReading(1.6473, -0.0448, 0.01, 0.02, 0.05).reading   // → 'inverted_u'
 *   signRuleReading(-1.9, 0.09, 0.4, 0.4, 0.05).reading          // → 'flat'
 */
export function signRuleReading(b1: number, b2: number, pB1: number, pB2: number, alpha: number): SignRuleReading {
  let reading: SignRuleReading['reading'];
  if (!(pB1 < alpha) && !(pB2 < alpha)) reading = 'flat';
  else if (b1 > 0 && b2 < 0) reading = 'inverted_u';
  else if (b1 < 0 && b2 > 0) reading = 'u';
  else if (b1 >= 0 && b2 >= 0) reading = 'increasing';
  else reading = 'decreasing';
  return { reading, b1, b2, pB1, pB2, alpha };
}
