/**
 * Turns an uploaded CSV (bytes, in chunks) into staging rows for COPY, checking every row
 * on the way: the header, the row shape, numbers, years, codes, positive values, duplicate
 * keys inside the file. It holds the current chunk, the districts seen and one number per
 * key (for duplicates), never the file.
 *
 * Staging rows are COPY text lines `line, col, district, indicator_id, year, value`. A row
 * with a problem is not staged; the problems say why. Checks that need the stored data
 * (new districts, changes against stored values, derived series) run in SQL afterwards.
 */
import type { ProblemList } from '../problems';
import * as cells from './cells';
import { CsvByteTokenizer, fieldText, type RecordSink, type RecordView, type TokenizerProblem } from './csv-bytes';
import { derivedReason, detectDelimiter, readHeader, type HeaderLayout } from './header';
import { KeySet } from './key-set';
import { CodeTally, NewDistrictCap } from './tallies';
import type { CatalogueEntry, DistrictSeen, DuplicateRef, ReaderContext, ReadSummary } from './read-summary';
import {
  checkDistrictCode,
  checkDistrictName,
  checkNumber,
  checkYear,
  clip,
  MAX_YEAR as MAX_Y,
  MIN_YEAR as MIN_Y,
} from './values';

// Module-local bindings for the per-cell hot path (imported bindings are getters under tsx).
const { bytesEqual, scanNumber, scanYear, OutBuffer } = cells;
const MIN_YEAR = MIN_Y;
const MAX_YEAR = MAX_Y;
const POSITIVE = cells.NumberKind.Positive;
const ZERO_KIND = cells.NumberKind.Zero;
const NEGATIVE = cells.NumberKind.Negative;
const INVALID = cells.NumberKind.Invalid;
const SLOW = cells.NumberKind.Slow;

export type { CatalogueEntry, DistrictSeen, DuplicateRef, ReaderContext, ReadSummary } from './read-summary';

type Seen = DistrictSeen & { index: number; bytes: Buffer; keys: number };

const TAB = 9;
const LF = 10;

export class UploadReader implements RecordSink {
  private tokenizer: CsvByteTokenizer | null = null;
  private head: Buffer[] = [];
  private headBytes = 0;
  /** The first bytes, held until there are three to look for a byte-order mark (null once decided). */
  private lead: Buffer | null = Buffer.alloc(0);
  private layout: HeaderLayout | null = null;
  private readonly out: cells.OutBuffer = new OutBuffer();
  private readonly districts = new Map<string, Seen>();
  private readonly keys: KeySet;
  private readonly unknownIndicators = new CodeTally();
  private readonly derivedSeen = new CodeTally();
  private readonly indicatorIndex = new Map<number, number>();
  private readonly nameConflicts = new Set<string>();
  private readonly newDistricts: NewDistrictCap;
  /** Duplicates listed in the problems, to be told the line of their first occurrence. */
  readonly duplicates: DuplicateRef[] = [];
  private lastDistrict: Seen | null = null;
  private lastName: Buffer | null = null;
  private lastIndicatorBytes: Buffer | null = null;
  private lastIndicator: CatalogueEntry | null = null;
  private readonly problems: ProblemList;
  private readonly summary: ReadSummary = {
    format: null,
    delimiter: null,
    rowsRead: 0,
    blankLines: 0,
    values: 0,
    staged: 0,
    districts: [],
    firstYear: null,
    lastYear: null,
    fatal: false,
    columns: null,
  };

  constructor(private readonly ctx: ReaderContext) {
    this.problems = ctx.problems;
    let k = 0;
    for (const ref of ctx.catalogue.values()) this.indicatorIndex.set(ref.id, k++);
    this.keys = new KeySet(k);
    this.newDistricts = new NewDistrictCap(ctx.knownDistricts, ctx.maxNewDistricts);
  }

  /** Feed a chunk of the file; returns COPY text for the rows it completed. */
  push(chunk: Buffer): Buffer | null {
    if (this.summary.fatal) return null;
    if (this.lead !== null) {
      const all = this.lead.length ? Buffer.concat([this.lead, chunk]) : chunk;
      if (all.length < 3) {
        this.lead = Buffer.from(all);
        return null;
      }
      this.lead = null;
      const rest = this.byteOrderMark(all);
      if (!rest) return null;
      chunk = rest;
    }
    this.feed(chunk);
    return this.out.take();
  }

