/**
 * What the reader counts that a hostile file could make unbounded: codes of unknown
 * (or derived) indicators, kept for the problem list up to a cap, and new district codes,
 * refused past UPLOAD_MAX_NEW_DISTRICTS.
 */
import type { TokenizerProblem } from './csv-bytes';
import { clip } from './values';

interface Place {
  line: number;
  column: number;
  count: number;
}

/** Distinct codes kept for the problem list; rows naming others are counted in one problem. */
export const MAX_LISTED_CODES = 1000;

/** Rows per code (first place kept), for the codes a file names that the catalogue refuses. */
export class CodeTally {
  private readonly codes = new Map<string, Place>();
  private beyondCap: Place | null = null;

  add(code: string, line: number, column: number): void {
    const key = code.length > 64 ? `${code.slice(0, 64)}…` : code;
    const entry = this.codes.get(key);
    if (entry) entry.count++;
    else if (this.codes.size < MAX_LISTED_CODES) this.codes.set(key, { line, column, count: 1 });
    else if (this.beyondCap) this.beyondCap.count++;
    else this.beyondCap = { line, column, count: 1 };
  }

  /** One problem per listed code (`reason` of the code), and one for the rows beyond the cap. */
  problems(
    code: 'unknown_indicator' | 'derived_indicator',
    reason: (code: string) => string,
  ): (TokenizerProblem & { field: string })[] {
    const times = (n: number) => (n > 1 ? ` (${n.toLocaleString('en')} rows)` : '');
    const out = [...this.codes].map(([c, e]) => ({
      line: e.line,
      column: e.column,
      field: 'indicator',
      code,
      reason: `${reason(c)}${times(e.count)}`,
    }));
    const more = this.beyondCap;
    if (more) {
      out.push({
        line: more.line,
        column: more.column,
        field: 'indicator',
        code,
        reason: `${more.count.toLocaleString('en')} more row${more.count === 1 ? '' : 's'} name other such indicators (only the first ${MAX_LISTED_CODES.toLocaleString('en')} distinct codes are listed)`,
      });
    }
    return out;
  }
}

const NO_DISTRICTS: ReadonlySet<string> = new Set();

/** Counts the district codes of a file that are not stored; no cap when `cap` is undefined. */
export class NewDistrictCap {
  private count = 0;

  constructor(
    private readonly known: ReadonlySet<string> = NO_DISTRICTS,
    private readonly cap: number | undefined = undefined,
  ) {}

  /** Call once per code first seen in the file: the fatal problem when it is one new district too many, else null. */
  admit(code: string, line: number, column: number): TokenizerProblem | null {
    const cap = this.cap;
    if (cap === undefined || this.known.has(code) || ++this.count <= cap) return null;
    return {
      line,
      column,
      code: 'too_many_new_districts',
      reason:
        `district ${clip(code)} is new district number ${(cap + 1).toLocaleString('en')} in this file, over the cap of ` +
        `${cap.toLocaleString('en')} new districts per upload (UPLOAD_MAX_NEW_DISTRICTS): split the file`,
    };
  }
}
