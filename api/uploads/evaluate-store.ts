/**
 * The set-based checks of a staged upload, against the stored data, inside the upload's
 * transaction: which district codes are new (created here, or refused), each staged value
 * classified as insert / change / unchanged against the stored one, values that moved by
 * more than the change factor, rules of indicators that changed since the file was read,
 * and the derived series the upload touches.
 *
 * Relations it leaves for the merge (all dropped at the end of the transaction):
 * - view `upload_staged`: the staged rows with district ids;
 * - table `upload_eval`: staged rows that change a stored value, kind 'c' (rows equal to
 *   the stored value are counted, not kept);
 * - view `upload_new`: staged rows for empty cells, kind 'i'. A first load of a million
 *   rows is thus never copied into a temp table: the merge reads it straight from staging.
 */
import { clip } from './parse/values';
import type { Problem, ProblemList } from './problems';
import { PROBLEM_LIST_CAP } from './problems';
import { createDerivedTable, deriveChanges, derivedDefs, derivedNotPositive } from './derived-store';
import type { StagingNames } from './staging-store';
import type { Sql } from '../db/connection';

export interface Columns {
  district: number;
  name: number | null;
  names: string[];
}

export interface CellCount {
  districtId: number;
  indicatorId: number;
  kind: 'i' | 'c' | 'u';
  n: number;
}

export interface DerivedCount {
  indicatorId: number;
  kind: 'i' | 'c' | 'r';
  n: number;
}

export interface Evaluation {
  cells: CellCount[];
  derived: DerivedCount[];
  newDistricts: { id: number; code: string; name: string; line: number }[];
  /** Rows refused because their district is unknown and new codes are not allowed. */
  refusedRows: number;
}

export interface EvaluateOptions {
  allowNewDistricts: boolean;
  changeFactor: number;
}

export async function evaluateStaged(
  conn: Sql,
  t: StagingNames,
  columns: Columns,
  options: EvaluateOptions,
  problems: ProblemList,
): Promise<Evaluation> {
  await conn.query(`SET LOCAL work_mem = '128MB'`);
  const { newDistricts, refusedRows } = await settleDistricts(conn, t, columns, options, problems);

  await conn.query(`CREATE TEMP VIEW upload_staged AS
    SELECT s.line, s.col, d.id AS district_id, s.indicator_id, s.year, s.value
      FROM ${t.rows} s JOIN districts d ON d.code = s.district`);
  await conn.query(`CREATE TEMP TABLE upload_eval (
      line integer, col integer, district_id integer, indicator_id integer, year integer, value float8,
      old_value float8, old_upload_id integer, kind "char") ON COMMIT DROP`);
  // A file whose districts hold no stored value yet (a first load) can only insert: its
  // rows are counted without a join with observations, and the merge reads them straight
  // from staging, with no anti-join. One index probe per district decides.
  const { rows: held } = await conn.query(
    `SELECT EXISTS (SELECT 1 FROM ${t.districts} sd JOIN districts d ON d.code = sd.code
                      JOIN observations o ON o.district_id = d.id) AS stored`,
  );
  const stored: boolean = held[0].stored;
  // Otherwise one pass classifies every staged value against the stored one: the counts
  // come from it, and the values that change a stored one are kept for the merge
  // (unchanged ones are only counted), so the join of staging with observations is read
  // once, not twice. A revision of a million cells with a tenth changed writes 100,000
  // rows here, not a million.
  const { rows } = await conn.query(
    stored
      ? `WITH classified AS MATERIALIZED (
           SELECT v.line, v.col, v.district_id, v.indicator_id, v.year, v.value,
                  o.value AS old_value, o.upload_id AS old_upload_id,
                  (CASE WHEN o.value IS NULL THEN 'i' WHEN o.value = v.value THEN 'u' ELSE 'c' END)::"char" AS kind
             FROM upload_staged v
             LEFT JOIN observations o
               ON o.district_id = v.district_id AND o.indicator_id = v.indicator_id AND o.year = v.year
         ), kept AS (
           INSERT INTO upload_eval
           SELECT line, col, district_id, indicator_id, year, value, old_value, old_upload_id, kind
             FROM classified WHERE kind = 'c'
         )
         SELECT district_id, indicator_id, kind, count(*)::int AS n, min(value) AS min_value
           FROM classified
          GROUP BY 1, 2, 3`
      : `SELECT district_id, indicator_id, 'i'::"char" AS kind, count(*)::int AS n, min(value) AS min_value
           FROM upload_staged
          GROUP BY 1, 2`,
  );
  await conn.query(`CREATE TEMP VIEW upload_new AS
    SELECT v.district_id, v.indicator_id, v.year, v.value, NULL::float8 AS old_value, NULL::int AS old_upload_id,
           'i'::"char" AS kind, v.line
      FROM upload_staged v
     WHERE ${
       stored
         ? `NOT EXISTS (SELECT 1 FROM observations o
                         WHERE o.district_id = v.district_id AND o.indicator_id = v.indicator_id AND o.year = v.year)`
         : 'true'
     }`);
  const cells: CellCount[] = rows.map((r) => ({
    districtId: r.district_id,
    indicatorId: r.indicator_id,
    kind: r.kind,
    n: r.n,
  }));

  await recheckIndicatorRules(conn, rows, problems);
  if (cells.some((c) => c.kind === 'c')) await largeChanges(conn, options.changeFactor, problems);
  const derived = await deriveFromStaged(conn, cells, problems);
  return { cells, derived, newDistricts, refusedRows };
}

