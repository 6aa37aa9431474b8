/**
 * The heaviest body POST /api/estimate accepts: 1,000 rows (the row cap), 8 controls a
 * row and in the model (the control cap), Newey–West with lag 999 (n − 1, the lag cap).
 * Invented, seeded data: a smooth curve with noise and independent positive controls,
 * so the fit goes all the way through (not a correctness reference).
 */
import { seededRandom } from '../../api/demo/random';

export const MAX_ROWS = 1000;
export const MAX_CONTROLS = 8;

export function maximalEstimateBody(seed = 1) {
  const rng = seededRandom(seed);
  const names = Array.from({ length: MAX_CONTROLS }, (_, j) => `c${j + 1}`);
  const rows = Array.from({ length: MAX_ROWS }, (_, i) => {
    const lx = 8 + (3 * i) / MAX_ROWS + rng.normal() * 0.05;
    const controls = Object.fromEntries(names.map((n) => [n, Math.exp(rng.between(1, 3))]));
    const ly = 1 + 4 * (lx - 9.5) - 0.8 * (lx - 9.5) ** 2 + rng.normal() * 0.1;
    return { year: 1000 + i, y: Math.exp(ly), x: Math.exp(lx), controls };
  });
  return {
    model: { form: 'quadratic', transform: 'log', covariance: 'newey_west', lag: MAX_ROWS - 1, controls: names },
    rows,
  };
}
