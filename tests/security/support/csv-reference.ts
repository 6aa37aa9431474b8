/**
 * The independent reading of an accepted file: csv-parse (the reference CSV library) with
 * the delimiter the generator wrote, counting what a dry run's preview counts — data rows
 * (records after the header that are not all empty), and values (long: one a row; wide:
 * the non-empty cells of indicator columns).
 */
import { parse } from 'csv-parse/sync';

export interface ReferenceCounts {
  rowsRead: number;
  blankLines: number;
  values: number;
}

const NOT_INDICATORS = new Set(['district_code', 'district_name', 'year']);

export function referenceCounts(bytes: Buffer, delimiter: string, format: 'long' | 'wide'): ReferenceCounts {
  const records: string[][] = parse(bytes, {
    bom: true,
    delimiter,
    // The upload dialect: any of the three line ends, on any line (a file pieced together from two exports mixes them).
    record_delimiter: ['\r\n', '\n', '\r'],
    trim: true,
    relax_column_count: true,
    skip_empty_lines: false,
  });
  const blank = (r: string[]) => r.every((c) => c === '');
  const start = records.findIndex((r) => !blank(r));
  const header = records[start].map((c) =>
    c
      .trim()
      .toLowerCase()
      .replace(/[\s-]+/g, '_'),
  );
  const indicatorColumns = header.map((h, i) => (h !== '' && !NOT_INDICATORS.has(h) ? i : -1)).filter((i) => i >= 0);
  const counts: ReferenceCounts = { rowsRead: 0, blankLines: 0, values: 0 };
  for (const r of records.slice(start + 1)) {
    if (blank(r)) {
      counts.blankLines++;
      continue;
    }
    counts.rowsRead++;
    counts.values += format === 'long' ? 1 : indicatorColumns.filter((i) => (r[i] ?? '') !== '').length;
  }
  return counts;
}