/** The views outlive a committed transaction (temp views have no ON COMMIT DROP): drop them before. */
export async function dropEvaluationViews(conn: Sql): Promise<void> {
  await conn.query(`DROP VIEW IF EXISTS upload_new, upload_staged`);
}

async function settleDistricts(
  conn: Sql,
  t: StagingNames,
  columns: Columns,
  options: EvaluateOptions,
  problems: ProblemList,
) {
  const { rows } = await conn.query(
    // A new district's name stays in the database (the INSERT below reads it there): a file
    // of 50,000 new districts need not bring their names back and forth.
    `SELECT sd.code, sd.first_line, sd.rows, CASE WHEN d.id IS NULL THEN NULL ELSE sd.name END AS name,
            sd.name IS NOT NULL AS has_name, sd.name_line, sd.name_refused, d.id, d.name AS stored_name
       FROM ${t.districts} sd LEFT JOIN districts d ON d.code = sd.code
      ORDER BY sd.first_line`,
  );
  const create: { code: string; line: number }[] = [];
  let refusedRows = 0;
  const nameField = columns.name === null ? null : columns.names[columns.name - 1];
  for (const r of rows) {
    if (r.id === null) {
      if (r.has_name || options.allowNewDistricts) {
        create.push({ code: r.code, line: r.first_line });
      } else if (r.name_refused) {
        // Its name cell was refused already; that problem says what to fix.
        refusedRows += r.rows;
      } else {
        refusedRows += r.rows;
        problems.add({
          line: r.first_line,
          column: columns.district,
          field: columns.names[columns.district - 1],
          code: 'unknown_district',
          reason:
            `district ${r.code} is not known${r.rows > 1 ? ` (${r.rows.toLocaleString('en')} rows)` : ''}: ` +
            'add a district_name column to create it, or allow new districts',
        });
      }
    } else if (r.name !== null && r.name !== r.stored_name) {
      problems.add({
        line: r.name_line,
        column: columns.name,
        field: nameField,
        code: 'district_name_differs',
        severity: 'warning',
        reason: `district ${r.code} is stored as "${clip(r.stored_name)}"; the name "${clip(r.name)}" in the file is not applied`,
      });
    }
  }
  const newDistricts: Evaluation['newDistricts'] = [];
  if (create.length) {
    const { rows: made } = await conn.query(
      `INSERT INTO districts (code, name)
       SELECT sd.code, coalesce(sd.name, sd.code)
         FROM unnest($1::text[]) WITH ORDINALITY AS n(code, i) JOIN ${t.districts} sd ON sd.code = n.code
        ORDER BY n.i
       ON CONFLICT (code) DO NOTHING RETURNING id, code, name`,
      [create.map((c) => c.code)],
    );
    const lines = new Map(create.map((c) => [c.code, c.line]));
    for (const m of made) newDistricts.push({ id: m.id, code: m.code, name: m.name, line: lines.get(m.code)! });
  }
  return { newDistricts, refusedRows };
}

