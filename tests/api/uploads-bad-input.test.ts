/**
 * The bad-input corpus (tests/fixtures/bad-csv): every file gets a 4xx whose message names
 * the line and column of the first error, in a dry run and with ?commit=true, and the
 * observations table is byte-for-byte unchanged afterwards. Plus a 60 MB file, generated
 * here, against the 50 MB limit.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { observationsChecksum, upload, uploadWorld, type UploadQuery, type UploadWorld } from './upload-helpers';

interface Expected {
  status: number;
  code: string;
  line: number | null;
  column: number | null;
  note: string;
  options?: UploadQuery;
  also?: { code: string; line: number; column: number }[];
}

const dir = path.resolve(__dirname, '..', 'fixtures', 'bad-csv');
const expected: Record<string, Expected> = JSON.parse(fs.readFileSync(path.join(dir, 'expected.json'), 'utf8'));
const files = Object.entries(expected);

let w: UploadWorld;
let districtsBefore: number;
let checksum: string;
let tmp: string;

beforeAll(async () => {
  w = await uploadWorld();
  // The derived-indicator file needs one derived indicator in the catalogue.
  await w.analyst
    .post('/api/indicators')
    .send({ code: 'co2_total', name: 'CO2 emissions', unit: 't CO2', mustBePositive: true })
    .expect(201);
  await w.analyst
    .post('/api/indicators')
    .send({
      code: 'co2_pc_derived',
      name: 'CO2 per person',
      unit: 't per person',
      mustBePositive: true,
      derivation: { kind: 'per_person', source: 'co2_total', divisor: 'population' },
    })
    .expect(201);
  checksum = await observationsChecksum(w.t.db);
  districtsBefore = Number((await w.t.db('districts').count({ n: '*' }))[0].n);
  tmp = fs.mkdtempSync(path.join(os.tmpdir(), 'crestwatch-bad-csv-'));
});
afterAll(async () => {
  fs.rmSync(tmp, { recursive: true, force: true });
  await w.close();
});

describe('the bad-input corpus', () => {
  it('has at least 30 files, each listed with what it must produce', () => {
    const onDisk = fs
      .readdirSync(dir)
      .filter((f) => f !== 'expected.json' && f !== 'README.md')
      .sort();
    expect(onDisk).toEqual(Object.keys(expected).sort());
    expect(onDisk.length).toBeGreaterThanOrEqual(30);
  });

  it.each(files)('%s is refused with its line and column, and nothing is written', async (name, e) => {
    const content = fs.readFileSync(path.join(dir, name));
    for (const commit of [false, true]) {
      const res = await upload(w.analyst, content, name, { ...e.options, commit });
      expect([name, commit, res.status]).toEqual([name, commit, e.status]);
      expect(res.body.error.code).toBe('upload_rejected');
      const problems: { line: number | null; column: number | null; code: string; severity: string; reason: string }[] =
        res.body.error.details.problems;
      const firstError = problems.find((p) => p.severity === 'error')!;
      expect({ code: firstError.code, line: firstError.line, column: firstError.column }).toEqual({
        code: e.code,
        line: e.line,
        column: e.column,
      });
      for (const a of e.also ?? []) expect(problems).toContainEqual(expect.objectContaining(a));
      const message: string = res.body.error.message;
      if (e.line !== null) expect(message).toContain(`ine ${e.line}`);
      if (e.column !== null) expect(message).toContain(`column ${e.column}`);
      expect(message.toLowerCase()).toContain(firstError.reason.toLowerCase());
      expect(await observationsChecksum(w.t.db)).toBe(checksum);
    }
    expect(Number((await w.t.db('districts').count({ n: '*' }))[0].n)).toBe(districtsBefore);
  });

  it('answers a 60 MB file with 413 and a clear message, and writes nothing', async () => {
    const file = path.join(tmp, 'sixty-megabytes.csv');
    const out = fs.openSync(file, 'w');
    fs.writeSync(out, 'district_code,indicator,year,value\n');
    const block = Array.from(
      { length: 10_000 },
      (_, i) => `D${String((i % 24) + 1).padStart(2, '0')},population,${1900 + (i % 120)},${100000 + i}\n`,
    ).join('');
    let size = 0;
    while (size < 60 * 1024 * 1024) size += fs.writeSync(out, block);
    fs.closeSync(out);
    const res = await w.analyst.post('/api/uploads').query({ commit: true }).attach('file', file);
    expect(res.status).toBe(413);
    expect(res.body.error).toMatchObject({ code: 'payload_too_large', details: { maxBytes: 50 * 1024 * 1024 } });
    expect(res.body.error.message).toMatch(/larger than the upload limit of 50 MB/);
    expect(await observationsChecksum(w.t.db)).toBe(checksum);
  }, 60_000);

  it('refuses a request without a file part', async () => {
    const res = await w.analyst.post('/api/uploads').field('note', 'no file here');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('no_file');
    const wrongField = await w.analyst.post('/api/uploads').attach('csv', Buffer.from('a'), 'a.csv');
    expect(wrongField.status).toBe(400);
    expect(wrongField.body.error.code).toBe('unexpected_field');
  });

  it('records refused files as failed uploads with their problems', async () => {
    const failed = await w.analyst.get('/api/uploads?status=failed&limit=200');
    expect(failed.body.uploads.length).toBeGreaterThanOrEqual(files.length);
    const one = await w.analyst.get(`/api/uploads/${failed.body.uploads[0].id}`);
    expect(one.body.upload.status).toBe('failed');
    expect(one.body.problems.length).toBeGreaterThan(0);
  });
});
