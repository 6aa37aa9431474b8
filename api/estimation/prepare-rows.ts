import { EstimationInputError } from './errors';
import type { ModelSpec } from './model-spec';
import { take, type Workspace } from './workspace';

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
  sourceRow: number[];
  /** district label of each sorted row (panel rows only, else empty) */
  districts: string[];
}

interface RawRow {
  year: unknown;
  y: unknown;
  x: unknown;
  controls?: unknown;
  district?: unknown;
}

/**
 * Checks and transforms input rows for fitCurve (one district) or fitPanel (many).
 *
 * Rules: every year an integer; y, x and each used control a finite number; under the log
 * transform y, x and every control not in levelControls must be > 0 and are replaced by
 * their natural log; no two rows share a year (a district and a year for the panel).
 * Controls used: `spec.controls` in that order, else every control name found in the rows,
 * sorted; a row lacking one is an error. Rows are then sorted by (district,) year.
 * Bad data are never dropped silently: the first bad row raises an error naming it.
 * Reference: docs/method.md ("What is being estimated": a value ≤ 0 where a log is needed is an input error).
 *
 * `ws` (optional): scratch memory for the arrays (workspace.ts).
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
export function prepareRows(rows: unknown, spec: ModelSpec, panel: boolean, ws?: Workspace): PreparedRows {
  if (!Array.isArray(rows))
    throw new EstimationInputError('invalid_argument', 'rows must be an array', { reason: 'rows' });
  const n = rows.length;
  const log = spec.transform === 'log';
  const controlNames = spec.controls ? [...spec.controls] : controlNamesOf(rows);
  for (const c of spec.levelControls) {
    if (!controlNames.includes(c)) {
      throw new EstimationInputError(
        'invalid_argument',
        `levelControls names '${c}', which is not a control of these rows`,
        { reason: 'levelControls', column: c },
      );
    }
  }
  const nc = controlNames.length;
  const logControl = controlNames.map((c) => log && !spec.levelControls.includes(c));
  const years = take(ws, n),
    yRaw = take(ws, n),
    xRaw = take(ws, n);
  const ctl: Float64Array[] = [];
  for (let c = 0; c < nc; c++) ctl.push(take(ws, n));
  const districts: string[] = panel ? new Array<string>(n) : [];
  for (let i = 0; i < n; i++) {
    const r = rows[i] as RawRow;
    if (!r || typeof r !== 'object') rowError('invalid_argument', i, null, 'row', null, 'row is not an object');
    const year = r.year;
    if (typeof year !== 'number' || !Number.isInteger(year)) {
      rowError(
        typeof year === 'number' && !Number.isFinite(year) ? 'non_finite_value' : 'invalid_argument',
        i,
        null,
        'year',
        year,
        'year is not an integer',
      );
    }
    if (panel) {
      if (typeof r.district !== 'string' || r.district.length === 0)
        rowError('invalid_argument', i, year, 'district', r.district, 'district is missing');
      districts[i] = r.district as string;
    }
    years[i] = year as number;
    yRaw[i] = checkedNumber(r.y, i, year as number, 'y', log);
    xRaw[i] = checkedNumber(r.x, i, year as number, 'x', log);
    if (nc > 0) {
      const controls = r.controls as Record<string, unknown> | undefined;
      if (!controls || typeof controls !== 'object')
        rowError('missing_control', i, year, controlNames[0], null, `control '${controlNames[0]}' is missing`);
      for (let c = 0; c < nc; c++) {
        const name = controlNames[c];
        const v = (controls as Record<string, unknown>)[name];
        if (v === undefined && !(name in (controls as object)))
          rowError('missing_control', i, year, name, null, `control '${name}' is missing`);
        const value = checkedNumber(v, i, year as number, name, logControl[c]);
        ctl[c][i] = logControl[c] ? Math.log(value) : value;
      }
    }
  }
  // order by (district,) year; rows usually arrive sorted, so check before sorting
  let sorted = true;
  for (let i = 1; i < n && sorted; i++) {
    if (panel && districts[i] !== districts[i - 1]) sorted = districts[i] > districts[i - 1];
    else sorted = years[i] > years[i - 1];
  }
  const order: number[] = new Array<number>(n);
  for (let i = 0; i < n; i++) order[i] = i;
  if (!sorted) {
    order.sort(
      panel
        ? (a, b) =>
            districts[a] !== districts[b] ? (districts[a] < districts[b] ? -1 : 1) : years[a] - years[b] || a - b
        : (a, b) => years[a] - years[b] || a - b,
    );
    for (let j = 1; j < n; j++) {
      const a = order[j - 1],
        b = order[j];
      if (years[a] === years[b] && (!panel || districts[a] === districts[b]))
        duplicateError(panel, b, a, years[b], panel ? districts[b] : null);
    }
  }
  // already in order: keep the arrays as they are; else permute into new ones
  const out = sorted
    ? { y: take(ws, n), x: take(ws, n), xRaw, yRaw, years }
    : { y: take(ws, n), x: take(ws, n), xRaw: take(ws, n), yRaw: take(ws, n), years: take(ws, n) };
  const controls: Float64Array[] = sorted ? ctl : [];
  if (!sorted) for (let c = 0; c < nc; c++) controls.push(take(ws, n));
  for (let j = 0; j < n; j++) {
    const i = order[j];
    if (!sorted) {
      out.years[j] = years[i];
      out.xRaw[j] = xRaw[i];
      out.yRaw[j] = yRaw[i];
      for (let c = 0; c < nc; c++) controls[c][j] = ctl[c][i];
    }
    out.x[j] = log ? Math.log(xRaw[i]) : xRaw[i];
    out.y[j] = log ? Math.log(yRaw[i]) : yRaw[i];
  }
  return {
    n,
    ...out,
    controlNames,
    controls,
    sourceRow: order,
    districts: panel ? order.map((i) => districts[i]) : [],
  };
}

/** Control names: the first row's, sorted, when every row has the same; else the union. */
function controlNamesOf(rows: unknown[]): string[] {
  const first = rows[0] as RawRow | undefined;
  const base =
    first && typeof first === 'object' && first.controls && typeof first.controls === 'object'
      ? Object.keys(first.controls)
      : [];
  let same = true;
  for (let i = 1; i < rows.length && same; i++) {
    const c = (rows[i] as RawRow | undefined)?.controls;
    if (!c || typeof c !== 'object') {
      same = base.length === 0;
      continue;
    }
    let count = 0;
    for (const key in c as object) {
      count++;
      if (!base.includes(key)) {
        same = false;
        break;
      }
    }
    if (count !== base.length) same = false;
  }
  if (same) return base.sort();
  const set = new Set<string>();
  for (const r of rows as RawRow[]) {
    if (r && typeof r === 'object' && r.controls && typeof r.controls === 'object')
      for (const key of Object.keys(r.controls)) set.add(key);
  }
  return [...set].sort();
}

