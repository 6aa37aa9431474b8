/**
 * A streaming CSV tokenizer over bytes (RFC 4180 plus the habits of spreadsheet exports):
 * quoted fields with doubled quotes, CRLF, LF or CR line ends, spaces around unquoted
 * fields trimmed. It hands each record over as byte ranges into the chunk, so a field
 * becomes a string only when the reader asks for one — a million-row file tokenizes in a
 * fraction of the time psql's COPY takes (csv-parse alone needs about 2 s for one here).
 *
 * Splitting bytes is safe for UTF-8: no byte of a multi-byte character equals a quote,
 * a delimiter or a line end. Validity is checked per chunk with buffer.isUtf8 and only
 * in a chunk that fails, field by field, to name the place.
 */
import { isUtf8 } from 'node:buffer';
import type { Problem } from '../problems';

export type TokenizerProblem = Pick<Problem, 'line' | 'column' | 'code' | 'reason'>;

/** One record: fields as byte ranges of `buf` (quotes excluded). */
export interface RecordView {
  buf: Buffer;
  count: number;
  start: Int32Array;
  end: Int32Array;
  /** 0 plain, 1 quoted, 2 quoted with doubled quotes inside, 3 broken quoting. */
  flags: Uint8Array;
  /** The line the record starts on (1-based). */
  line: number;
}

export interface RecordSink {
  record(r: RecordView): void;
  problem(p: TokenizerProblem, fatal: boolean): void;
}

const QUOTE = 34;
const LF = 10;
const CR = 13;
const SPACE = 32;
const TAB = 9;
const EMPTY = Buffer.alloc(0);

/**
 * The longest field, quoted or not: a quoted field that runs on past it is taken for an
 * unclosed quote, an unquoted one stops the read where it passes the cap (no cell of an
 * upload is anywhere near this long; the cell checks cap each kind far below it).
 */
export const MAX_FIELD_BYTES = 10_000;
/** A record longer than this stops the read. */
const MAX_RECORD_BYTES = 1 << 20;
const MAX_FIELDS = 4096;
/** After this many lines with control characters or broken UTF-8 the file is taken for binary data. */
const BINARY_LIMIT = 20;

/** Text of field i: UTF-8, doubled quotes undone. */
export function fieldText(r: RecordView, i: number): string {
  const t = r.buf.toString('utf8', r.start[i], r.end[i]);
  return r.flags[i] === 2 ? t.replace(/""/g, '"') : t;
}

export class CsvByteTokenizer {
  private pending: Buffer = EMPTY;
  private work: Buffer = EMPTY;
  private line = 1;
  private view: RecordView = {
    buf: EMPTY,
    count: 0,
    start: new Int32Array(64),
    end: new Int32Array(64),
    flags: new Uint8Array(64),
    line: 1,
  };
  private recordProblems: TokenizerProblem[] = [];
  private badLines = 0;
  private validUpTo = 0;
  private openQuote: { line: number; column: number } | null = null;
  /** Where the field being read starts (line, 1-based column), for a record cut off by the record cap. */
  private atLine = 1;
  private atColumn = 1;
  stopped = false;

  constructor(
    private readonly delimiter: number,
    private readonly sink: RecordSink,
  ) {}

  write(chunk: Buffer): void {
    if (this.stopped) return;
    if (this.pending.length === 0) {
      this.scan(chunk, false);
      return;
    }
    // The unfinished record and the new chunk, end to end, in a working buffer kept from
    // chunk to chunk (a fresh one per chunk left 50 MB of garbage per 50 MB file). Nothing
    // outside keeps a view into it: the reader copies what it keeps.
    const need = this.pending.length + chunk.length;
    let work = this.work;
    if (work.length < need) work = Buffer.allocUnsafe(Math.max(need, 2 * work.length, 1 << 19));
    this.pending.copy(work, 0); // may overlap when it lies in `work`: Buffer#copy moves like memmove
    chunk.copy(work, this.pending.length);
    this.work = work;
    this.scan(work.subarray(0, need), false);
  }

