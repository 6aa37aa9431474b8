/**
 * Writing CSV for people who open it in a spreadsheet (OWASP "CSV Injection" guidance):
 *
 * - every text cell is quoted, so a delimiter inside it never splits it, whichever
 *   separator the reader's locale uses (`x;=1+1;` stays one cell where `;` separates);
 * - a text cell that begins with = + - @, a tab or a carriage return would be read as a
 *   formula, so it is prefixed with an apostrophe inside the quotes;
 * - numbers are written bare, as numbers (a negative number is not text and keeps its
 *   sign); null is an empty, unquoted cell.
 */
const FORMULA_START = /^[=+\-@\t\r]/;

/** One text cell, quoted, with a leading formula character neutralised. */
export function escapeCsvText(value: string): string {
  const safe = FORMULA_START.test(value) ? `'${value}` : value;
  return `"${safe.replace(/"/g, '""')}"`;
}

export type CsvCell = string | number | null | undefined;

/** One CSV line (no line end): strings quoted and escaped as text, numbers as they are, null as empty. */
export function csvLine(cells: CsvCell[], delimiter = ','): string {
  return cells
    .map((c) => {
      if (c === null || c === undefined) return '';
      if (typeof c === 'number') {
        if (!Number.isFinite(c)) throw new Error(`not a finite number: ${c}`);
        return String(c);
      }
      return escapeCsvText(c);
    })
    .join(delimiter);
}
