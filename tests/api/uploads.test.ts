/**
 * Uploads, the good path: preview counts, commit, re-upload no-op, revert, both formats,
 * decimal comma, BOM + semicolon, new districts. The demo region is invented data; the
 * expected numbers are counted from the files and the seeded values (plumbing checks).
 */
import fs from 'node:fs';
import path from 'node:path';
import { generateDemoRegion } from '../../api/demo/generate';
import { withConnection } from '../../api/db/connection';
import { pruneStaging, STAGING_TTL_HOURS } from '../../api/uploads/staging-store';
import { DataVersionSchema, DistrictObservationsResponseSchema } from '../../contracts/districts';
import {
  RevertAnswerSchema,
  UploadAnswerSchema,
  UploadListResponseSchema,
  UploadRejectionDetailsSchema,
} from '../../contracts/uploads';
import { parseAnswer } from '../support/contract';
import { observationsChecksum, storedValue, upload, uploadWorld, type UploadWorld } from './upload-helpers';

const demoDir = path.resolve(__dirname, '..', '..', 'assets', 'demo-data');
const demoLong = fs.readFileSync(path.join(demoDir, 'demo-long.csv'));
const demoWide = fs.readFileSync(path.join(demoDir, 'demo-wide.csv'));
const seeded = generateDemoRegion();
const seededValue = (d: string, ind: string, y: number) =>
  seeded.observations.find((o) => o.districtCode === d && o.indicator === ind && o.year === y)?.value;

let w: UploadWorld;
beforeAll(async () => {
  w = await uploadWorld();
});
afterAll(async () => w.close());

describe('POST /api/uploads (long format, dry run then commit)', () => {
  it('previews without writing: counts per district and indicator', async () => {
    const before = await observationsChecksum(w.t.db);
    const res = await upload(w.analyst, demoLong, 'demo-long.csv');
    expect(res.status).toBe(200);
    expect(parseAnswer(UploadAnswerSchema, res).noop).toBe(false);
    expect(res.body.upload).toMatchObject({
      status: 'previewed',
      kind: 'file',
      format: 'long',
      fileName: 'demo-long.csv',
      canCommit: true,
    });
    const p = res.body.preview;
    // Expected counts: each row of the file against the seeded value for its key.
    const rows = demoLong
      .toString('utf8')
      .trim()
      .split('\n')
      .slice(1)
      .map((l) => l.split(','));
    const kind = ([d, ind, y, v]: string[]) => {
      const stored = seededValue(d, ind, Number(y));
      return stored === undefined ? 'insert' : stored === Number(v) ? 'unchanged' : 'change';
    };
    const totals = { insert: 0, change: 0, unchanged: 0 };
    for (const r of rows) totals[kind(r)]++;
    expect(p.rowsRead).toBe(rows.length);
    expect(p.totals).toEqual(totals);
    // The file fills D09's missing year 2008 and adds industry_share before 2015 for D01–D04.
    expect(p.byIndicator.find((i: { indicator: string }) => i.indicator === 'industry_share')).toMatchObject({
      insert: 20,
      change: 0,
      unchanged: 0,
    });
    const d09 = p.byDistrict.find((d: { district: string }) => d.district === 'D09');
    expect(d09).toMatchObject({ insert: 4, change: 0, unchanged: 0, isNew: false, name: 'Ironbeck' });
    const d01 = rows.find((r) => r[0] === 'D01' && r[1] === 'emissions_pc')!;
    expect(p.byDistrict.find((d: { district: string }) => d.district === 'D01').indicators.emissions_pc).toEqual({
      insert: 0,
      change: 0,
      unchanged: 0,
      [kind(d01)]: 1,
    });
    expect(await observationsChecksum(w.t.db)).toBe(before);
  });

  it('commits the kept preview, and the district shows the new values', async () => {
    const list = await w.analyst.get('/api/uploads?status=previewed');
    const id = parseAnswer(UploadListResponseSchema, list).uploads[0].id;
    const res = await w.analyst.post(`/api/uploads/${id}/commit`);
    expect(res.status).toBe(201);
    expect(parseAnswer(UploadAnswerSchema, res).upload).toMatchObject({
      id,
      status: 'committed',
      canRevert: true,
      counts: { insert: list.body.uploads[0].counts.insert },
    });
    const revised = Number(/^D03,emissions_pc,2025,(.*)$/m.exec(demoLong.toString('utf8'))![1]);
    expect(await storedValue(w.t.db, 'D03', 'emissions_pc', 2025)).toBe(revised);
    const obs = await w.official.get('/api/districts/D09/observations');
    expect(obs.status).toBe(200);
    const emissions = parseAnswer(DistrictObservationsResponseSchema, obs).indicators.find(
      (i) => i.code === 'emissions_pc',
    );
    expect(emissions?.series.find((s) => s.year === 2008)).toMatchObject({ uploadId: id });
    expect(emissions?.gaps).toEqual([]);
  });

  it('answers a re-upload of the same file with a no-op', async () => {
    const before = await observationsChecksum(w.t.db);
    const res = await upload(w.analyst, demoLong, 'demo-long-again.csv', { commit: true });
    expect(res.status).toBe(200);
    const answer = parseAnswer(UploadAnswerSchema, res);
    expect(answer.noop && answer.message).toMatch(/already committed as upload \d+/);
    expect(await observationsChecksum(w.t.db)).toBe(before);
  });
});