  end(): void {
    if (this.stopped) return;
    const buf = this.pending;
    this.pending = EMPTY;
    if (buf.length) this.scan(buf, true);
  }

  private scan(buf: Buffer, eof: boolean): void {
    // Bytes up to the last line end are whole characters: check them in one call.
    const lastBreak = eof ? buf.length - 1 : Math.max(buf.lastIndexOf(LF), buf.lastIndexOf(CR));
    this.validUpTo = lastBreak >= 0 && isUtf8(buf.subarray(0, lastBreak + 1)) ? lastBreak + 1 : 0;
    let p = 0;
    while (!this.stopped && p < buf.length) {
      const next = this.record(buf, p, eof);
      if (next < 0) break;
      p = next;
    }
    if (this.stopped) return;
    this.pending = p < buf.length ? buf.subarray(p) : EMPTY;
    if (this.pending.length > MAX_RECORD_BYTES) {
      const q = this.openQuote;
      this.fatal(
        q
          ? {
              line: q.line,
              column: q.column,
              code: 'unclosed_quote',
              reason: 'the quote opened here is never closed (the field runs on past 1 MB)',
            }
          : { line: this.atLine, column: this.atColumn, code: 'field_too_long', reason: 'a line runs on past 1 MB' },
      );
    }
  }

  /** Reads one record starting at p0; returns where the next one starts, or -1 when incomplete. */
  private record(b: Buffer, p0: number, eof: boolean): number {
    const n = b.length;
    const delim = this.delimiter;
    const v = this.view;
    let p = p0;
    let line = this.line;
    let count = 0;
    this.recordProblems.length = 0;
    this.openQuote = null;
    for (;;) {
      this.atLine = line;
      this.atColumn = count + 1;
      while (p < n && (b[p] === SPACE || (b[p] === TAB && delim !== TAB))) p++;
      if (p >= n) {
        if (!eof) return -1;
        if (count === 0) return n;
        count = this.push(count, n, n, 0);
        return this.finish(b, count, n, line);
      }
      let s: number;
      let e: number;
      let flag = 0;
      if (b[p] === QUOTE) {
        const column = count + 1;
        const fieldStart = p;
        s = p + 1;
        let q = s;
        flag = 1;
        for (;;) {
          const k = b.indexOf(QUOTE, q);
          if (k < 0 || k + 1 >= n) {
            if (k < 0 && n - s > MAX_FIELD_BYTES) return this.unclosed(line, column);
            if (!eof) {
              this.openQuote = { line, column };
              return -1;
            }
            if (k < 0) return this.unclosed(line, column);
          }
          line += countLf(b, q, k);
          if (k + 1 < n && b[k + 1] === QUOTE) {
            flag = 2;
            q = k + 2;
            continue;
          }
          e = k;
          p = k + 1;
          break;
        }
        if (e - s > MAX_FIELD_BYTES) return this.unclosed(line, column);
        for (let j = s; j < e; j++) {
          const c = b[j];
          if (c < SPACE && c !== TAB && c !== LF && c !== CR) {
            this.badChar(line, column, c);
            break;
          }
        }
        while (p < n && (b[p] === SPACE || (b[p] === TAB && delim !== TAB))) p++;
        if (p < n && b[p] !== delim && b[p] !== LF && b[p] !== CR) {
          this.recordProblems.push({
            line,
            column,
            code: 'stray_quote',
            reason: 'text after the closing quote of a quoted field',
          });
          while (p < n && b[p] !== delim && b[p] !== LF && b[p] !== CR) p++;
          s = fieldStart;
          e = p;
          flag = 3;
        }
        if (p >= n && !eof) return -1;
      } else {
        s = p;
        let stray = false;
        let bad = false;
        for (; p < n; p++) {
          const c = b[p];
          if (c === delim || c === LF || c === CR) break;
          if (c < SPACE) {
            if (c !== TAB && !bad) {
              bad = true;
              this.badChar(line, count + 1, c);
            }
          } else if (c === QUOTE && !stray) {
            stray = true;
            this.recordProblems.push({
              line,
              column: count + 1,
              code: 'stray_quote',
              reason: 'a quote inside an unquoted field (quote the whole field and double the quote)',
            });
          }
        }
        if (p - s > MAX_FIELD_BYTES) return this.tooLong(line, count + 1);
        if (p >= n && !eof) return -1;
        e = p;
        while (e > s && (b[e - 1] === SPACE || (b[e - 1] === TAB && delim !== TAB))) e--;
      }
      count = this.push(count, s, e, flag);
      if (count < 0) return n;
      if (p >= n) return this.finish(b, count, n, line);
      const c = b[p];
      if (c === delim) {
        p++;
        continue;
      }
      if (c === CR) {
        if (p + 1 < n) p += b[p + 1] === LF ? 2 : 1;
        else if (eof) p += 1;
        else return -1;
      } else {
        p += 1;
      }
      v.line = this.line;
      return this.finish(b, count, p, line);
    }
  }

