import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import {
  fitLeastSquares,
  polynomialDesign,
  type DesignMatrix,
  type OlsOptions,
  type OlsResult,
} from '../../api/estimation';

/**
 * The eleven NIST StRD linear least-squares datasets, read from the fixtures
 * (tests/fixtures/reference/nist: Norris, Pontius, Filip, Longley; tests/fixtures/nist-extra:
 * NoInt1, NoInt2, Wampler1–5), each with its design built the way the engine builds a
 * polynomial design (raw powers with double-double low parts, polynomialDesign) and fitted
 * with fitLeastSquares, the lowest-level public engine function that takes a design matrix.
 */
export const NIST_DATASETS = [
  'Norris',
  'Pontius',
  'NoInt1',
  'NoInt2',
  'Filip',
  'Longley',
  'Wampler1',
  'Wampler2',
  'Wampler3',
  'Wampler4',
  'Wampler5',
] as const;
export type NistName = (typeof NIST_DATASETS)[number];

export interface NistCase {
  name: NistName;
  X: DesignMatrix;
  y: Float64Array;
  /** NIST's parameter names in column order (B0…, or B1 alone for the models through the origin) */
  parameters: string[];
  certified: { coefficients: number[]; stddev: number[]; residual_sd: number; r_squared: number };
}

const FOLDER: Record<NistName, string> = {
  Norris: 'reference/nist',
  Pontius: 'reference/nist',
  Filip: 'reference/nist',
  Longley: 'reference/nist',
  NoInt1: 'nist-extra',
  NoInt2: 'nist-extra',
  Wampler1: 'nist-extra',
  Wampler2: 'nist-extra',
  Wampler3: 'nist-extra',
  Wampler4: 'nist-extra',
  Wampler5: 'nist-extra',
};

export function loadNistCase(name: NistName): NistCase {
  const file = join(__dirname, '..', 'fixtures', FOLDER[name], `${name}.json`);
  const d = JSON.parse(readFileSync(file, 'utf8'));
  const y = Float64Array.from(d.y as number[]);
  let X: DesignMatrix;
  if (name === 'Longley') {
    const n = y.length;
    const data = new Float64Array(n * 7);
    data.fill(1, 0, n);
    for (let j = 1; j <= 6; j++) data.set(d.x_columns[`x${j}`] as number[], j * n);
    X = { nRows: n, nCols: 7, data };
  } else {
    const intercept: boolean = d.model.intercept !== false;
    X = polynomialDesign(d.x_columns.x as number[], d.model.degree ?? 1, intercept);
  }
  return { name, X, y, parameters: d.model.parameters, certified: d.certified };
}

/**
 * Digits of agreement with a certified value: the log relative error −log10(|est − cert|/|cert|)
 * (McCullough 1998, JASA-style accuracy assessment), or, where the certified value is 0
 * (Wampler1 and Wampler2 standard deviations and residual SD), the log absolute error
 * −log10|est|; capped to [0, 15], the digits NIST certifies.
 */
export function digits(est: number, cert: number): number {
  if (est === cert) return 15;
  const err = cert === 0 ? Math.abs(est) : Math.abs(est - cert) / Math.abs(cert);
  return Math.min(15, Math.max(0, -Math.log10(err)));
}

export interface LreRow {
  dataset: NistName;
  coefficients: number;
  stddevs: number;
  residualSd: number;
  rSquared: number;
  precision: string;
  /** NIST name of the parameter with the fewest correct digits (coefficient, standard deviation) */
  worstCoefficient: string;
  worstStddev: string;
}

export function fitNist(c: NistCase, options: OlsOptions = {}): OlsResult {
  return fitLeastSquares(c.X, c.y, options).result;
}

export function lreRow(c: NistCase, fit: OlsResult): LreRow {
  const lc = fit.coefficients.map((b, j) => digits(b, c.certified.coefficients[j]));
  const ls = fit.standardErrors.map((s, j) => digits(s, c.certified.stddev[j]));
  const minAt = (v: number[]) => v.reduce((m, x, j) => (x < v[m] ? j : m), 0);
  return {
    dataset: c.name,
    coefficients: Math.min(...lc),
    stddevs: Math.min(...ls),
    residualSd: digits(fit.residualStandardError, c.certified.residual_sd),
    rSquared: digits(fit.rSquared, c.certified.r_squared),
    precision: fit.condition.precision,
    worstCoefficient: c.parameters[minAt(lc)],
    worstStddev: c.parameters[minAt(ls)],
  };
}

export function formatLreTable(rows: LreRow[]): string {
  const f = (v: number) => v.toFixed(1).padStart(7);
  return [
    'NIST StRD linear regression, default options: minimum digits (LRE; LAE where certified 0; 15 = all)',
    'dataset      coef     sd  resSD     R²  worst(B/SD)  precision',
    ...rows.map(
      (r) =>
        `${r.dataset.padEnd(10)}${f(r.coefficients)}${f(r.stddevs)}${f(r.residualSd)}${f(r.rSquared)}  ${r.worstCoefficient}/${r.worstStddev}`.padEnd(
          56,
        ) + `  ${r.precision}`,
    ),
  ].join('\n');
}
