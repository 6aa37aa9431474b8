/**
 * The streaming reader on its own (no database): the staged rows and the problems must
 * not depend on where the file is cut into chunks — every fixture is read whole, in 7-byte
 * pieces and byte by byte, and the results compared.
 */
import fs from 'node:fs';
import path from 'node:path';
import { DEMO_INDICATORS } from '../../api/demo/catalogue';
import { UploadReader, type CatalogueEntry } from '../../api/uploads/parse/upload-reader';
import { ProblemList } from '../../api/uploads/problems';

const catalogue = new Map<string, CatalogueEntry>(
  DEMO_INDICATORS.map((i, k) => [
    i.code,
    { id: k + 1, code: i.code, derivation: 'none', mustBePositive: i.mustBePositive },
  ]),
);

function read(content: Buffer, chunk: number, decimalComma = false) {
  const problems = new ProblemList();
  const reader = new UploadReader({
    catalogue,
    options: { allowNewDistricts: false, decimalComma, changeFactor: 2 },
    currentYear: 2026,
    problems,
  });
  const out: Buffer[] = [];
  for (let i = 0; i < content.length; i += chunk) {
    const o = reader.push(content.subarray(i, i + chunk));
    if (o) out.push(Buffer.from(o));
  }
  const last = reader.end();
  if (last) out.push(Buffer.from(last));
  return { staged: Buffer.concat(out).toString('utf8'), problems: problems.sorted(), summary: reader.result() };
}

const root = path.resolve(__dirname, '..', '..');
const files = [
  ...fs
    .readdirSync(path.join(root, 'tests/fixtures/bad-csv'))
    .filter((f) => f.endsWith('.csv'))
    .map((f) => path.join('tests/fixtures/bad-csv', f)),
  'assets/demo-data/demo-long.csv',
  'assets/demo-data/demo-wide.csv',
];

describe('upload reader', () => {
  it.each(files)('reads %s the same whatever the chunk size', (f) => {
    const content = fs.readFileSync(path.join(root, f));
    const comma = f.includes('comma-option');
    const whole = read(content, content.length || 1, comma);
    expect(read(content, 7, comma)).toEqual(whole);
    expect(read(content, 1, comma)).toEqual(whole);
  });

  it('stages one COPY line per value with the line and column it came from', () => {
    const csv = Buffer.from('district_code;year;population;pop_density\r\nD01;2010;"1200";3,5\r\nD02;2011;;4\r\n');
    const r = read(csv, 5, true);
    expect(r.problems).toEqual([]);
    expect(r.staged).toBe('2\t3\tD01\t3\t2010\t1200\n2\t4\tD01\t4\t2010\t3.5\n3\t4\tD02\t4\t2011\t4\n');
    expect(r.summary).toMatchObject({
      format: 'wide',
      delimiter: ';',
      rowsRead: 2,
      values: 3,
      staged: 3,
      firstYear: 2010,
      lastYear: 2011,
    });
  });

  it('counts lines through quoted line breaks and CRLF', () => {
    const csv = Buffer.from(
      'district_code,district_name,indicator,year,value\r\nD40,"Two\r\nlines",population,2010,1\r\nD40,"Two\r\nlines",population,2011,x\r\n',
    );
    const r = read(csv, 3);
    expect(r.problems.map((p) => [p.code, p.line, p.column])).toEqual([
      ['bad_district_name', 2, 2],
      ['bad_district_name', 4, 2],
      ['not_a_number', 4, 5],
    ]);
  });
});
