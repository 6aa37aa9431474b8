/**
 * The bulk path of the merge: a first load of at least BULK_MIN_ROWS values drops
 * observations' keys, inserts the rows in one statement and re-creates the keys. Invented
 * values; every expected number is counted from the file written here (plumbing checks).
 */
import { BULK_MIN_ROWS } from '../../api/uploads/merge-store';
import { storedValue, upload, uploadWorld, type UploadWorld } from './upload-helpers';

jest.setTimeout(120_000);

let w: UploadWorld;
beforeAll(async () => {
  w = await uploadWorld();
});
afterAll(async () => w.close());

const INDICATORS = ['emissions_pc', 'income_pc', 'population', 'pop_density'];
const DISTRICTS = Math.ceil(BULK_MIN_ROWS / (INDICATORS.length * 50));

/** value of district d, indicator k, year y: distinct, positive, with a fraction that must survive the staging COPY exactly. */
const valueOf = (d: number, k: number, y: number) => 1000 * (k + 1) + d + (y - 1975) / 7;

/** A revision changes every 4th year's value (years 1976, 1980, …) by 1%. */
const revised = (d: number, k: number, y: number) => valueOf(d, k, y) * ((y - 1976) % 4 === 0 ? 1.01 : 1);

function bigCsv(value = valueOf): string {
  let out = 'district_code,district_name,indicator,year,value\n';
  for (let d = 1; d <= DISTRICTS; d++) {
    for (let k = 0; k < INDICATORS.length; k++) {
      for (let y = 1976; y <= 2025; y++)
        out += `Q${String(d).padStart(4, '0')},Bulk district ${d},${INDICATORS[k]},${y},${value(d, k, y)}\n`;
    }
  }
  return out;
}

const foreignKeys = async () =>
  (
    await w.t.db.raw(
      `SELECT contype, pg_get_constraintdef(oid) AS def FROM pg_constraint
        WHERE conrelid = 'observations'::regclass AND contype IN ('p', 'f') ORDER BY contype, conname`,
    )
  ).rows.map((c: { contype: string; def: string }) => `${c.contype} ${c.def}`);

const KEYS = [
  'f FOREIGN KEY (district_id) REFERENCES districts(id) ON DELETE CASCADE',
  'f FOREIGN KEY (indicator_id) REFERENCES indicators(id) ON DELETE RESTRICT',
  'f FOREIGN KEY (upload_id) REFERENCES uploads(id)',
  'p PRIMARY KEY (district_id, indicator_id, year)',
];

describe('a first load large enough for the bulk path', () => {
  it('inserts every value exactly, by the upload, and puts the keys back', async () => {
    const rows = DISTRICTS * INDICATORS.length * 50;
    const res = await upload(w.analyst, bigCsv(), 'bulk.csv', { commit: true, allowNewDistricts: true });
    expect(res.status).toBe(201);
    expect(res.body.timings.bulkPath).toBe(true);
    expect(res.body.upload.counts.insert).toBe(rows);
    const id = res.body.upload.id;
    const { rows: counted } = await w.t.db.raw(
      `SELECT count(*)::int AS n, count(*) FILTER (WHERE o.upload_id = ?)::int AS mine
         FROM observations o JOIN districts d ON d.id = o.district_id WHERE d.code LIKE 'Q%'`,
      [id],
    );
    expect(counted[0]).toEqual({ n: rows, mine: rows });
    // Doubles through the file, staging and the merge: the value as the file wrote it.
    expect(await storedValue(w.t.db, 'Q0007', 'income_pc', 1990)).toBe(valueOf(7, 1, 1990));
    expect(await storedValue(w.t.db, `Q${String(DISTRICTS).padStart(4, '0')}`, 'pop_density', 2025)).toBe(
      valueOf(DISTRICTS, 3, 2025),
    );
    expect(await foreignKeys()).toEqual(KEYS);
  });

  it('then takes a large revision: every changed value, its history, and the keys back', async () => {
    const changes = DISTRICTS * INDICATORS.length * Math.ceil(50 / 4); // years 1976 + 4j, j = 0..12
    const res = await upload(w.analyst, bigCsv(revised), 'bulk-revision.csv', { commit: true });
    expect(res.status).toBe(201);
    expect(res.body.upload.counts.change).toBe(changes);
    const id = res.body.upload.id;
    expect(await storedValue(w.t.db, 'Q0007', 'income_pc', 1980)).toBe(revised(7, 1, 1980));
    expect(await storedValue(w.t.db, 'Q0007', 'income_pc', 1981)).toBe(valueOf(7, 1, 1981));
    const { rows } = await w.t.db.raw(
      `SELECT (SELECT count(*)::int FROM observations WHERE upload_id = ?) AS mine,
              (SELECT count(*)::int FROM observation_history WHERE upload_id = ?) AS history`,
      [id, id],
    );
    expect(rows[0]).toEqual({ mine: changes, history: changes });
    expect(await foreignKeys()).toEqual(KEYS);
  });
});