/** The reader checked the rules when it read the file; a preview committed later is checked again. */
async function recheckIndicatorRules(
  conn: Sql,
  groups: { indicator_id: number; min_value: number }[],
  problems: ProblemList,
): Promise<void> {
  const ids = [...new Set(groups.map((g) => g.indicator_id))];
  if (ids.length === 0) return;
  const { rows: rules } = await conn.query(
    `SELECT id, code, derivation, must_be_positive FROM indicators WHERE id = ANY($1)`,
    [ids],
  );
  const minOf = new Map<number, number>();
  for (const g of groups) minOf.set(g.indicator_id, Math.min(minOf.get(g.indicator_id) ?? Infinity, g.min_value));
  const broken = rules.filter((r) => r.derivation !== 'none' || (r.must_be_positive && minOf.get(r.id)! <= 0));
  const missing = ids.filter((id) => !rules.some((r) => r.id === id));
  if (broken.length === 0 && missing.length === 0) return;
  const { rows } = await conn.query(
    `SELECT e.line, e.col, e.value, i.code, i.derivation, (i.id IS NULL) AS gone, count(*) OVER () AS total
       FROM upload_staged e LEFT JOIN indicators i ON i.id = e.indicator_id
      WHERE i.id IS NULL OR i.derivation <> 'none' OR (i.must_be_positive AND e.value <= 0)
      ORDER BY e.line, e.col LIMIT $1`,
    [PROBLEM_LIST_CAP],
  );
  problems.addCounted(
    rows.map((r) => ({
      line: r.line,
      column: r.col,
      field: null,
      severity: 'error' as const,
      code: r.gone
        ? ('unknown_indicator' as const)
        : r.derivation !== 'none'
          ? ('derived_indicator' as const)
          : ('not_positive' as const),
      reason: r.gone
        ? 'the indicator of this value has been removed from the catalogue since the preview'
        : r.derivation !== 'none'
          ? `${r.code} has become a derived indicator since the preview: it is computed, not uploaded`
          : `${r.code} must be positive but the value is ${r.value}`,
    })),
    rows.length ? Number(rows[0].total) : 0,
    'error',
  );
}

async function largeChanges(conn: Sql, factor: number, problems: ProblemList): Promise<void> {
  const { rows } = await conn.query(
    `SELECT e.line, e.col, d.code AS district, i.code AS indicator, e.year, e.value, e.old_value, count(*) OVER () AS total
       FROM upload_eval e JOIN districts d ON d.id = e.district_id JOIN indicators i ON i.id = e.indicator_id
      WHERE e.kind = 'c' AND (sign(e.value) <> sign(e.old_value)
            OR greatest(abs(e.value), abs(e.old_value)) > $1 * least(abs(e.value), abs(e.old_value)))
      ORDER BY e.line, e.col LIMIT $2`,
    [factor, PROBLEM_LIST_CAP],
  );
  const listed: Problem[] = rows.map((r) => ({
    line: r.line,
    column: r.col,
    field: null,
    severity: 'warning',
    code: 'large_change',
    reason: `${r.district} ${r.indicator} ${r.year} changes from ${r.old_value} to ${r.value}, more than a factor of ${factor}`,
  }));
  problems.addCounted(listed, rows.length ? Number(rows[0].total) : 0, 'warning');
}

async function deriveFromStaged(conn: Sql, cells: CellCount[], problems: ProblemList): Promise<DerivedCount[]> {
  const touched = new Set(cells.filter((c) => c.kind !== 'u').map((c) => c.indicatorId));
  const defs = (await derivedDefs(conn)).filter((d) => touched.has(d.sourceId) || touched.has(d.divisorId));
  if (defs.length === 0) return [];
  await createDerivedTable(conn);
  for (const def of defs) {
    await deriveChanges(conn, def, 'staged');
    const bad = await derivedNotPositive(conn, def, PROBLEM_LIST_CAP);
    problems.addCounted(bad.listed, bad.total, 'error');
  }
  const { rows } = await conn.query(`SELECT indicator_id, kind, count(*)::int AS n FROM upload_derived GROUP BY 1, 2`);
  return rows.map((r) => ({ indicatorId: r.indicator_id, kind: r.kind, n: r.n }));
}
