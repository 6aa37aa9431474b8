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
    const data: DistrictData = {
      years: [],
      x: [],
      y: [],
      controls: Object.fromEntries(sel.controls.map((c) => [c, [] as number[]])),
      droppedYears: [],
    };
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
export async function loadSeries(
  db: Knex,
  version: number,
  sel: Selection,
  districtIds: number[] | null = null,
): Promise<DistrictSeries[]> {
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

/**
 * A chunk's series as the start job read them, carried in the chunk's job so the data are
 * read from the database once per run: districts with their years, and every value as one
 * base64 Float64 block (per district: emissions, driver, then each control, year order),
 * exact and about a third of the JSON's size.
 */
export interface PackedSeries {
  districts: { id: number; code: string; name: string; years: number[]; dropped: number[] }[];
  values: string;
}

export function packSeries(series: DistrictSeries[], controls: string[]): PackedSeries {
  const total = series.reduce((a, s) => a + s.data.years.length * (2 + controls.length), 0);
  const values = new Float64Array(total);
  let k = 0;
  for (const s of series) {
    for (const v of [s.data.y, s.data.x, ...controls.map((c) => s.data.controls[c])]) {
      values.set(v, k);
      k += v.length;
    }
  }
  return {
    districts: series.map((s) => ({
      id: s.districtId,
      code: s.code,
      name: s.name,
      years: s.data.years,
      dropped: s.data.droppedYears,
    })),
    values: Buffer.from(values.buffer, values.byteOffset, values.byteLength).toString('base64'),
  };
}

export function unpackSeries(packed: PackedSeries, controls: string[]): DistrictSeries[] {
  const bytes = Buffer.from(packed.values, 'base64');
  const values = new Float64Array(bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength));
  let k = 0;
  const take = (n: number) => Array.from(values.subarray(k, (k += n)));
  return packed.districts.map((d) => {
    const n = d.years.length;
    const y = take(n);
    const x = take(n);
    const c: Record<string, number[]> = {};
    for (const name of controls) c[name] = take(n);
    return {
      districtId: d.id,
      code: d.code,
      name: d.name,
      data: { years: d.years, x, y, controls: c, droppedYears: d.dropped },
    };
  });
}