describe('revert', () => {
  it('restores exactly the previous values and data version hash', async () => {
    const v0 = await w.official.get('/api/data-version');
    expect(v0.status).toBe(200);
    parseAnswer(DataVersionSchema, v0);
    const before = await storedValue(w.t.db, 'D07', 'population', 2025);
    const writer = () =>
      w.t
        .db('observations as o')
        .join('districts as d', 'd.id', 'o.district_id')
        .join('indicators as i', 'i.id', 'o.indicator_id')
        .where({ 'd.code': 'D07', 'i.code': 'population', 'o.year': 2025 })
        .first('o.upload_id');
    const writerBefore = (await writer()).upload_id;
    // Two revisions of the same file shape: one value changed, one inserted (D05 trade_openness 2020).
    const csv = `district_code,indicator,year,value\nD07,population,2025,${before! + 1234}\nD05,trade_openness,2020,61.5\n`;
    const up = await upload(w.analyst, csv, 'revision.csv', { commit: true });
    expect(up.status).toBe(201);
    expect(up.body.upload.version).toBe(v0.body.version + 1);
    expect(await storedValue(w.t.db, 'D07', 'population', 2025)).toBe(before! + 1234);
    const res = await w.analyst.post(`/api/uploads/${up.body.upload.id}/revert`);
    expect(res.status).toBe(200);
    expect(parseAnswer(RevertAnswerSchema, res).restored).toEqual({
      changedBack: 1,
      removed: 1,
      reinserted: 0,
      derived: 0,
    });
    expect(res.body.reverted).toMatchObject({ id: up.body.upload.id, status: 'reverted', canRevert: false });
    expect(res.body.revert).toMatchObject({
      kind: 'revert',
      revertsUploadId: up.body.upload.id,
      version: v0.body.version + 2,
    });
    expect(await storedValue(w.t.db, 'D07', 'population', 2025)).toBe(before);
    expect(await storedValue(w.t.db, 'D05', 'trade_openness', 2020)).toBeNull();
    const v2 = await w.official.get('/api/data-version');
    expect(v2.body.rowsHash).toBe(v0.body.rowsHash);
    // The cell's writer is the earlier upload again, not the revert.
    expect((await writer()).upload_id).toBe(writerBefore);
  });

  it('rebuilds every earlier data version with the hash it had', async () => {
    const hashes = new Map<number, string>();
    const now = await w.official.get('/api/data-version');
    hashes.set(now.body.version, now.body.rowsHash);
    const a = await upload(
      w.analyst,
      'district_code,indicator,year,value\nD02,income_pc,2025,33333\nD02,trade_openness,2014,70.1\n',
      'a.csv',
      { commit: true },
    );
    hashes.set(a.body.upload.version, (await w.official.get('/api/data-version')).body.rowsHash);
    const b = await upload(
      w.analyst,
      'district_code,indicator,year,value\nD02,income_pc,2025,34444\nD02,trade_openness,2013,69.0\n',
      'b.csv',
      { commit: true },
    );
    hashes.set(b.body.upload.version, (await w.official.get('/api/data-version')).body.rowsHash);
    const rb = await w.analyst.post(`/api/uploads/${b.body.upload.id}/revert`);
    expect(rb.status).toBe(200);
    hashes.set(rb.body.revert.version, (await w.official.get('/api/data-version')).body.rowsHash);
    expect(hashes.get(rb.body.revert.version)).toBe(hashes.get(a.body.upload.version));
    for (const [version, hash] of hashes) {
      const r = await w.official.get(`/api/data-version?version=${version}`);
      expect([version, r.body.rowsHash]).toEqual([version, hash]);
    }
    // Version 1 is the demo seed: its rebuild equals the values the generator made.
    const seed = await w.official.get('/api/data-version?version=1');
    expect(seed.body.rows).toBe(seeded.observations.length);
  });

  it('refuses to revert an upload whose values a later upload changed, until that one is reverted', async () => {
    const a = await upload(w.analyst, 'district_code,indicator,year,value\nD04,income_pc,2025,22222\n', 'c.csv', {
      commit: true,
    });
    const b = await upload(w.analyst, 'district_code,indicator,year,value\nD04,income_pc,2025,22444\n', 'd.csv', {
      commit: true,
    });
    const refused = await w.analyst.post(`/api/uploads/${a.body.upload.id}/revert`);
    expect(refused.status).toBe(409);
    expect(refused.body.error.code).toBe('revert_conflict');
    expect(refused.body.error.details.laterUploads).toEqual([b.body.upload.id]);
    expect((await w.analyst.post(`/api/uploads/${b.body.upload.id}/revert`)).status).toBe(200);
    expect((await w.analyst.post(`/api/uploads/${a.body.upload.id}/revert`)).status).toBe(200);
    expect(await storedValue(w.t.db, 'D04', 'income_pc', 2025)).toBe(seededValue('D04', 'income_pc', 2025));
    const again = await w.analyst.post(`/api/uploads/${a.body.upload.id}/revert`);
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('already_reverted');
  });

  it('lets a reverted file be uploaded again (it is no longer a no-op)', async () => {
    const csv = 'district_code,indicator,year,value\nD04,income_pc,2025,22222\n';
    const res = await upload(w.analyst, csv, 'c-again.csv', { commit: true });
    expect(res.status).toBe(201);
    expect(res.body.noop).toBe(false);
    expect(await storedValue(w.t.db, 'D04', 'income_pc', 2025)).toBe(22222);
  });
});

