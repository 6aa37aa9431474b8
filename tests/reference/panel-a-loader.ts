import { readFileSync } from 'node:fs';
import { join } from 'node:path';

const dir = join(__dirname, '..', 'fixtures', 'reference', 'panel-A');

export interface PanelARow {
  district: string;
  year: number;
  emissions: number;
  income: number;
  density: number;
}

/** tests/fixtures/reference/panel-A/panel_A.csv (8 districts × 1990–2024). */
export function loadPanelA(): PanelARow[] {
  const lines = readFileSync(join(dir, 'panel_A.csv'), 'utf8').trim().split(/\r?\n/);
  const header = lines[0].split(',');
  const at = (name: string) => header.indexOf(name);
  return lines.slice(1).map((line) => {
    const f = line.split(',');
    return {
      district: f[at('district_code')],
      year: Number(f[at('year')]),
      emissions: Number(f[at('emissions_pc')]),
      income: Number(f[at('income_pc')]),
      density: Number(f[at('pop_density')]),
    };
  });
}

/** The engine's Fieller kind for the reference files' name (`two_disjoint_rays` → `two_rays`). */
export function fiellerKind(type: string): 'bounded' | 'two_rays' | 'whole_line' {
  if (type === 'two_disjoint_rays') return 'two_rays';
  if (type === 'bounded' || type === 'whole_line') return type;
  throw new Error(`unknown Fieller type in fixture: ${type}`);
}

/** The engine's U-test orientation for the reference files' name. */
export function orientation(name: string): 'inverted_u' | 'u' {
  if (name === 'inverse_U') return 'inverted_u';
  if (name === 'U') return 'u';
  throw new Error(`unknown orientation in fixture: ${name}`);
}

/* eslint-disable @typescript-eslint/no-explicit-any */
/** tests/fixtures/reference/panel-A/panel_A_results.json, as parsed JSON. */
export function loadPanelAResults(): any {
  return JSON.parse(readFileSync(join(dir, 'panel_A_results.json'), 'utf8'));
}

/** Relative difference |a − e| / |e| (absolute when e = 0). */
export function relDiff(a: number, e: number): number {
  return e === 0 ? Math.abs(a) : Math.abs(a - e) / Math.abs(e);
}

/**
 * Asserts |actual − expected| ≤ tol·|expected| (relative) and reports the source of the
 * expected value in the failure message.
 */
export function expectRel(actual: number | null | undefined, expected: number, tol: number, source: string): void {
  if (typeof actual !== 'number' || !(relDiff(actual, expected) <= tol)) {
    throw new Error(
      `${source}: expected ${expected}, got ${actual} (relative difference ${typeof actual === 'number' ? relDiff(actual, expected) : 'n/a'} > ${tol})`,
    );
  }
}

/** Asserts |actual − expected| ≤ tol (absolute). */
export function expectAbs(actual: number | null | undefined, expected: number, tol: number, source: string): void {
  if (typeof actual !== 'number' || !(Math.abs(actual - expected) <= tol)) {
    throw new Error(
      `${source}: expected ${expected}, got ${actual} (absolute difference ${typeof actual === 'number' ? Math.abs(actual - expected) : 'n/a'} > ${tol})`,
    );
  }
}
