/**
 * The hostile-input corpus: 207 seeded files of at most 1 MB (tests/security/support/
 * csv-fuzz-corpus.ts), each sent as a dry run to one app over one database. Every file is
 * either refused with a 4xx whose first error names a line and a column, or accepted with
 * the counts csv-parse reads from the same bytes; never a 5xx. After every refusal the
 * observations are unchanged (every fourth refused file is also sent with ?commit=true) and
 * after every file the server still answers /api/health.
 */
import { fuzzFile, KINDS, MAX_FUZZ_BYTES, type FuzzFile } from './support/csv-fuzz-corpus';
import { referenceCounts } from './support/csv-reference';
import { observationsChecksum, upload, uploadWorld, type UploadWorld } from '../api/upload-helpers';

const SEED = 20261204;
const COUNT = 23 * KINDS.length; // 207 files, 23 of each kind
/** Files in flight at once: the server's and PostgreSQL's work overlap (dry runs never write, so the checks stay exact). */
const IN_FLIGHT = 2;

/**
 * Problems of the whole file rather than of a place in it: the first error may name no
 * column (or no line) only when it is one of these.
 */
const WHOLE_FILE = new Set(['empty_file', 'header_only', 'bad_header', 'utf16']);

let w: UploadWorld;
let checksum: string;
/** Refusals whose first error names no line or no column. */
const wholeFile: string[] = [];
const benignRefusals: string[] = [];
const seen = { accepted: 0, refused: 0 };

beforeAll(async () => {
  w = await uploadWorld();
  checksum = await observationsChecksum(w.t.db);
});
afterAll(async () => {
  await w?.close();
});

async function healthy(): Promise<void> {
  const res = await w.official.get('/api/health');
  expect(res.status).toBe(200);
}

async function check(f: FuzzFile, index: number): Promise<void> {
  expect(f.bytes.length).toBeLessThanOrEqual(MAX_FUZZ_BYTES);
  const res = await upload(w.analyst, f.bytes, f.name, { allowNewDistricts: true, decimalComma: f.decimalComma });
  if (res.status === 200) {
    seen.accepted++;
    // The generator's own delimiter and format, and csv-parse's reading of the bytes.
    const ref = referenceCounts(f.bytes, f.delimiter, f.format);
    const p = res.body.preview;
    expect({
      name: f.name,
      format: p.format,
      delimiter: p.delimiter,
      rowsRead: p.rowsRead,
      blankLines: p.blankLines,
      values: p.values,
    }).toEqual({
      name: f.name,
      format: f.format,
      delimiter: f.delimiter,
      ...ref,
    });
    expect(p.totals.insert + p.totals.change + p.totals.unchanged).toBe(ref.values);
  } else {
    seen.refused++;
    if (f.kind === 'benign') benignRefusals.push(`${f.name}: ${res.body.error.message}`);
    expect([f.name, res.status >= 400 && res.status < 500]).toEqual([f.name, true]);
    const first = (res.body.error.details?.problems ?? []).find((q: { severity: string }) => q.severity === 'error');
    expect(first).toBeDefined();
    if (first.line === null || first.column === null) wholeFile.push(`${f.name}: ${first.code}`);
    if (!WHOLE_FILE.has(first.code)) {
      expect([f.name, first.code, typeof first.line, typeof first.column]).toEqual([
        f.name,
        first.code,
        'number',
        'number',
      ]);
      expect(res.body.error.message).toContain(`ine ${first.line}, column ${first.column}`);
    }
    if (index % 4 === 0) {
      const again = await upload(w.analyst, f.bytes, f.name, {
        allowNewDistricts: true,
        decimalComma: f.decimalComma,
        commit: true,
      });
      expect([f.name, again.status]).toEqual([f.name, res.status]);
    }
    expect(await observationsChecksum(w.t.db)).toBe(checksum);
  }
  await healthy();
}

describe('a seeded corpus of hostile CSV files', () => {
  it('generates the same bytes from the same seed, at most 1 MB each, every kind represented', () => {
    const a = fuzzFile(SEED, 17);
    const b = fuzzFile(SEED, 17);
    expect(a.bytes.equals(b.bytes)).toBe(true);
    expect(fuzzFile(SEED + 1, 17).bytes.equals(a.bytes)).toBe(false);
    expect(COUNT).toBeGreaterThanOrEqual(200);
  });

  // One test over the whole corpus (one app, one database) keeps the run short; each
  // failure names its file.
  it(`answers each of the ${COUNT} files with a located 4xx or the reference counts, and stays up`, async () => {
    let next = 0;
    const lane = async () => {
      for (let i = next++; i < COUNT; i = next++) await check(fuzzFile(SEED, i), i);
    };
    await Promise.all(Array.from({ length: IN_FLIGHT }, lane));
    // The corpus exercises both paths, and every well-formed file is accepted (with csv-parse's counts).
    expect(seen.accepted).toBeGreaterThan(0);
    expect(seen.refused).toBeGreaterThan(COUNT / 2);
    expect(benignRefusals).toEqual([]);
    // Refusals without a place (a UTF-16 file, a header cut short) stay the exception.
    expect(wholeFile.length).toBeLessThan(COUNT / 10);
  }, 240_000);
});