  /** The bytes after a UTF-8 byte-order mark; null (and a problem) for UTF-16. */
  private byteOrderMark(b: Buffer): Buffer | null {
    if ((b[0] === 0xff && b[1] === 0xfe) || (b[0] === 0xfe && b[1] === 0xff)) {
      this.stop({
        line: 1,
        column: null,
        code: 'utf16',
        reason: 'the file is UTF-16 encoded: save it as UTF-8 (with or without BOM)',
      });
      return null;
    }
    return b[0] === 0xef && b[1] === 0xbb && b[2] === 0xbf ? b.subarray(3) : b;
  }

  private feed(chunk: Buffer): void {
    if (this.tokenizer) this.tokenizer.write(chunk);
    else this.holdHead(chunk, false);
  }

  /** End of file: returns the last COPY text; `result()` is complete after this. */
  end(): Buffer | null {
    if (this.lead !== null && this.lead.length && !this.summary.fatal) {
      const rest = this.byteOrderMark(this.lead);
      if (rest) this.feed(rest);
    }
    this.lead = null;
    if (!this.summary.fatal) {
      if (!this.tokenizer && this.headBytes > 0) this.holdHead(Buffer.alloc(0), true);
      this.tokenizer?.end();
      this.finish();
    }
    return this.out.take();
  }

  /** Data rows and values read so far (for progress while the file is read). */
  get rowsSoFar(): number {
    return this.summary.rowsRead;
  }

  get valuesSoFar(): number {
    return this.summary.values;
  }

  result(): ReadSummary {
    this.summary.districts = [...this.districts.values()].map(({ index: _i, bytes: _b, keys: _k, ...d }) => d);
    return this.summary;
  }

  /** Hold bytes until the first line end, to choose the delimiter from the header. */
  private holdHead(chunk: Buffer, atEnd: boolean): void {
    this.head.push(chunk);
    this.headBytes += chunk.length;
    const broke = chunk.indexOf(LF) >= 0 || chunk.indexOf(13) >= 0;
    if (!broke && !atEnd && this.headBytes < 64 * 1024) return;
    const all = Buffer.concat(this.head);
    let cut = all.indexOf(LF);
    const cr = all.indexOf(13);
    if (cr >= 0 && (cut < 0 || cr < cut)) cut = cr;
    const firstLine = all.toString('utf8', 0, cut < 0 ? all.length : cut);
    const delimiter = detectDelimiter(firstLine);
    this.summary.delimiter = String.fromCharCode(delimiter);
    this.tokenizer = new CsvByteTokenizer(delimiter, this);
    this.head = [];
    this.tokenizer.write(all);
  }

  private stop(p: TokenizerProblem): void {
    this.summary.fatal = true;
    this.problems.add({ ...p, field: this.fieldName(p.column) });
    if (this.tokenizer) this.tokenizer.stopped = true;
  }

  private fieldName(column: number | null): string | null {
    if (column === null || !this.layout) return null;
    return this.layout.names[column - 1] ?? null;
  }

  problem(p: TokenizerProblem, fatal: boolean): void {
    if (fatal) this.stop(p);
    else this.problems.add({ ...p, field: this.fieldName(p.column) });
  }