describe('formats and options', () => {
  it('loads the wide demo file: one value per indicator column, names checked against the stored ones', async () => {
    const res = await upload(w.analyst, demoWide, 'demo-wide.csv', { commit: true });
    expect(res.status).toBe(201);
    expect(res.body.upload.format).toBe('wide');
    // 24 districts × 2 indicators over 2015–2025 (11 years), less the short series D10 (8) and D18 (7).
    const rows = 22 * 11 + 8 + 7;
    expect(res.body.preview.rowsRead).toBe(rows);
    expect(res.body.preview.totals.insert + res.body.preview.totals.change + res.body.preview.totals.unchanged).toBe(
      2 * rows,
    );
    expect(res.body.problems).toEqual([]);
    const obs = await w.official.get('/api/districts/D10/observations?indicators=industry_share,trade_openness');
    expect(obs.body.indicators.map((i: { code: string }) => i.code)).toEqual(['industry_share', 'trade_openness']);
    expect(obs.body.indicators[0]).toMatchObject({ firstYear: 2018, lastYear: 2025, values: 8, gaps: [] });
  });

  it('reads a semicolon file with a BOM and decimal commas when told so', async () => {
    const csv = '\uFEFFdistrict_code;year;industry_share;trade_openness\r\nD11;2012;"31,5";88,25\r\nD11;2013;30,9;\r\n';
    const dry = await upload(w.analyst, csv, 'semicolons.csv');
    expect(dry.status).toBe(422);
    expect(
      parseAnswer(UploadRejectionDetailsSchema, { status: dry.status, body: dry.body.error.details }).problems[0],
    ).toMatchObject({ line: 2, column: 3, code: 'not_a_number' });
    expect(dry.body.error.message).toMatch(/decimal-comma option/);
    const res = await upload(w.analyst, csv, 'semicolons.csv', { commit: true, decimalComma: true });
    expect(res.status).toBe(201);
    expect(res.body.preview).toMatchObject({ format: 'wide', delimiter: ';', decimalComma: true, values: 3 });
    expect(await storedValue(w.t.db, 'D11', 'industry_share', 2012)).toBe(31.5);
    expect(await storedValue(w.t.db, 'D11', 'trade_openness', 2012)).toBe(88.25);
    expect(await storedValue(w.t.db, 'D11', 'trade_openness', 2013)).toBeNull();
  });

  it('creates new districts named in a district_name column, and keeps a formula-like name as text', async () => {
    const csv =
      'district_code,district_name,indicator,year,value\nD25,"=HYPERLINK(""x"")",population,2024,1200\nD25,"=HYPERLINK(""x"")",population,2025,1210\n';
    const res = await upload(w.analyst, csv, 'new-district.csv', { commit: true });
    expect(res.status).toBe(201);
    expect(res.body.preview.newDistricts).toEqual([{ code: 'D25', name: '=HYPERLINK("x")', line: 2 }]);
    expect(res.body.preview.byDistrict[0]).toMatchObject({ district: 'D25', isNew: true, insert: 2 });
    const d = await w.official.get('/api/districts/D25/observations');
    expect(d.body.district).toEqual({ code: 'D25', name: '=HYPERLINK("x")' });
    const csvOut = await w.official.get('/api/districts/D25/observations.csv');
    expect(csvOut.status).toBe(200);
    expect(csvOut.headers['content-type']).toMatch(/text\/csv/);
    expect(csvOut.text.split('\r\n')[1]).toBe(`"D25","'=HYPERLINK(""x"")",2024,1200`);
  });

  it('refuses unknown district codes without names unless new codes are allowed', async () => {
    const csv = 'district_code,indicator,year,value\nD26,population,2025,5000\nD26,population,2024,4990\n';
    const refused = await upload(w.analyst, csv, 'd26.csv', { commit: true });
    expect(refused.status).toBe(422);
    expect(refused.body.error.details.problems).toEqual([
      expect.objectContaining({
        line: 2,
        column: 1,
        field: 'district_code',
        code: 'unknown_district',
        severity: 'error',
      }),
    ]);
    expect(await w.t.db('districts').where({ code: 'D26' }).first()).toBeUndefined();
    const allowed = await upload(w.analyst, csv, 'd26.csv', { commit: true, allowNewDistricts: true });
    expect(allowed.status).toBe(201);
    expect(await w.t.db('districts').where({ code: 'D26' }).first('name')).toEqual({ name: 'D26' });
  });

  it('warns about a value that moves by more than the change factor, and still commits it', async () => {
    const stored = await storedValue(w.t.db, 'D14', 'pop_density', 2025);
    const csv = `district_code,indicator,year,value\nD14,pop_density,2025,${stored! * 10}\nD14,pop_density,2024,${seededValue('D14', 'pop_density', 2024)}\n`;
    const res = await upload(w.analyst, csv, 'unit-slip.csv', { commit: true, changeFactor: 3 });
    expect(res.status).toBe(201);
    expect(res.body.problems).toEqual([
      expect.objectContaining({ line: 2, column: 4, code: 'large_change', severity: 'warning' }),
    ]);
    expect(res.body.problems[0].reason).toMatch(/more than a factor of 3/);
    expect(res.body.upload.counts).toMatchObject({ change: 1, unchanged: 1, warnings: 1 });
  });

  it('keeps the upload history and uploads from officials; analysts read the history', async () => {
    const list = await w.analyst.get('/api/uploads?limit=5');
    expect(list.status).toBe(200);
    expect(list.body.uploads).toHaveLength(5);
    expect(list.body.nextBefore).toBe(list.body.uploads[4].id);
    expect((await w.official.get('/api/uploads?limit=5')).status).toBe(403);
    expect((await w.official.get(`/api/uploads/${list.body.uploads[0].id}`)).status).toBe(403);
    const denied = await upload(w.official, 'district_code,indicator,year,value\nD01,population,2025,1\n', 'x.csv');
    expect(denied.status).toBe(403);
    const seed = (await w.analyst.get('/api/uploads?limit=200')).body.uploads.find(
      (u: { kind: string }) => u.kind === 'seed',
    );
    expect(seed).toMatchObject({
      status: 'committed',
      version: 1,
      canRevert: false,
      counts: { insert: seeded.observations.length },
    });
  });
});

