/**
 * Writing CSV for people who open it in a spreadsheet. A text cell that begins with
 * = + - @ (or a tab or carriage return) would be read as a formula there, so it is
 * prefixed with an apostrophe; cells with a delimiter, quote or line break are quoted.
 * Numbers are written as numbers (a negative number is not text and keeps its sign).
 */
const FORMULA_START = /^[=+\-@\t\r]/;

export function escapeCsvText(value: string, delimiter = ','): string {
  const safe = FORMULA_START.test(value) ? `'${value}` : value;
  if (safe.includes(delimiter) || /["\r\n]/.test(safe)) return `"${safe.replace(/"/g, '""')}"`;
  return safe;
}

export type CsvCell = string | number | null | undefined;

/** One CSV line (no line end): strings escaped as text, numbers as they are, null as empty. */
export function csvLine(cells: CsvCell[], delimiter = ','): string {
  return cells
    .map((c) => {
      if (c === null || c === undefined) return '';
      if (typeof c === 'number') {
        if (!Number.isFinite(c)) throw new Error(`not a finite number: ${c}`);
        return String(c);
      }
      return escapeCsvText(c, delimiter);
    })
    .join(delimiter);
}
