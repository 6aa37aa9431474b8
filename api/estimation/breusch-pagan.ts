import { chiSquareUpperTail } from './distributions';
import { take, type Workspace } from './workspace';

/**
 * Studentized Breusch–Pagan (Koenker) test for heteroskedasticity against the regressors.
 *
 * Formula: w_i = e_i² − σ̂², σ̂² = Σe²/n; regress w on X (the model's own regressors);
 * BP = n·Σŵ²/Σw² = n·‖Q₁ᵀw‖²/‖w‖² against χ²(k − 1) — R's lmtest::bptest(fit) default
 * (studentize = TRUE).
 * References: Breusch, T. S. and Pagan, A. R. (1979), "A simple test for
 * heteroscedasticity and random coefficient variation", Econometrica 47(5), 1287–1294;
 * Koenker, R. (1981), "A note on studentizing a test for heteroscedasticity", Journal of
 * Econometrics 17(1), 107–112.
 *
 * Throws: nothing; statistic null when all squared residuals are equal (w = 0) or k < 2.
 *
 * Example: breuschPagan(e, q1, 35, 4) on PA01   // → { statistic: …, df: 3, pValue: … } (see the R fixture)
 */
export function breuschPagan(
  e: ArrayLike<number>,
  q1: Float64Array,
  n: number,
  k: number,
  ws?: Workspace,
): { statistic: number | null; df: number; pValue: number | null } {
  const df = k - 1;
  if (k < 2) return { statistic: null, df, pValue: null };
  let s2 = 0;
  for (let i = 0; i < n; i++) s2 += e[i] * e[i];
  s2 /= n;
  const w = take(ws, n);
  let ww = 0;
  for (let i = 0; i < n; i++) {
    w[i] = e[i] * e[i] - s2;
    ww += w[i] * w[i];
  }
  if (!(ww > 0)) return { statistic: null, df, pValue: null };
  let fit = 0;
  for (let c = 0; c < k; c++) {
    let s = 0;
    for (let i = 0; i < n; i++) s += q1[c * n + i] * w[i];
    fit += s * s;
  }
  const statistic = (n * fit) / ww;
  return { statistic, df, pValue: chiSquareUpperTail(statistic, df) };
}
