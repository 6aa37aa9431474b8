/**
 * Reads the series a run fits, at one data version: the current observations when the
 * version is the latest, else the observation history rebuilt as of that version
 * (`observations_as_of`). Rows are complete cases (emissions, driver and every control
 * present); years with only some of them are listed as dropped.
 */
import { createHash } from 'node:crypto';
import type { Knex } from 'knex';
import type { DistrictData } from './estimate-record';

export interface Selection {
  emissions: string;
  driver: string;
  controls: string[];
  firstYear: number | null;
  lastYear: number | null;
}

export interface DistrictSeries {
  districtId: number;
  code: string;
  name: string;
  data: DistrictData;
}

export async function currentDataVersion(db: Knex): Promise<number> {
  const { rows } = await db.raw(`SELECT coalesce(max(version), 0)::int AS v FROM uploads WHERE version IS NOT NULL`);
  return Number(rows[0].v);
}

interface RawRow {
  district_id: number;
  code: string;
  name: string;
  indicator: string;
  year: number;
  value: number;
}

async function rawRows(db: Knex, version: number, sel: Selection, districtIds: number[] | null): Promise<RawRow[]> {
  const latest = version >= (await currentDataVersion(db));
  const source = latest ? 'observations' : 'observations_as_of(?)';
  const params: Knex.RawBinding[] = latest ? [] : [version];
  params.push([sel.emissions, sel.driver, ...sel.controls]);
  let where = 'i.code = ANY(?::text[])';
  if (districtIds) {
    where += ' AND o.district_id = ANY(?::int[])';
    params.push(districtIds);
  }
  if (sel.firstYear !== null) {
    where += ' AND o.year >= ?';
    params.push(sel.firstYear);
  }
  if (sel.lastYear !== null) {
    where += ' AND o.year <= ?';
    params.push(sel.lastYear);
  }
  const { rows } = await db.raw(
    `SELECT o.district_id, d.code, d.name, i.code AS indicator, o.year, o.value
       FROM ${source} o JOIN districts d ON d.id = o.district_id JOIN indicators i ON i.id = o.indicator_id
      WHERE ${where}
      ORDER BY d.code, o.year, i.code`,
    params,
  );
  return rows;
}

function assemble(rows: RawRow[], sel: Selection): DistrictSeries[] {
  const out: DistrictSeries[] = [];
  const needed = [sel.emissions, sel.driver, ...sel.controls];
  let i = 0;
  while (i < rows.length) {
    const { district_id, code, name } = rows[i];
    const byYear = new Map<number, Map<string, number>>();
    for (; i < rows.length && rows[i].district_id === district_id; i++) {
      const r = rows[i];
      let m = byYear.get(r.year);
      if (!m) byYear.set(r.year, (m = new Map()));
      m.set(r.indicator, Number(r.value));
    }
    const data: DistrictData = { years: [], x: [], y: [], controls: Object.fromEntries(sel.controls.map((c) => [c, [] as number[]])), droppedYears: [] };
    for (const [year, m] of [...byYear.entries()].sort((a, b) => a[0] - b[0])) {
      if (!needed.every((n) => m.has(n))) {
        data.droppedYears.push(year);
        continue;
      }
      data.years.push(year);
      data.y.push(m.get(sel.emissions)!);
      data.x.push(m.get(sel.driver)!);
      for (const c of sel.controls) data.controls[c].push(m.get(c)!);
    }
    out.push({ districtId: Number(district_id), code, name, data });
  }
  return out;
}

/** Every district's series at a data version (districts with no rows at all are left out). */
export async function loadSeries(db: Knex, version: number, sel: Selection, districtIds: number[] | null = null): Promise<DistrictSeries[]> {
  return assemble(await rawRows(db, version, sel, districtIds), sel);
}

/** A hash of exactly the values a run reads (district, indicator, year, value as written). */
export function hashSeries(series: DistrictSeries[], sel: Selection): { hash: string; rows: number } {
  const h = createHash('sha256');
  let rows = 0;
  h.update(JSON.stringify(sel));
  for (const s of series) {
    h.update(`\n${s.code}`);
    for (let i = 0; i < s.data.years.length; i++) {
      h.update(`|${s.data.years[i]}:${s.data.y[i]}:${s.data.x[i]}`);
      for (const c of sel.controls) h.update(`:${s.data.controls[c][i]}`);
      rows++;
    }
  }
  return { hash: h.digest('hex'), rows };
}