  private push(count: number, s: number, e: number, flag: number): number {
    const v = this.view;
    if (count >= v.start.length) {
      if (count >= MAX_FIELDS) {
        this.fatal({
          line: this.line,
          column: count + 1,
          code: 'ragged_row',
          reason: `a row with more than ${MAX_FIELDS} fields`,
        });
        return -1;
      }
      const grow = <T extends Int32Array | Uint8Array>(a: T): T => {
        const next = new (a.constructor as new (n: number) => T)(a.length * 2);
        next.set(a);
        return next;
      };
      v.start = grow(v.start);
      v.end = grow(v.end);
      v.flags = grow(v.flags);
    }
    v.start[count] = s;
    v.end[count] = e;
    v.flags[count] = flag;
    return count + 1;
  }

  private finish(b: Buffer, count: number, next: number, lastLine: number): number {
    const v = this.view;
    v.buf = b;
    v.count = count;
    v.line = this.line;
    if (next > this.validUpTo) this.checkUtf8(v);
    for (const p of this.recordProblems) this.sink.problem(p, false);
    this.line = lastLine + 1;
    if (!this.stopped) this.sink.record(v);
    return next;
  }

  private checkUtf8(v: RecordView): void {
    for (let i = 0; i < v.count; i++) {
      if (!isUtf8(v.buf.subarray(v.start[i], v.end[i]))) {
        this.bad({
          line: v.line,
          column: i + 1,
          code: 'invalid_utf8',
          reason: 'bytes that are not valid UTF-8 (save the file as UTF-8)',
        });
        return;
      }
    }
  }

  private badChar(line: number, column: number, c: number): void {
    this.bad({
      line,
      column,
      code: 'binary_data',
      reason: `a control character (0x${c.toString(16).padStart(2, '0')}) that does not belong in a text file`,
    });
  }

  private bad(p: TokenizerProblem): void {
    if (this.recordProblems.some((q) => q.code === 'binary_data' || q.code === 'invalid_utf8')) return;
    if (++this.badLines >= BINARY_LIMIT) {
      this.fatal({
        ...p,
        code: 'binary_data',
        reason: `${p.reason}; after ${BINARY_LIMIT} such lines this does not look like a CSV text file`,
      });
      return;
    }
    this.recordProblems.push(p);
  }

  private tooLong(line: number, column: number): number {
    this.fatal({
      line,
      column,
      code: 'field_too_long',
      reason: `a field runs on past ${MAX_FIELD_BYTES.toLocaleString('en')} bytes (the cap for one field, quoted or not)`,
    });
    return -1;
  }

  private unclosed(line: number, column: number): number {
    this.fatal({ line, column, code: 'unclosed_quote', reason: 'the quote opened here is never closed' });
    return -1;
  }

  private fatal(p: TokenizerProblem): void {
    if (this.stopped) return;
    this.stopped = true;
    for (const q of this.recordProblems) this.sink.problem(q, false);
    this.recordProblems.length = 0;
    this.sink.problem(p, true);
  }
}

function countLf(b: Buffer, from: number, to: number): number {
  let n = 0;
  let k = b.indexOf(LF, from);
  while (k >= 0 && k < to) {
    n++;
    k = b.indexOf(LF, k + 1);
  }
  return n;
}