  record(r: RecordView): void {
    if (this.summary.fatal) return;
    if (isBlank(r)) {
      if (this.layout) this.summary.blankLines++;
      return;
    }
    const L = this.layout;
    if (!L) {
      const names = Array.from({ length: r.count }, (_, i) => fieldText(r, i));
      const layout = readHeader(names, r.line, this.ctx.catalogue, this.problems);
      if (!layout) {
        this.summary.fatal = true;
        if (this.tokenizer) this.tokenizer.stopped = true;
        return;
      }
      this.layout = layout;
      this.summary.format = layout.format;
      this.summary.columns = {
        district: layout.district + 1,
        name: layout.name === null ? null : layout.name + 1,
        names: layout.names,
      };
      return;
    }
    this.summary.rowsRead++;
    if (r.count !== L.width && !(r.count > L.width && extrasEmpty(r, L.width))) {
      const column = r.count < L.width ? r.count + 1 : L.width + 1;
      this.problems.add({
        line: r.line,
        column,
        field: this.fieldName(column),
        code: 'ragged_row',
        reason: `the row has ${r.count} field${r.count === 1 ? '' : 's'} where the header has ${L.width}`,
      });
      return;
    }
    const district = this.district(r);
    if (this.summary.fatal) return;
    const year = this.year(r, L.year);
    if (L.format === 'long') {
      this.summary.values++;
      const ref = this.indicator(r, L.indicator!);
      this.value(r, L.value!, district, ref, year);
    } else {
      for (const { index, indicator } of L.valueColumns) {
        if (r.start[index] === r.end[index] && r.flags[index] !== 3) continue; // a gap in a wide file
        this.summary.values++;
        this.value(r, index, district, indicator as CatalogueEntry | null, year);
      }
    }
  }

  private year(r: RecordView, i: number): number {
    const y = r.flags[i] <= 1 ? scanYear(r.buf, r.start[i], r.end[i]) : -1;
    if (y >= MIN_YEAR && y <= MAX_YEAR && y <= this.ctx.currentYear) return y;
    const checked = checkYear(fieldText(r, i), this.ctx.currentYear);
    if (checked.ok) return checked.value;
    this.cellProblem(r.line, i, checked);
    return -1;
  }

  private district(r: RecordView): Seen | null {
    const L = this.layout!;
    const i = L.district;
    const b = r.buf;
    const last = this.lastDistrict;
    if (last && r.flags[i] <= 1 && bytesEqual(b, r.start[i], r.end[i], last.bytes)) {
      if (L.name === null || bytesEqual(b, r.start[L.name], r.end[L.name], this.lastName)) {
        last.rows++;
        return last;
      }
    }
    const code = checkDistrictCode(fieldText(r, i));
    if (!code.ok) {
      this.cellProblem(r.line, i, code);
      this.lastDistrict = null;
      return null;
    }
    let seen = this.districts.get(code.value);
    if (!seen) {
      const tooMany = this.newDistricts.admit(code.value, r.line, i + 1);
      if (tooMany) {
        this.stop(tooMany);
        return null;
      }
      seen = {
        code: code.value,
        firstLine: r.line,
        rows: 0,
        name: null,
        nameLine: null,
        nameRefused: false,
        index: this.districts.size,
        bytes: Buffer.from(code.value, 'latin1'),
        keys: this.keys.newDistrict(),
      };
      this.districts.set(code.value, seen);
    }
    seen.rows++;
    this.lastDistrict = seen;
    this.lastName = null;
    if (L.name !== null) {
      this.lastName = Buffer.from(r.buf.subarray(r.start[L.name], r.end[L.name]));
      const raw = fieldText(r, L.name);
      if (raw !== '') this.districtName(seen, raw, r.line, L);
    }
    return seen;
  }

  private districtName(seen: Seen, raw: string, line: number, L: HeaderLayout): void {
    const name = checkDistrictName(raw);
    if (!name.ok) {
      this.cellProblem(line, L.name!, name);
      seen.nameRefused = true;
      this.lastDistrict = null;
    } else if (seen.name === null) {
      seen.name = name.value;
      seen.nameLine = line;
    } else if (seen.name !== name.value && !this.nameConflicts.has(seen.code)) {
      this.nameConflicts.add(seen.code);
      this.problems.add({
        line,
        column: L.name! + 1,
        field: L.names[L.name!],
        code: 'district_name_conflict',
        reason: `district ${seen.code} is named "${clip(name.value)}" here but "${clip(seen.name)}" on line ${seen.nameLine}`,
      });
    }
  }

