/**
 * A cap on new district codes in one upload (UPLOAD_MAX_NEW_DISTRICTS, default 50,000):
 * one more stops the read with a fatal problem at that line that names the cap, so a file
 * of millions of distinct codes cannot fill the server's memory. Codes already stored do
 * not count.
 */
import { loadConfig } from '../../api/config';
import { observationsChecksum, upload, uploadWorld, type UploadWorld } from '../api/upload-helpers';

describe('UPLOAD_MAX_NEW_DISTRICTS', () => {
  it('defaults to 50,000 and can be set', () => {
    expect(loadConfig({}).uploadMaxNewDistricts).toBe(50_000);
    expect(loadConfig({ UPLOAD_MAX_NEW_DISTRICTS: '1200' }).uploadMaxNewDistricts).toBe(1200);
    expect(() => loadConfig({ UPLOAD_MAX_NEW_DISTRICTS: '-1' })).toThrow(
      /UPLOAD_MAX_NEW_DISTRICTS must be a positive integer/,
    );
  });
});

/** A long-format file: the stored D01–D24 first, then `fresh` new codes, one row each. */
function file(fresh: number): string {
  const lines = ['district_code,district_name,indicator,year,value'];
  for (let d = 1; d <= 24; d++) lines.push(`D${String(d).padStart(2, '0')},,population,1999,1000`);
  for (let i = 1; i <= fresh; i++) lines.push(`N${i},New ${i},population,2020,1000`);
  return `${lines.join('\n')}\n`;
}

describe('a small cap (5) on an app', () => {
  let w: UploadWorld;
  let checksum: string;
  beforeAll(async () => {
    w = await uploadWorld({ uploadMaxNewDistricts: 5 });
    checksum = await observationsChecksum(w.t.db);
  });
  afterAll(async () => w.close());

  it('accepts five new codes beside 24 stored ones', async () => {
    const res = await upload(w.analyst, file(5), 'five-new.csv', { allowNewDistricts: true });
    expect(res.status).toBe(200);
    expect(res.body.preview.newDistricts).toHaveLength(5);
  });

  it('refuses the sixth new code as a fatal problem at its line, naming the cap, with and without commit', async () => {
    for (const commit of [false, true]) {
      const res = await upload(w.analyst, file(6), 'six-new.csv', { allowNewDistricts: true, commit });
      expect(res.status).toBe(422);
      // Line 1 is the header, 2–25 the stored districts, 26–31 the new ones: the sixth is on line 31.
      const problems = res.body.error.details.problems;
      expect(problems).toEqual([
        expect.objectContaining({
          line: 31,
          column: 1,
          field: 'district_code',
          code: 'too_many_new_districts',
          severity: 'error',
        }),
      ]);
      expect(res.body.error.message).toContain(
        'Line 31, column 1 (district_code): district N6 is new district number 6 in this file, over the cap of 5 new districts per upload (UPLOAD_MAX_NEW_DISTRICTS)',
      );
      expect(await observationsChecksum(w.t.db)).toBe(checksum);
    }
  });
});

describe('the default cap', () => {
  let w: UploadWorld;
  beforeAll(async () => {
    w = await uploadWorld();
  });
  afterAll(async () => w.close());

  it('stops at new district number 50,001', async () => {
    const res = await upload(w.analyst, file(50_001), 'fifty-thousand-and-one.csv', { allowNewDistricts: true });
    expect(res.status).toBe(422);
    expect(res.body.error.details.problems[0]).toMatchObject({
      line: 1 + 24 + 50_001,
      column: 1,
      code: 'too_many_new_districts',
    });
    expect(res.body.error.details.problems[0].reason).toContain('over the cap of 50,000 new districts per upload');
  });
});
