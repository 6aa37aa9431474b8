/**
 * CSV exports against formula injection (OWASP "CSV Injection"): every text cell quoted,
 * so a cell such as `x;=1+1;` stays one cell whichever separator the reader's locale
 * uses; a text cell beginning with = + - @, tab or carriage return neutralised with a
 * leading apostrophe; numbers written bare. Checked on the writer and on a real export.
 */
import { parse } from 'csv-parse/sync';
import { csvLine, escapeCsvText } from '../../api/http/csv-escape';
import { signedInApp, type SignedInApp } from '../support/signed-in-app';
import { copyDistrictSeries } from '../support/synthetic';

/** Names a spreadsheet would run as formulas, or split, if written as they are. */
const HOSTILE = [
  { code: 'Q01', name: 'x;=1+1;' },
  { code: 'Q02', name: '=HYPERLINK("http://example.invalid","click")' },
  { code: 'Q03', name: '+1+2' },
  { code: 'Q04', name: '-2+3' },
  { code: 'Q05', name: '@SUM(A1:A9)' },
  { code: 'Q06', name: '\t=1+1' },
  { code: 'Q07', name: '\r=1+1' },
];

/** The text a reader sees: the name with an apostrophe before a formula start (OWASP). */
const neutralised = (name: string) => (/^[=+\-@\t\r]/.test(name) ? `'${name}` : name);

/** RFC 4180 fields of one line, each with whether it was quoted (a small scanner). */
function fieldsOf(line: string): { value: string; quoted: boolean }[] {
  const out: { value: string; quoted: boolean }[] = [];
  let i = 0;
  for (;;) {
    if (line[i] === '"') {
      let value = '';
      i++;
      for (;;) {
        if (line[i] === '"' && line[i + 1] === '"') {
          value += '"';
          i += 2;
        } else if (line[i] === '"') break;
        else value += line[i++];
      }
      i++;
      out.push({ value, quoted: true });
    } else {
      const end = line.indexOf(',', i) === -1 ? line.length : line.indexOf(',', i);
      out.push({ value: line.slice(i, end), quoted: false });
      i = end;
    }
    if (i >= line.length) return out;
    i++; // the comma
  }
}

describe('the CSV writer', () => {
  it('quotes every text cell and prefixes a formula start with an apostrophe', () => {
    // Expected texts: OWASP CSV-injection guidance (quote every cell, prefix = + - @ tab CR with ').
    expect(escapeCsvText('Hollin Cross')).toBe('"Hollin Cross"');
    expect(escapeCsvText('x;=1+1;')).toBe('"x;=1+1;"');
    expect(escapeCsvText('=SUM(A1)')).toBe(`"'=SUM(A1)"`);
    expect(escapeCsvText('+1 555')).toBe(`"'+1 555"`);
    expect(escapeCsvText('-2')).toBe(`"'-2"`);
    expect(escapeCsvText('@cmd')).toBe(`"'@cmd"`);
    expect(escapeCsvText('\tx')).toBe(`"'\tx"`);
    expect(escapeCsvText('\rx')).toBe(`"'\rx"`);
    expect(escapeCsvText('a "b"')).toBe('"a ""b"""');
    // An ordinary text that merely contains a formula character later is left as it is.
    expect(escapeCsvText('a=b')).toBe('"a=b"');
  });

  it('writes numbers bare, negative ones included, and null as an empty cell', () => {
    // RFC 4180 §2: a field may be quoted; numbers are left unquoted so spreadsheets read them as numbers.
    expect(csvLine(['D01', -1.5, null, 2010, 1e-7])).toBe('"D01",-1.5,,2010,1e-7');
    expect(csvLine(['x;=1+1;', 3], ';')).toBe('"x;=1+1;";3');
    expect(() => csvLine([Number.NaN])).toThrow(/not a finite number/);
  });

  it('keeps a hostile text as one cell under either separator', () => {
    for (const h of HOSTILE) {
      for (const delimiter of [',', ';']) {
        // csv-parse reads a quoted field as one cell, as a spreadsheet does.
        const cells = parse(csvLine([h.code, h.name, 12.5], delimiter), { delimiter })[0] as string[];
        expect(cells).toEqual([h.code, neutralised(h.name), '12.5']);
      }
    }
  });
});

describe("a district's observations as CSV", () => {
  let s: SignedInApp;

  beforeAll(async () => {
    s = await signedInApp({ as: 'official' });
    for (const h of HOSTILE) {
      const [{ id }] = await s.t.db('districts').insert(h).returning('id');
      await copyDistrictSeries(s.t.db, 'D01', id);
    }
  });
  afterAll(async () => s?.close());

  it.each(HOSTILE)(
    'exports $code with its name as one neutralised text cell and its values as numbers',
    async ({ code, name }) => {
      const res = await s.agent.get(`/api/districts/${code}/observations.csv`);
      expect(res.status).toBe(200);
      const lines = res.text.split('\r\n').filter(Boolean);
      expect(lines[0].startsWith('"district_code","district_name","year",')).toBe(true);
      expect(lines.length).toBeGreaterThan(10);
      for (const line of lines.slice(1)) {
        const fields = fieldsOf(line);
        // Code and name are quoted text; the name reads back neutralised.
        expect(fields.slice(0, 2)).toEqual([
          { value: code, quoted: true },
          { value: neutralised(name), quoted: true },
        ]);
        // Year and values are bare numbers (empty where a year has no value).
        for (const f of fields.slice(2)) {
          expect(f.quoted).toBe(false);
          if (f.value !== '') expect(Number.isFinite(Number(f.value))).toBe(true);
        }
        // csv-parse agrees with the scanner; outside the quotes there is no ';' or '=' for a
        // reader in a ';' locale to split on or evaluate.
        expect(parse(line, { delimiter: ',' })[0]).toEqual(fields.map((f) => f.value));
        expect(
          fields
            .filter((f) => !f.quoted)
            .map((f) => f.value)
            .join(','),
        ).not.toMatch(/[;=@]/);
      }
    },
  );
});
