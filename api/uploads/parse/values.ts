/**
 * Cell checks shared by both formats: numbers (decimal point, or decimal comma when the
 * analyst says so), years, district codes and names. Each returns the clean value or a
 * reason; the caller adds the line and column. No pattern here backtracks: the cells are
 * capped in length first and numbers are read by a scanner, so a hostile cell costs time
 * in proportion to its length, never more.
 */
import type { ProblemCode } from '../problems';
import { DISTRICT_CODE } from '../../../contracts/patterns';

export type Checked<T> = { ok: true; value: T } | { ok: false; code: ProblemCode; reason: string };

const NOT_FINITE = /^[+-]?(?:nan|inf|infinity|#num!|#div\/0!)$/i;

/**
 * Length caps per cell kind, checked before any pattern: every check after them runs on
 * a short string, and the scanners below read each character once whatever the input.
 */
export const MAX_NUMBER_CHARS = 64;
export const MAX_YEAR_CHARS = 64;
export const MAX_CODE_CHARS = 64;
export const MAX_NAME_CHARS = 200;
function tooLong(raw: string, kind: string, cap: number): Checked<never> {
  return {
    ok: false,
    code: 'cell_too_long',
    reason: `the ${kind} is ${raw.length.toLocaleString('en')} characters long, over the cap of ${cap} characters for a ${kind} cell`,
  };
}

const PLUS = 43;
const MINUS = 45;
const isDigit = (c: number) => c >= 48 && c <= 57;

/**
 * One pass: `[+-]? digits [sep digits] [(e|E) [+-]? digits]` with at least one digit
 * before the exponent (so `5.`, `.5` and `-1,5e3` with a comma separator pass, `.`, `1e`
 * and `1.2.3` do not).
 */
export function isDecimal(s: string, sep: number): boolean {
  const n = s.length;
  let i = 0;
  if (i < n && (s.charCodeAt(i) === PLUS || s.charCodeAt(i) === MINUS)) i++;
  let digits = 0;
  while (i < n && isDigit(s.charCodeAt(i))) {
    i++;
    digits++;
  }
  if (i < n && s.charCodeAt(i) === sep) {
    i++;
    while (i < n && isDigit(s.charCodeAt(i))) {
      i++;
      digits++;
    }
  }
  if (digits === 0) return false;
  if (i < n && (s.charCodeAt(i) === 101 || s.charCodeAt(i) === 69)) {
    i++;
    if (i < n && (s.charCodeAt(i) === PLUS || s.charCodeAt(i) === MINUS)) i++;
    let exp = 0;
    while (i < n && isDigit(s.charCodeAt(i))) {
      i++;
      exp++;
    }
    if (exp === 0) return false;
  }
  return i === n;
}

/**
 * A number cell. `text` is the form to hand to PostgreSQL (decimal point), which parses it
 * to the same double as JavaScript does (both round correctly).
 */
export function checkNumber(raw: string, decimalComma: boolean): Checked<number> & { text?: string } {
  if (raw === '')
    return { ok: false, code: 'empty_value', reason: 'the value is empty (leave the row out to record a gap)' };
  if (raw.length > MAX_NUMBER_CHARS) return tooLong(raw, 'number', MAX_NUMBER_CHARS);
  let text = raw;
  if (decimalComma) {
    if (!isDecimal(raw, 44)) return notNumber(raw, decimalComma);
    text = raw.replace(',', '.');
  } else if (!isDecimal(raw, 46)) {
    return notNumber(raw, decimalComma);
  }
  const n = Number(text);
  if (!Number.isFinite(n)) return { ok: false, code: 'not_finite', reason: `"${clip(raw)}" is too large to store` };
  if ((n === 0 && /[1-9]/.test(text.split(/[eE]/)[0])) || (n !== 0 && Math.abs(n) < 2.2250738585072014e-308)) {
    return { ok: false, code: 'not_finite', reason: `"${clip(raw)}" is too close to zero to store` };
  }
  return { ok: true, value: n, text };
}

function notNumber(raw: string, decimalComma: boolean): Checked<number> {
  if (NOT_FINITE.test(raw)) return { ok: false, code: 'not_finite', reason: `"${clip(raw)}" is not a finite number` };
  let hint = '';
  if (!decimalComma && /^[+-]?\d+,\d+$/.test(raw))
    hint = ' (if the file uses decimal commas, upload it with the decimal-comma option)';
  else if (decimalComma && /^[+-]?\d+\.\d+$/.test(raw))
    hint = ' (the decimal-comma option is on, so a point is not a decimal separator)';
  else if (/\d[ .,'\u00a0]\d{3}/.test(raw)) hint = ' (remove thousands separators)';
  return { ok: false, code: 'not_a_number', reason: `"${clip(raw)}" is not a number${hint}` };
}

export const MIN_YEAR = 1900;
export const MAX_YEAR = 2100;

export function checkYear(raw: string, currentYear: number): Checked<number> {
  if (raw.length > MAX_YEAR_CHARS) return tooLong(raw, 'year', MAX_YEAR_CHARS);
  if (!/^\d{1,4}$/.test(raw)) {
    return {
      ok: false,
      code: 'bad_year',
      reason: raw === '' ? 'the year is empty' : `"${clip(raw)}" is not a year (four digits)`,
    };
  }
  const y = Number(raw);
  if (y < MIN_YEAR || y > MAX_YEAR)
    return { ok: false, code: 'year_out_of_range', reason: `year ${y} is outside ${MIN_YEAR}–${MAX_YEAR}` };
  if (y > currentYear)
    return { ok: false, code: 'year_in_future', reason: `year ${y} is in the future (it is ${currentYear} now)` };
  return { ok: true, value: y };
}

/** Same rule as the districts API's code parameter. */
export { DISTRICT_CODE };

export function checkDistrictCode(raw: string): Checked<string> {
  if (raw.length > MAX_CODE_CHARS) return tooLong(raw, 'district code', MAX_CODE_CHARS);
  if (DISTRICT_CODE.test(raw)) return { ok: true, value: raw };
  return {
    ok: false,
    code: 'bad_district_code',
    reason:
      raw === ''
        ? 'the district code is empty'
        : `"${clip(raw)}" is not a district code (1–32 letters, digits, _ or -)`,
  };
}

/**
 * A district name is kept as the text it is — a leading = + - @ stays, because it is a
 * name, not a formula; exports escape it (api/http/csv-escape.ts).
 */
export function checkDistrictName(raw: string): Checked<string> {
  if (raw.length > MAX_NAME_CHARS) return tooLong(raw, 'district name', MAX_NAME_CHARS);
  if (/[\u0000-\u001F\u007F]/.test(raw))
    return {
      ok: false,
      code: 'bad_district_name',
      reason: 'the district name contains a line break or control character',
    };
  return { ok: true, value: raw };
}

/** A cell's text for a message: shortened, control characters shown as \xNN (JSON in PostgreSQL cannot hold NUL). */
export function clip(s: string, max = 40): string {
  const short = s.length > max ? `${s.slice(0, max)}…` : s;
  return short.replace(/[\u0000-\u001f\u007f]/g, (c) => `\\x${c.charCodeAt(0).toString(16).padStart(2, '0')}`);
}
