/**
 * Default Newey–West truncation lag for n yearly rows: L = floor(4·(n/100)^(2/9)).
 *
 * Formula: the rule of thumb floor(4·(T/100)^(2/9)) for the Bartlett kernel.
 * Reference: Newey, W. K. and West, K. D. (1994), "Automatic lag selection in covariance
 * matrix estimation", Review of Economic Studies 61(4), 631–653 (the usual attribution of
 * this rule; the project adopts it as its stated default).
 *
 * Throws: nothing; n ≤ 0 gives 0.
 *
 * Example:
 *   defaultNeweyWestLag(35)   // → 3
 *   defaultNeweyWestLag(40)   // → 3
 *   defaultNeweyWestLag(100)  // → 4
 */
export function defaultNeweyWestLag(n: number): number {
  if (!(n > 0)) return 0;
  return Math.floor(4 * Math.pow(n / 100, 2 / 9));
}
