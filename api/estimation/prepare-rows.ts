import { EstimationInputError } from './errors';
import type { ModelSpec } from './model-spec';

/** Rows validated, transformed and sorted (by district, then year). */
export interface PreparedRows {
  n: number;
  years: Float64Array;
  /** response and driver on the model scale (logged under the log transform) */
  y: Float64Array;
  x: Float64Array;
  /** driver and response in original units */
  xRaw: Float64Array;
  yRaw: Float64Array;
  controlNames: string[];
  /** one array per control, model scale */
  controls: Float64Array[];
  /** index of each sorted row in the caller's array */
  sourceRow: Int32Array;
  /** district label of each sorted row (panel rows only, else empty) */
  districts: string[];
}

interface RawRow { year: unknown; y: unknown; x: unknown; controls?: unknown; district?: unknown }

/**
 * Checks and transforms input rows for fitCurve (one district) or fitPanel (many).
 *
 * Rules: every year an integer; y, x and each used control a finite number; under the log
 * transform y, x and every control not in levelControls must be > 0 and are replaced by
 * their natural log; no two rows share a year (a district and a year for the panel).
 * Controls used: `spec.controls` in that order, else every control name found in the rows,
 * sorted; a row lacking one is an error. Rows are then sorted by (district,) year.
 * Bad data are never dropped silently: the first bad row raises an error naming it.
 * Reference: DOMAIN.md ("Logs of values ≤ 0 are impossible: such rows are an input error").
 *
 * Throws: EstimationInputError with details { row (index in the caller's array), year,
 * column, value?, reason }: `invalid_argument` (not an array, row not an object, year not an
 * integer, district missing, levelControls naming an unknown control), `non_finite_value`,
 * `non_positive_under_log`, `missing_control`, `duplicate_year` / `duplicate_row`
 * (details.firstRow is the earlier row).
 *
 * Example:
 *   prepareRows([{ year: 2000, y: 2, x: 100 }, { year: 2000, y: 3, x: 110 }], spec, false)
 *   // throws duplicate_year: "Row 1 repeats year 2000 (first in row 0)"
 */
export function prepareRows(rows: unknown, spec: ModelSpec, panel: boolean): PreparedRows {
  if (!Array.isArray(rows)) throw new EstimationInputError('invalid_argument', 'rows must be an array', { reason: 'rows' });
  const n = rows.length;
  const log = spec.transform === 'log';
  let controlNames: string[];
  if (spec.controls) controlNames = [...spec.controls];
  else {
    const set = new Set<string>();
    for (const r of rows as RawRow[]) {
      if (r && typeof r === 'object' && r.controls && typeof r.controls === 'object') for (const key of Object.keys(r.controls)) set.add(key);
    }
    controlNames = [...set].sort();
  }
  for (const c of spec.levelControls) {
    if (!controlNames.includes(c)) {
      throw new EstimationInputError('invalid_argument', `levelControls names '${c}', which is not a control of these rows`, { reason: 'levelControls', column: c });
    }
  }
  const logControl = controlNames.map((c) => log && !spec.levelControls.includes(c));
  const years = new Float64Array(n), yRaw = new Float64Array(n), xRaw = new Float64Array(n);
  const ctl = controlNames.map(() => new Float64Array(n));
  const districts: string[] = [];
  const seen = new Map<string, number>();
  const fail = (code: 'non_finite_value' | 'non_positive_under_log' | 'missing_control' | 'invalid_argument', i: number, year: unknown, column: string, value: unknown, reason: string): never => {
    const y = typeof year === 'number' ? year : null;
    throw new EstimationInputError(code, `Row ${i}${y !== null ? ` (year ${y})` : ''}: ${reason}`,
      { row: i, year: y, column, value: typeof value === 'number' ? (Number.isFinite(value) ? value : String(value)) : value ?? null, reason });
  };
  for (let i = 0; i < n; i++) {
    const r = rows[i] as RawRow;
    if (!r || typeof r !== 'object') fail('invalid_argument', i, null, 'row', null, 'row is not an object');
    const year = r.year;
    if (typeof year !== 'number' || !Number.isInteger(year)) fail(typeof year === 'number' && !Number.isFinite(year) ? 'non_finite_value' : 'invalid_argument', i, null, 'year', year, 'year is not an integer');
    let key = String(year);
    if (panel) {
      if (typeof r.district !== 'string' || r.district.length === 0) fail('invalid_argument', i, year, 'district', r.district, 'district is missing');
      districts.push(r.district as string);
      key = `${r.district as string}\u0000${year as number}`;
    }
    const first = seen.get(key);
    if (first !== undefined) {
      throw new EstimationInputError(panel ? 'duplicate_row' : 'duplicate_year',
        panel ? `Row ${i} repeats district ${r.district as string}, year ${year as number} (first in row ${first})`
          : `Row ${i} repeats year ${year as number} (first in row ${first})`,
        { row: i, year, column: 'year', firstRow: first, reason: 'duplicate year', ...(panel ? { district: r.district } : {}) });
    }
    seen.set(key, i);
    years[i] = year as number;
    const num = (v: unknown, column: string, logged: boolean): number => {
      if (typeof v !== 'number' || !Number.isFinite(v)) return fail('non_finite_value', i, year, column, v, `${column} is not a finite number`);
      if (logged && !(v > 0)) return fail('non_positive_under_log', i, year, column, v, `${column} = ${v} is not positive and cannot be logged`);
      return v;
    };
    yRaw[i] = num(r.y, 'y', log);
    xRaw[i] = num(r.x, 'x', log);
    const controls = r.controls as Record<string, unknown> | undefined;
    for (let c = 0; c < controlNames.length; c++) {
      const name = controlNames[c];
      if (!controls || typeof controls !== 'object' || !(name in controls)) fail('missing_control', i, year, name, null, `control '${name}' is missing`);
      const v = num((controls as Record<string, unknown>)[name], name, logControl[c]);
      ctl[c][i] = logControl[c] ? Math.log(v) : v;
    }
  }
  const order = Array.from({ length: n }, (_, i) => i);
  order.sort((a, b) => (panel && districts[a] !== districts[b] ? (districts[a] < districts[b] ? -1 : 1) : years[a] - years[b]));
  const pick = (src: Float64Array, f?: (v: number) => number): Float64Array => {
    const out = new Float64Array(n);
    for (let j = 0; j < n; j++) out[j] = f ? f(src[order[j]]) : src[order[j]];
    return out;
  };
  return {
    n,
    years: pick(years),
    y: pick(yRaw, log ? Math.log : undefined),
    x: pick(xRaw, log ? Math.log : undefined),
    xRaw: pick(xRaw),
    yRaw: pick(yRaw),
    controlNames,
    controls: ctl.map((c) => pick(c)),
    sourceRow: Int32Array.from(order),
    districts: panel ? order.map((j) => districts[j]) : [],
  };
}