  private indicator(r: RecordView, i: number): CatalogueEntry | null {
    if (r.flags[i] <= 1 && bytesEqual(r.buf, r.start[i], r.end[i], this.lastIndicatorBytes)) {
      if (this.lastIndicator) return this.lastIndicator;
    }
    const code = fieldText(r, i).trim().toLowerCase();
    const ref = this.ctx.catalogue.get(code);
    if (ref && ref.derivation === 'none') {
      this.lastIndicatorBytes = Buffer.from(r.buf.subarray(r.start[i], r.end[i]));
      this.lastIndicator = ref as CatalogueEntry;
      return this.lastIndicator;
    }
    this.lastIndicatorBytes = null;
    (ref ? this.derivedSeen : this.unknownIndicators).add(code, r.line, i + 1);
    return null;
  }

  private value(r: RecordView, i: number, d: Seen | null, ref: CatalogueEntry | null, year: number): void {
    const b = r.buf;
    const s = r.start[i];
    const e = r.end[i];
    const comma = this.ctx.options.decimalComma;
    let kind: number = r.flags[i] <= 1 ? scanNumber(b, s, e, comma) : INVALID;
    let text: string | null = null;
    if (kind === INVALID || kind === SLOW) {
      const raw = fieldText(r, i);
      const checked = checkNumber(raw, comma);
      if (!checked.ok) {
        this.cellProblem(r.line, i, checked);
        return;
      }
      text = checked.text!;
      kind = checked.value > 0 ? POSITIVE : checked.value === 0 ? ZERO_KIND : NEGATIVE;
    }
    if (!d || !ref || year < 0) return;
    if (ref.mustBePositive && kind !== POSITIVE) {
      this.problems.add({
        line: r.line,
        column: i + 1,
        field: this.fieldName(i + 1),
        code: 'not_positive',
        reason: `${ref.code} must be positive (its logarithm is taken) but the value is ${clip(fieldText(r, i))}`,
      });
      return;
    }
    if (!this.keys.add(d.keys, this.indicatorIndex.get(ref.id)!, year - MIN_YEAR)) {
      const listed = this.problems.add({
        line: r.line,
        column: i + 1,
        field: this.fieldName(i + 1),
        code: 'duplicate_key',
        reason: `${d.code} ${ref.code} ${year} is given twice`,
      });
      if (listed >= 0) this.duplicates.push({ problemIndex: listed, district: d.code, indicatorId: ref.id, year });
      return;
    }
    const sum = this.summary;
    if (sum.firstYear === null || year < sum.firstYear) sum.firstYear = year;
    if (sum.lastYear === null || year > sum.lastYear) sum.lastYear = year;
    sum.staged++;
    const out = this.out;
    out.int(r.line);
    out.byte(TAB);
    out.int(i + 1);
    out.byte(TAB);
    out.bytes(d.bytes, 0, d.bytes.length);
    out.byte(TAB);
    out.int(ref.id);
    out.byte(TAB);
    out.int(year);
    out.byte(TAB);
    if (text !== null) out.ascii(text);
    else out.bytes(b, s, e, comma);
    out.byte(LF);
  }

  private cellProblem(line: number, index: number, c: { code: TokenizerProblem['code']; reason: string }): void {
    this.problems.add({ line, column: index + 1, field: this.fieldName(index + 1), code: c.code, reason: c.reason });
  }

  private finish(): void {
    if (this.summary.fatal) return;
    if (!this.layout) {
      this.problems.add({ line: null, column: null, code: 'empty_file', reason: 'the file is empty' });
      this.summary.fatal = true;
      return;
    }
    if (this.summary.rowsRead === 0) {
      this.problems.add({
        line: 1,
        column: null,
        code: 'header_only',
        reason: 'the file has a header but no data rows',
      });
      this.summary.fatal = true;
      return;
    }
    for (const p of this.unknownIndicators.problems(
      'unknown_indicator',
      (c) => `"${clip(c)}" is not an indicator in the catalogue`,
    ))
      this.problems.add(p);
    for (const p of this.derivedSeen.problems('derived_indicator', derivedReason)) this.problems.add(p);
  }
}

function isBlank(r: RecordView): boolean {
  for (let i = 0; i < r.count; i++) if (r.end[i] > r.start[i]) return false;
  return true;
}

function extrasEmpty(r: RecordView, from: number): boolean {
  for (let i = from; i < r.count; i++) if (r.end[i] > r.start[i]) return false;
  return true;
}
