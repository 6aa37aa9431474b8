/**
 * Uploads, the good path: preview counts, commit, re-upload no-op, revert, both formats,
 * decimal comma, BOM + semicolon, new districts. The demo region is invented data; the
 * expected numbers are counted from the files and the seeded values (plumbing checks).
 */
import fs from 'node:fs';
import path from 'node:path';
import { generateDemoRegion } from '../../api/demo/generate';
import { observationsChecksum, storedValue, upload, uploadWorld, type UploadWorld } from './upload-helpers';

const demoDir = path.resolve(__dirname, '..', '..', 'assets', 'demo-data');
const demoLong = fs.readFileSync(path.join(demoDir, 'demo-long.csv'));
const demoWide = fs.readFileSync(path.join(demoDir, 'demo-wide.csv'));
const seeded = generateDemoRegion();
const seededValue = (d: string, ind: string, y: number) => seeded.observations.find((o) => o.districtCode === d && o.indicator === ind && o.year === y)?.value;

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
    expect(res.body.noop).toBe(false);
    expect(res.body.upload).toMatchObject({ status: 'previewed', kind: 'file', format: 'long', fileName: 'demo-long.csv', canCommit: true });
    const p = res.body.preview;
    // Counted from demo-long.csv: 5 + 3 + 2 revisions, 4 gap values and 20 industry_share values new, 4 repeats.
    expect(p.rowsRead).toBe(38);
    expect(p.totals).toEqual({ insert: 24, change: 10, unchanged: 4 });
    expect(p.byIndicator.find((i: { indicator: string }) => i.indicator === 'industry_share')).toMatchObject({ insert: 20, change: 0, unchanged: 0 });
    const d09 = p.byDistrict.find((d: { district: string }) => d.district === 'D09');
    expect(d09).toMatchObject({ insert: 4, change: 0, unchanged: 0, isNew: false, name: 'Ironbeck' });
    expect(p.byDistrict.find((d: { district: string }) => d.district === 'D01').indicators.emissions_pc).toEqual({ insert: 0, change: 0, unchanged: 1 });
    expect(res.body.problems).toEqual([]);
    expect(await observationsChecksum(w.t.db)).toBe(before);
  });

  it('commits the kept preview, and the district shows the new values', async () => {
    const list = await w.analyst.get('/api/uploads?status=previewed');
    const id = list.body.uploads[0].id;
    const res = await w.analyst.post(`/api/uploads/${id}/commit`);
    expect(res.status).toBe(201);
    expect(res.body.upload).toMatchObject({ id, status: 'committed', canRevert: true, counts: { insert: 24, change: 10, unchanged: 4 } });
    const revised = Number((seededValue('D03', 'emissions_pc', 2025)! * 0.97).toFixed(4));
    expect(await storedValue(w.t.db, 'D03', 'emissions_pc', 2025)).toBe(revised);
    const obs = await w.official.get('/api/districts/D09/observations');
    expect(obs.status).toBe(200);
    const emissions = obs.body.indicators.find((i: { code: string }) => i.code === 'emissions_pc');
    expect(emissions.series.find((s: { year: number }) => s.year === 2008)).toMatchObject({ uploadId: id });
    expect(emissions.gaps).toEqual([]);
  });

  it('answers a re-upload of the same file with a no-op', async () => {
    const before = await observationsChecksum(w.t.db);
    const res = await upload(w.analyst, demoLong, 'demo-long-again.csv', { commit: true });
    expect(res.status).toBe(200);
    expect(res.body.noop).toBe(true);
    expect(res.body.message).toMatch(/already committed as upload \d+/);
    expect(await observationsChecksum(w.t.db)).toBe(before);
  });
});
