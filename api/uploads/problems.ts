/**
 * Problems found in an uploaded file: each names the line (1 = the header) and the column
 * (1-based field number) where there is one, a stable code, a reason a person can read,
 * and whether it blocks the commit (`error`) or only asks for a second look (`warning`).
 */
export type Severity = 'error' | 'warning';

export type ProblemCode =
  | 'empty_file'
  | 'header_only'
  | 'utf16'
  | 'binary_data'
  | 'invalid_utf8'
  | 'bad_header'
  | 'duplicate_column'
  | 'unknown_indicator'
  | 'derived_indicator'
  | 'ragged_row'
  | 'unclosed_quote'
  | 'stray_quote'
  | 'field_too_long'
  | 'cell_too_long'
  | 'too_many_new_districts'
  | 'empty_value'
  | 'not_a_number'
  | 'not_finite'
  | 'not_positive'
  | 'bad_year'
  | 'year_out_of_range'
  | 'year_in_future'
  | 'bad_district_code'
  | 'unknown_district'
  | 'bad_district_name'
  | 'district_name_conflict'
  | 'district_name_differs'
  | 'duplicate_key'
  | 'large_change'
  | 'derived_not_positive';

export interface Problem {
  line: number | null;
  column: number | null;
  /** The header name of the column, when there is one. */
  field: string | null;
  code: ProblemCode;
  severity: Severity;
  reason: string;
}

/** At most this many problems are listed; the counts always cover all of them. */
export const PROBLEM_LIST_CAP = 1000;

export class ProblemList {
  readonly items: Problem[] = [];
  errors = 0;
  warnings = 0;

  constructor(readonly cap = PROBLEM_LIST_CAP) {}

  /** Adds a problem; returns its index in `items`, or -1 when the list is full (it is still counted). */
  add(p: Omit<Problem, 'field' | 'severity'> & { field?: string | null; severity?: Severity }): number {
    const severity = p.severity ?? 'error';
    if (severity === 'error') this.errors++;
    else this.warnings++;
    if (this.items.length >= this.cap) return -1;
    this.items.push({
      ...p,
      reason: printable(p.reason),
      field: p.field == null ? null : printable(p.field),
      severity,
    });
    return this.items.length - 1;
  }

  /** Problems counted elsewhere (by a SQL query) of which only the first few were listed. */
  addCounted(listed: Problem[], total: number, severity: Severity): void {
    for (const p of listed) if (this.items.length < this.cap) this.items.push(p);
    if (severity === 'error') this.errors += Math.max(total, listed.length);
    else this.warnings += Math.max(total, listed.length);
  }

  get truncated(): boolean {
    return this.errors + this.warnings > this.items.length;
  }

  sorted(): Problem[] {
    return [...this.items].sort(
      // By line, then column; a problem of the whole line after those of its cells.
      (a, b) =>
        (a.line ?? 0) - (b.line ?? 0) ||
        (a.column ?? Infinity) - (b.column ?? Infinity) ||
        a.code.localeCompare(b.code),
    );
  }
}

/** Control characters from a file shown as \xNN: messages stay readable and JSON in PostgreSQL cannot hold NUL. */
export function printable(s: string): string {
  return s.replace(/[\u0000-\u001f\u007f]/g, (c) => `\\x${c.charCodeAt(0).toString(16).padStart(2, '0')}`);
}

/** "line 4, column 3 (year)" — the place a problem names, or '' when it has none. */
export function placeOf(p: Pick<Problem, 'line' | 'column' | 'field'>): string {
  const parts: string[] = [];
  if (p.line !== null) parts.push(`line ${p.line}`);
  if (p.column !== null) parts.push(`column ${p.column}${p.field ? ` (${p.field})` : ''}`);
  return parts.join(', ');
}

/** One sentence for an error message: the first error and how many more there are. */
export function summarise(problems: Problem[], errors: number, warnings: number): string {
  const first = problems.find((p) => p.severity === 'error') ?? problems[0];
  if (!first) return 'The file has no problems.';
  const place = placeOf(first);
  const more = errors - 1;
  const tail = [
    more > 0 ? `${more} more error${more === 1 ? '' : 's'}` : '',
    warnings ? `${warnings} warning${warnings === 1 ? '' : 's'}` : '',
  ]
    .filter(Boolean)
    .join(' and ');
  return `${place ? `${capitalise(place)}: ${first.reason}` : capitalise(first.reason)}${tail ? ` (and ${tail})` : ''}.`;
}

function capitalise(s: string): string {
  return s.charAt(0).toUpperCase() + s.slice(1);
}
