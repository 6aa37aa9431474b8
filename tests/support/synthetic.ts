/**
 * Invented districts for plumbing tests and benchmarks (not a correctness reference):
 * inverted-U series of emissions per person against real income per person with a
 * density control, from a fixed seed.
 */
import type { Knex } from 'knex';
import { seededRandom } from '../../api/demo/random';

export async function insertSyntheticDistricts(
  db: Knex,
  count: number,
  opts: { years?: number; seed?: number; prefix?: string } = {},
): Promise<void> {
  const years = opts.years ?? 40;
  const rng = seededRandom(opts.seed ?? 7);
  const prefix = opts.prefix ?? 'S';
  const ids = new Map<string, number>(
    (await db('indicators').whereIn('code', ['emissions_pc', 'income_pc', 'pop_density']).select('id', 'code')).map(
      (r: { id: number; code: string }) => [r.code, r.id],
    ),
  );
  const districts = Array.from({ length: count }, (_, i) => ({
    code: `${prefix}${String(i + 1).padStart(4, '0')}`,
    name: `Synthetic district ${i + 1}`,
  }));
  const inserted: { id: number; code: string }[] = [];
  for (let i = 0; i < districts.length; i += 1000)
    inserted.push(
      ...(await db('districts')
        .insert(districts.slice(i, i + 1000))
        .returning(['id', 'code'])),
    );
  const rows: { district_id: number; indicator_id: number; year: number; value: number }[] = [];
  for (const d of inserted) {
    const lx0 = rng.between(8.8, 9.6);
    const lx1 = lx0 + rng.between(0.8, 1.6);
    const turn = rng.between(lx0 + 0.2, lx1 + 0.6);
    const b2 = -rng.between(0.3, 0.8);
    const b1 = -2 * b2 * turn;
    let walk = 0;
    let u = 0;
    const ld0 = rng.between(4, 7);
    for (let t = 0; t < years; t++) {
      walk += rng.normal() * 0.012;
      u = 0.5 * u + rng.normal() * 0.03;
      const lx = lx0 + ((lx1 - lx0) * t) / (years - 1) + walk;
      const ld = ld0 + 0.005 * t + rng.normal() * 0.01;
      const ly = 1 + b1 * (lx - turn) + b2 * (lx * lx - turn * turn) + 0.1 * ld + u;
      const year = 2025 - years + 1 + t;
      rows.push(
        { district_id: d.id, indicator_id: ids.get('emissions_pc')!, year, value: Number(Math.exp(ly).toFixed(5)) },
        { district_id: d.id, indicator_id: ids.get('income_pc')!, year, value: Number(Math.exp(lx).toFixed(2)) },
        { district_id: d.id, indicator_id: ids.get('pop_density')!, year, value: Number(Math.exp(ld).toFixed(3)) },
      );
    }
  }
  for (let i = 0; i < rows.length; i += 5000) await db('observations').insert(rows.slice(i, i + 5000));
}

/** Gives district `toId` a copy of every observation of district `fromCode`. */
export async function copyDistrictSeries(db: Knex, fromCode: string, toId: number): Promise<void> {
  await db.raw(
    `INSERT INTO observations (district_id, indicator_id, year, value, upload_id)
     SELECT ?, o.indicator_id, o.year, o.value, o.upload_id FROM observations o JOIN districts d ON d.id = o.district_id WHERE d.code = ?`,
    [toId, fromCode],
  );
}
