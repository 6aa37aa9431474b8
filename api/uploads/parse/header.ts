/**
 * The header decides the format: long (`district_code, indicator, year, value`) or wide
 * (`district_code, year, <indicator>…`), each with an optional `district_name`, columns in
 * any order. Names are compared after trimming, lower-casing and turning spaces and
 * hyphens into underscores, so `District code` and `district-code` both match.
 */
import type { ProblemList } from '../problems';

export type Format = 'long' | 'wide';

export interface IndicatorRef {
  id: number;
  code: string;
  derivation: string;
}

export interface HeaderLayout {
  format: Format;
  names: string[];
  /** 0-based field positions. */
  district: number;
  year: number;
  name: number | null;
  indicator: number | null;
  value: number | null;
  /** Wide format: field position → indicator (null for a column that failed its check). */
  valueColumns: { index: number; indicator: IndicatorRef | null }[];
  /** Number of fields a row must have (trailing empty header cells dropped). */
  width: number;
}

export const LONG_COLUMNS = ['district_code', 'indicator', 'year', 'value'] as const;
export const NAME_COLUMN = 'district_name';

export function normaliseName(raw: string): string {
  return raw
    .trim()
    .toLowerCase()
    .replace(/[\s-]+/g, '_');
}

/** Reads the header; problems go to `problems`. Returns null when the file cannot be read on. */
export function readHeader(
  fields: string[],
  line: number,
  catalogue: Map<string, IndicatorRef>,
  problems: ProblemList,
): HeaderLayout | null {
  let width = fields.length;
  while (width > 1 && fields[width - 1].trim() === '') width--;
  const names = fields.slice(0, width).map(normaliseName);
  const at = new Map<string, number>();
  let ok = true;
  names.forEach((n, i) => {
    if (n === '') {
      problems.add({ line, column: i + 1, code: 'bad_header', reason: 'a column without a name in the header' });
      ok = false;
    } else if (at.has(n)) {
      problems.add({
        line,
        column: i + 1,
        field: n,
        code: 'duplicate_column',
        reason: `column "${n}" appears twice in the header (also column ${at.get(n)! + 1})`,
      });
      ok = false;
    } else {
      at.set(n, i);
    }
  });
  const expected =
    'the header must be district_code, indicator, year, value (long format) or district_code, year and one column per indicator (wide format), with an optional district_name';
  const district = at.get('district_code');
  const year = at.get('year');
  if (district === undefined || year === undefined) {
    const missing = [district === undefined ? 'district_code' : null, year === undefined ? 'year' : null]
      .filter(Boolean)
      .join(' and ');
    problems.add({
      line,
      column: null,
      code: 'bad_header',
      reason: `no ${missing} column: ${expected}; found ${names.map((n) => `"${n}"`).join(', ')}`,
    });
    return null;
  }
  const name = at.get(NAME_COLUMN) ?? null;
  const indicator = at.get('indicator');
  const value = at.get('value');
  if (indicator !== undefined || value !== undefined) {
    if (indicator === undefined || value === undefined) {
      problems.add({
        line,
        column: null,
        code: 'bad_header',
        reason: `a long-format header needs both an indicator and a value column: ${expected}`,
      });
      return null;
    }
    const known = new Set<string>([...LONG_COLUMNS, NAME_COLUMN]);
    names.forEach((n, i) => {
      if (n !== '' && !known.has(n)) {
        problems.add({
          line,
          column: i + 1,
          field: n,
          code: 'bad_header',
          reason: `unexpected column "${n}" in a long-format file (expected ${LONG_COLUMNS.join(', ')} and optionally ${NAME_COLUMN})`,
        });
        ok = false;
      }
    });
    if (!ok) return null;
    return { format: 'long', names, district, year, name, indicator, value, valueColumns: [], width };
  }
  const valueColumns: HeaderLayout['valueColumns'] = [];
  names.forEach((n, i) => {
    if (i === district || i === year || i === name || n === '') return;
    const ref = catalogue.get(n);
    if (!ref) {
      problems.add({
        line,
        column: i + 1,
        field: n,
        code: 'unknown_indicator',
        reason: `"${n}" is not an indicator in the catalogue`,
      });
    } else if (ref.derivation !== 'none') {
      problems.add({ line, column: i + 1, field: n, code: 'derived_indicator', reason: derivedReason(n) });
    }
    valueColumns.push({ index: i, indicator: ref && ref.derivation === 'none' ? ref : null });
  });
  if (!ok) return null;
  if (valueColumns.length === 0) {
    problems.add({
      line,
      column: null,
      code: 'bad_header',
      reason: `a wide-format header needs at least one indicator column: ${expected}`,
    });
    return null;
  }
  return { format: 'wide', names, district, year, name, indicator: null, value: null, valueColumns, width };
}

export function derivedReason(code: string): string {
  return `"${code}" is a derived indicator: it is computed from its sources on load, so upload the sources instead`;
}

/** The delimiter of a header line: the most frequent of ; , and tab outside quotes (comma on a tie). */
export function detectDelimiter(headerLine: string): number {
  let inQuotes = false;
  const counts = { ';': 0, ',': 0, '\t': 0 };
  for (const ch of headerLine) {
    if (ch === '"') inQuotes = !inQuotes;
    else if (!inQuotes && ch in counts) counts[ch as keyof typeof counts]++;
  }
  const best = (Object.entries(counts) as [string, number][]).sort(
    (a, b) => b[1] - a[1] || (a[0] === ',' ? -1 : b[0] === ',' ? 1 : 0),
  )[0];
  return (best[1] > 0 ? best[0] : ',').charCodeAt(0);
}
