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

/**
 * One row per district: its observations of the selected indicators as three arrays in
 * (year, indicator) order — `slots` indexes `codes` — so a 3,000-district read is 3,000
 * rows, not hundreds of thousands, and is assembled without a lookup per value.
 */
interface DistrictRows {
  district_id: number;
  code: string;
  name: string;
  years: number[];
  slots: number[];
  vals: number[];
}

async function rawRows(
  db: Knex,
  version: number,
  codes: string[],
  sel: Selection,
  districtIds: number[] | null,
): Promise<DistrictRows[]> {
  const latest = version >= (await currentDataVersion(db));
  const source = latest ? 'observations' : 'observations_as_of(?)';
  const params: Knex.RawBinding[] = [codes];
  if (!latest) params.push(version);
  let where = 'TRUE';
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
    `WITH wanted AS (
       SELECT i.id, (k.n - 1)::int AS slot
         FROM unnest(?::text[]) WITH ORDINALITY AS k(code, n) JOIN indicators i ON i.code = k.code
     )
     , per_district AS (
       SELECT o.district_id,
              array_agg(o.year ORDER BY o.year, w.slot) AS years,
              array_agg(w.slot ORDER BY o.year, w.slot) AS slots,
              array_agg(o.value ORDER BY o.year, w.slot) AS vals
         FROM ${source} o JOIN wanted w ON w.id = o.indicator_id
        WHERE ${where}
        GROUP BY o.district_id
     )
     SELECT p.district_id, d.code, d.name, p.years, p.slots, p.vals
       FROM per_district p JOIN districts d ON d.id = p.district_id
      ORDER BY d.code`,
    params,
  );
  return rows;
}

function assemble(rows: DistrictRows[], codes: string[], sel: Selection): DistrictSeries[] {
  const slotOf = (c: string) => codes.indexOf(c);
  const ySlot = slotOf(sel.emissions);
  const xSlot = slotOf(sel.driver);
  const cSlots = sel.controls.map(slotOf);
  const value = new Float64Array(codes.length);
  const seen = new Uint8Array(codes.length);
  return rows.map((r) => {
    const data: DistrictData = {
      years: [],
      x: [],
      y: [],
      controls: Object.fromEntries(sel.controls.map((c) => [c, [] as number[]])),
      droppedYears: [],
    };
    let i = 0;
    while (i < r.years.length) {
      const year = r.years[i];
      seen.fill(0);
      for (; i < r.years.length && r.years[i] === year; i++) {
        value[r.slots[i]] = Number(r.vals[i]);
        seen[r.slots[i]] = 1;
      }
      // A year counts only when emissions, the driver and every control are present.
      if (!seen.every((v) => v === 1)) {
        data.droppedYears.push(year);
        continue;
      }
      data.years.push(year);
      data.y.push(value[ySlot]);
      data.x.push(value[xSlot]);
      sel.controls.forEach((c, j) => data.controls[c].push(value[cSlots[j]]));
    }
    return { districtId: Number(r.district_id), code: r.code, name: r.name, data };
  });
}

/** Every district's series at a data version (districts with no rows at all are left out). */
export async function loadSeries(
  db: Knex,
  version: number,
  sel: Selection,
  districtIds: number[] | null = null,
): Promise<DistrictSeries[]> {
  const codes = [...new Set([sel.emissions, sel.driver, ...sel.controls])];
  return assemble(await rawRows(db, version, codes, sel, districtIds), codes, sel);
}

/** A hash of exactly the values a run reads (district, indicator, year, value as written). */
export function hashSeries(series: DistrictSeries[], sel: Selection): { hash: string; rows: number } {
  const h = createHash('sha256');
  let rows = 0;
  h.update(JSON.stringify(sel));
  // One update per district (the digest of the concatenation is the same as of the pieces).
  for (const s of series) {
    let text = `\n${s.code}`;
    for (let i = 0; i < s.data.years.length; i++) {
      text += `|${s.data.years[i]}:${s.data.y[i]}:${s.data.x[i]}`;
      for (const c of sel.controls) text += `:${s.data.controls[c][i]}`;
      rows++;
    }
    h.update(text);
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