type RowCode = 'non_finite_value' | 'non_positive_under_log' | 'missing_control' | 'invalid_argument';

function rowError(code: RowCode, i: number, year: unknown, column: string, value: unknown, reason: string): never {
  const y = typeof year === 'number' && Number.isFinite(year) ? year : null;
  throw new EstimationInputError(code, `Row ${i}${y !== null ? ` (year ${y})` : ''}: ${reason}`, {
    row: i,
    year: y,
    column,
    value: typeof value === 'number' ? (Number.isFinite(value) ? value : String(value)) : (value ?? null),
    reason,
  });
}

function checkedNumber(v: unknown, i: number, year: number, column: string, logged: boolean): number {
  if (typeof v !== 'number' || !Number.isFinite(v))
    return rowError('non_finite_value', i, year, column, v, `${column} is not a finite number`);
  if (logged && !(v > 0))
    return rowError(
      'non_positive_under_log',
      i,
      year,
      column,
      v,
      `${column} = ${v} is not positive and cannot be logged`,
    );
  return v;
}

function duplicateError(panel: boolean, row: number, firstRow: number, year: number, district: string | null): never {
  throw new EstimationInputError(
    panel ? 'duplicate_row' : 'duplicate_year',
    panel
      ? `Row ${row} repeats district ${district}, year ${year} (first in row ${firstRow})`
      : `Row ${row} repeats year ${year} (first in row ${firstRow})`,
    { row, year, column: 'year', firstRow, reason: 'duplicate year', ...(panel ? { district } : {}) },
  );
}