describe('kept previews and earlier versions', () => {
  it('checks a kept preview again at commit time, against the data as it is then', async () => {
    const csv = 'district_code,indicator,year,value\nD19,income_pc,2025,30001\nD19,income_pc,2024,30002\n';
    const dry = await upload(w.analyst, csv, 'later.csv');
    expect(dry.body.preview.totals).toEqual({ insert: 0, change: 2, unchanged: 0 });
    // Meanwhile another upload writes one of the same values.
    expect(
      (
        await upload(w.analyst, 'district_code,indicator,year,value\nD19,income_pc,2025,30001\n', 'meanwhile.csv', {
          commit: true,
        })
      ).status,
    ).toBe(201);
    const res = await w.analyst.post(`/api/uploads/${dry.body.upload.id}/commit`);
    expect(res.status).toBe(201);
    expect(res.body.preview.totals).toEqual({ insert: 0, change: 1, unchanged: 1 });
    expect((await w.analyst.post(`/api/uploads/${dry.body.upload.id}/commit`)).body.error.code).toBe(
      'already_committed',
    );
  });

  it('answers 410 for a preview whose staged rows were dropped after a day', async () => {
    const dry = await upload(w.analyst, 'district_code,indicator,year,value\nD20,income_pc,2025,19999\n', 'stale.csv');
    expect(dry.body.upload.canCommit).toBe(true);
    await withConnection(w.t.db, (conn) =>
      pruneStaging(conn, new Date(Date.now() + (STAGING_TTL_HOURS + 1) * 3600_000)),
    );
    const res = await w.analyst.post(`/api/uploads/${dry.body.upload.id}/commit`);
    expect(res.status).toBe(410);
    expect(res.body.error.code).toBe('preview_expired');
    expect((await w.analyst.get(`/api/uploads/${dry.body.upload.id}`)).body.upload.canCommit).toBe(false);
  });

  it('shows a district as of an earlier data version', async () => {
    const before = (await w.official.get('/api/data-version')).body.version;
    const old = await storedValue(w.t.db, 'D21', 'population', 2025);
    expect(
      (
        await upload(w.analyst, `district_code,indicator,year,value\nD21,population,2025,${old! + 7}\n`, 'd21.csv', {
          commit: true,
        })
      ).status,
    ).toBe(201);
    const now = await w.official.get('/api/districts/D21/observations?indicators=population');
    const then = await w.official.get(`/api/districts/D21/observations?indicators=population&asOf=${before}`);
    const at2025 = (b: { indicators: { series: { year: number; value: number }[] }[] }) =>
      b.indicators[0].series.find((s) => s.year === 2025)!.value;
    expect([then.body.dataVersion, at2025(then.body)]).toEqual([before, old]);
    expect([now.body.dataVersion, at2025(now.body)]).toEqual([before + 1, old! + 7]);
    expect((await w.official.get(`/api/districts/D21/observations?asOf=${before + 5}`)).status).toBe(404);
  });

  it('takes the change factor from the admin settings when the upload does not give one', async () => {
    // Settings default (docs/method.md / api/settings): uploadChangeFactor 3.
    const stored = await storedValue(w.t.db, 'D22', 'pop_density', 2025);
    const twice = await upload(
      w.analyst,
      `district_code,indicator,year,value\nD22,pop_density,2025,${stored! * 2.5}\n`,
      'x2.csv',
    );
    expect(twice.body.problems).toEqual([]);
    const fourfold = await upload(
      w.analyst,
      `district_code,indicator,year,value\nD22,pop_density,2025,${stored! * 4}\n`,
      'x4.csv',
    );
    expect(fourfold.body.problems.map((p: { code: string }) => p.code)).toEqual(['large_change']);
  });
});
