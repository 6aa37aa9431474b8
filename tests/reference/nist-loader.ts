import { readFileSync } from 'node:fs';
import { join } from 'node:path';

/** A NIST StRD linear least-squares dataset as stored in tests/fixtures/reference/nist/. */
export interface NistDataset {
  name: string;
  /** design rows including the intercept column, in the certified parameter order */
  X: number[][];
  y: number[];
  certified: { coefficients: number[]; stddev: number[]; residual_sd: number; r_squared: number };
}

export function loadNist(name: 'Longley' | 'Norris' | 'Pontius' | 'Filip'): NistDataset {
  const file = join(__dirname, '..', 'fixtures', 'reference', 'nist', `${name}.json`);
  const d = JSON.parse(readFileSync(file, 'utf8'));
  const y: number[] = d.y;
  let X: number[][];
  if (name === 'Longley') {
    const cols = [1, 2, 3, 4, 5, 6].map((j) => d.x_columns[`x${j}`] as number[]);
    X = y.map((_, i) => [1, ...cols.map((c) => c[i])]);
  } else {
    const x: number[] = d.x_columns.x;
    const degree: number = d.model.degree ?? 1;
    X = x.map((v) => Array.from({ length: degree + 1 }, (_, p) => v ** p));
  }
  return { name, X, y, certified: d.certified };
}

/**
 * Log relative error: the number of significant digits on which est and cert agree,
 * −log10(|est − cert| / |cert|), capped at 15 (the digits NIST certifies).
 */
export function lre(est: number, cert: number): number {
  if (est === cert) return 15;
  const v = -Math.log10(Math.abs(est - cert) / Math.abs(cert));
  return Math.min(15, Math.max(0, v));
}
