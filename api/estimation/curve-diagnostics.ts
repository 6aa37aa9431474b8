import { breuschGodfrey } from './breusch-godfrey';
import { breuschPagan } from './breusch-pagan';
import { durbinWatson } from './durbin-watson';
import { durbinWatsonExactP } from './durbin-watson-exact';
import { jarqueBera } from './jarque-bera';
import type { CurveDiagnostics } from './types';
import type { Workspace } from './workspace';

/**
 * The residual diagnostics of a district fit, rows in year order: Durbin–Watson (normal
 * approximation; the exact Imhof p-value too when `exactDurbinWatson`),
 * Breusch–Godfrey of orders 1 and 2, studentized Breusch–Pagan, Jarque–Bera, the largest
 * leverage and the residuals by year.
 *
 * Formula: see durbin-watson.ts, breusch-godfrey.ts, breusch-pagan.ts, jarque-bera.ts;
 * leverage h_i = ‖q_i‖² (row i of thin Q), its largest value with the year.
 * References: Durbin & Watson (1950), Biometrika 37; Breusch (1978), Australian Economic
 * Papers 17; Godfrey (1978), Econometrica 46(6); Breusch & Pagan (1979), Econometrica
 * 47(5); Koenker (1981), Journal of Econometrics 17(1); Jarque & Bera (1980), Economics
 * Letters 6(3).
 *
 * Throws: nothing.
 *
 * Example: curveDiagnostics(e, q1, leverage, years, 35, 4).breuschGodfrey[1].order   // → 2
 */
export function curveDiagnostics(
  e: ArrayLike<number>,
  q1: Float64Array,
  leverage: ArrayLike<number>,
  years: ArrayLike<number>,
  n: number,
  k: number,
  ws?: Workspace,
  exactDurbinWatson = false,
): CurveDiagnostics {
  let best = 0;
  for (let i = 1; i < n; i++) if (leverage[i] > leverage[best]) best = i;
  const dw = durbinWatson(e, q1, n, k, ws);
  const residualsByYear = new Array<{ year: number; residual: number }>(n);
  for (let i = 0; i < n; i++) residualsByYear[i] = { year: years[i], residual: e[i] };
  return {
    durbinWatson: { ...dw, pValueExact: exactDurbinWatson ? durbinWatsonExactP(dw.statistic, q1, n, k) : null },
    breuschGodfrey: breuschGodfrey(e, q1, n, k, 2, ws),
    breuschPagan: breuschPagan(e, q1, n, k, ws),
    jarqueBera: jarqueBera(e),
    largestLeverage: n > 0 ? { value: leverage[best], year: years[best], row: best } : null,
    residualsByYear,
  };
}
