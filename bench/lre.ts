/**
 * Accuracy table of the engine on the eleven NIST StRD linear-regression datasets
 * (`npm run bench:lre`; not part of the test run): fits each with fitLeastSquares and
 * DEFAULT options and prints the minimum digits of agreement (LRE) of the coefficients,
 * their standard deviations, the residual SD and R² with NIST's certified values, and the
 * precision the fit ended in. The assertions live in tests/reference/nist-extra.test.ts.
 */
import { loadavg } from 'node:os';
import { NIST_DATASETS, fitNist, formatLreTable, loadNistCase, lreRow } from '../tests/reference/nist-all';

const rows = NIST_DATASETS.map((name) => {
  const c = loadNistCase(name);
  return lreRow(c, fitNist(c));
});
console.log(formatLreTable(rows));
console.log(
  `load average ${loadavg()
    .map((v) => v.toFixed(2))
    .join(' ')}`,
);
