/**
 * Fast checks straight on the bytes of a field, for the cells a million-row file has a
 * million of (years, values). Anything unusual goes to the string checks in values.ts,
 * which also write the reasons.
 */
const PLUS = 43;
const MINUS = 45;
const DOT = 46;
const COMMA = 44;
const ZERO = 48;
const NINE = 57;

/** Plain numbers rather than an enum: imported enums cost a property read per use under tsx. */
export const NumberKind = {
  Invalid: 0,
  Positive: 1,
  Zero: 2,
  Negative: 3,
  /** exponent or very long: use the string check */ Slow: 4,
} as const;
export type NumberKind = (typeof NumberKind)[keyof typeof NumberKind];

/** Classifies a plain decimal number in b[s..e) with a point (or a comma when decimalComma). */
export function scanNumber(b: Buffer, s: number, e: number, decimalComma: boolean): NumberKind {
  if (e <= s) return 0;
  if (e - s > 24) return 4;
  const sep = decimalComma ? COMMA : DOT;
  let i = s;
  let negative = false;
  if (b[i] === PLUS || b[i] === MINUS) {
    negative = b[i] === MINUS;
    i++;
  }
  let digits = 0;
  let nonZero = false;
  let sawSep = false;
  for (; i < e; i++) {
    const c = b[i];
    if (c >= ZERO && c <= NINE) {
      digits++;
      if (c !== ZERO) nonZero = true;
    } else if (c === sep && !sawSep) {
      sawSep = true;
    } else if (c === 101 || c === 69) {
      return 4; // an exponent: Slow
    } else {
      return 0; // Invalid
    }
  }
  if (digits === 0) return 0;
  if (!nonZero) return 2; // Zero
  return negative ? 3 : 1;
}

/** A four-digit year in b[s..e), or -1. */
export function scanYear(b: Buffer, s: number, e: number): number {
  if (e - s !== 4) return -1;
  let y = 0;
  for (let i = s; i < e; i++) {
    const c = b[i];
    if (c < ZERO || c > NINE) return -1;
    y = y * 10 + (c - ZERO);
  }
  return y;
}

export function bytesEqual(b: Buffer, s: number, e: number, ref: Buffer | null): boolean {
  if (ref === null || e - s !== ref.length) return false;
  for (let i = 0; i < ref.length; i++) if (b[s + i] !== ref[i]) return false;
  return true;
}

/** A growable output buffer for COPY text. */
export class OutBuffer {
  private buf = Buffer.allocUnsafe(1 << 18);
  private pos = 0;

  private ensure(n: number): void {
    if (this.pos + n <= this.buf.length) return;
    const next = Buffer.allocUnsafe(Math.max(this.buf.length * 2, this.pos + n));
    this.buf.copy(next, 0, 0, this.pos);
    this.buf = next;
  }

  int(n: number): void {
    this.ensure(12);
    if (n === 0) {
      this.buf[this.pos++] = ZERO;
      return;
    }
    let digits = 0;
    for (let m = n; m > 0; m = (m / 10) | 0) digits++;
    let p = this.pos + digits;
    this.pos = p;
    for (let m = n; m > 0; m = (m / 10) | 0) this.buf[--p] = ZERO + (m % 10);
  }

  byte(c: number): void {
    this.ensure(1);
    this.buf[this.pos++] = c;
  }

  /** Copies src[s..e), turning a decimal comma into a point when asked. */
  bytes(src: Buffer, s: number, e: number, commaToPoint = false): void {
    this.ensure(e - s);
    const buf = this.buf;
    let p = this.pos;
    if (commaToPoint) {
      for (let i = s; i < e; i++) buf[p++] = src[i] === COMMA ? DOT : src[i];
    } else if (e - s < 64) {
      // Short copies: a loop beats a native call per cell.
      for (let i = s; i < e; i++) buf[p++] = src[i];
    } else {
      src.copy(buf, p, s, e);
      p += e - s;
    }
    this.pos = p;
  }

  ascii(s: string): void {
    this.ensure(s.length);
    this.pos += this.buf.write(s, this.pos, 'latin1');
  }

  /** A copy of the bytes written so far (the buffer is reused: a fresh 256 KB per chunk was garbage). */
  take(): Buffer | null {
    if (this.pos === 0) return null;
    const out = Buffer.from(this.buf.subarray(0, this.pos));
    this.pos = 0;
    return out;
  }
}
