/**
 * The rounding rule for reading (DEVELOPERS.md, "Briefs: rounding"). Every figure a brief
 * prints — in the PDF, in the JSON brief content behind the print-friendly HTML view — is
 * formatted here and nowhere else. The CSV export does not round (full precision).
 *
 * - Levels in real units (threshold, its interval ends, income now, emissions): three
 *   significant figures with thousands separators (21,965 → "22,000"; 609.4 → "609").
 *   From 10⁹ up and below 0.001: "1.58 × 10²⁷", "3.04 × 10⁻¹³".
 * - Interval ends are rounded outward — the lower end down, the upper end up — so the
 *   printed interval is never narrower than the computed one (14,395 → "14,300",
 *   36,456 → "36,500"). Point values round half away from zero.
 * - Percentages (gap, threshold shift): whole percent with a sign (+72%, −9%, 0%); from
 *   10,000% up, three significant figures like a level ("+45,100%", "+1.92 × 10¹⁰%").
 * - Elasticity: two decimals (−0.62); its interval outward at two decimals.
 * - p-values: two significant figures; below 0.001 "< 0.001".
 * - Years and counts: whole numbers, no separator in years.
 * Negative numbers use the minus sign U+2212, not a hyphen.
 */

import { AsyncLocalStorage } from 'node:async_hooks';

/** Today's formats, and the setting's default (api/settings/schema.ts). */
export const DEFAULT_LOCALE = 'en-GB';
const localeStore = new AsyncLocalStorage<string>();

/**
 * Runs `fn` with the region's locale (the `regionLocale` setting, a BCP 47 tag): every
 * number and date this module writes inside it, across awaits, follows that locale's
 * formats through Intl. Outside it the default, en-GB.
 */
export function inLocale<T>(locale: string, fn: () => T): T {
  return localeStore.run(locale, fn);
}

/** The locale briefs are being written in. */
export function briefLocale(): string {
  return localeStore.getStore() ?? DEFAULT_LOCALE;
}

export const MINUS = '\u2212';
/** Between the ends of an interval. */
export const TO = ' – ';

type Mode = 'halfExpand' | 'floor' | 'ceil';

const cache = new Map<string, Intl.NumberFormat>();
function nf(options: Intl.NumberFormatOptions): Intl.NumberFormat {
  const locale = briefLocale();
  const key = `${locale} ${JSON.stringify(options)}`;
  let f = cache.get(key);
  if (!f) {
    f = new Intl.NumberFormat(locale, options);
    cache.set(key, f);
  }
  return f;
}

const minus = (s: string) => s.replace(/-/g, MINUS);
const SUPERSCRIPT: Record<string, string> = {
  '-': '⁻',
  '0': '⁰',
  '1': '¹',
  '2': '²',
  '3': '³',
  '4': '⁴',
  '5': '⁵',
  '6': '⁶',
  '7': '⁷',
  '8': '⁸',
  '9': '⁹',
};

/** Significant figures of levels in real units. */
export const LEVEL_DIGITS = 3;
const SCIENTIFIC_FROM = 1e9;
const SCIENTIFIC_BELOW = 1e-3;

function sig(value: number, mode: Mode): string {
  const abs = Math.abs(value);
  if (abs >= SCIENTIFIC_FROM || (abs > 0 && abs < SCIENTIFIC_BELOW)) {
    const parts = nf({
      notation: 'scientific',
      maximumSignificantDigits: LEVEL_DIGITS,
      roundingMode: mode,
    }).formatToParts(value);
    const mantissa = parts
      .filter((p) => p.type !== 'exponentSeparator' && p.type !== 'exponentInteger' && p.type !== 'exponentMinusSign')
      .map((p) => p.value)
      .join('');
    const exponent = parts
      .filter((p) => p.type === 'exponentInteger' || p.type === 'exponentMinusSign')
      .map((p) => (p.type === 'exponentMinusSign' ? '-' : p.value))
      .join('');
    return `${minus(mantissa)} × 10${[...exponent].map((c) => SUPERSCRIPT[c] ?? c).join('')}`;
  }
  return minus(nf({ maximumSignificantDigits: LEVEL_DIGITS, roundingMode: mode }).format(value));
}

/** A level in real units (threshold, income, emissions): 3 significant figures. */
export function formatLevel(value: number): string {
  return sig(value, 'halfExpand');
}

/** The lower end of an interval: 3 significant figures, rounded down. */
export function formatLowerEnd(value: number): string {
  return sig(value, 'floor');
}

/** The upper end of an interval: 3 significant figures, rounded up. */
export function formatUpperEnd(value: number): string {
  return sig(value, 'ceil');
}

/** "14,300 – 36,500": both ends rounded outward. */
export function formatLevelInterval(lo: number, hi: number): string {
  return `${formatLowerEnd(lo)}${TO}${formatUpperEnd(hi)}`;
}

/** From here on a percentage is written with three significant figures and a power of ten. */
const PERCENT_SCIENTIFIC_FROM = 1e4;

/** Signed whole percent: "+72%", "−9%", "0%"; from 10,000% up 3 significant figures. */
export function formatSignedPercent(value: number): string {
  if (Math.abs(value) >= PERCENT_SCIENTIFIC_FROM) return `${value > 0 ? '+' : ''}${sig(value, 'halfExpand')}%`;
  const s = nf({
    style: 'percent',
    maximumFractionDigits: 0,
    roundingMode: 'halfExpand',
    signDisplay: 'exceptZero',
  }).format(value / 100);
  return minus(s);
}

/** A confidence or test level as a percent: 0.95 → "95%", 0.995 → "99.5%" (de-DE "95 %"). */
export function formatLevelPercent(level: number): string {
  return nf({ style: 'percent', maximumFractionDigits: 1 }).format(level);
}

/** A setting in percent as a limit: 10 → "10%", 12.5 → "12.5%". */
export function formatShiftLimit(percent: number): string {
  return nf({ style: 'percent', maximumFractionDigits: 1 }).format(percent / 100);
}

/** Elasticity: two decimals, half away from zero ("−0.62"). */
export function formatElasticity(value: number): string {
  return minus(nf({ minimumFractionDigits: 2, maximumFractionDigits: 2, roundingMode: 'halfExpand' }).format(value));
}

/** An elasticity interval, outward at two decimals: "−1.21 to −0.03". */
export function formatElasticityInterval(lo: number, hi: number): string {
  const end = (v: number, mode: Mode) =>
    minus(nf({ minimumFractionDigits: 2, maximumFractionDigits: 2, roundingMode: mode }).format(v));
  return `${end(lo, 'floor')} to ${end(hi, 'ceil')}`;
}

/** "p = 0.019", "p < 0.001". */
export function formatPValue(p: number): string {
  if (p < 0.001) return 'p < 0.001';
  return `p = ${nf({ maximumSignificantDigits: 2, roundingMode: 'halfExpand' }).format(p)}`;
}

/**
 * The turn test in words an official can read, with its p-value for those who want it:
 * "Test for a turn (Lind–Mehlum U-test): p = 0.019, a turn is supported at the 5% level".
 */
export function turnTestWords(pValue: number, rejects: boolean, alpha: number): string {
  return `Test for a turn (Lind–Mehlum U-test): ${formatPValue(pValue)}, ${rejects ? 'a turn is supported' : 'no turn is confirmed'} at the ${formatLevelPercent(alpha)} level`;
}

/** Counts: whole numbers with thousands separators. */
export function formatCount(n: number): string {
  return nf({ maximumFractionDigits: 0 }).format(n);
}

/** A chart tick label: compact, 3 significant figures at most ("8k", "20k", "1.5M", "4.2"). */
export function formatTick(value: number): string {
  const abs = Math.abs(value);
  const f = nf({ maximumSignificantDigits: LEVEL_DIGITS });
  if (abs >= 1e9) return sig(value, 'halfExpand');
  if (abs >= 1e6) return minus(`${f.format(value / 1e6)}M`);
  if (abs >= 1e3) return minus(`${f.format(value / 1e3)}k`);
  return minus(f.format(value));
}

/** The run's data hash as printed: its first 12 hex digits. */
export function shortHash(hash: string | null): string {
  return hash ? hash.slice(0, 12) : 'none';
}

/** "3 December 2026" (en-GB), "3. Dezember 2026" (de-DE) in the region's time zone. */
export function formatDate(iso: string | Date, timeZone: string): string {
  return new Intl.DateTimeFormat(briefLocale(), { timeZone, day: 'numeric', month: 'long', year: 'numeric' }).format(
    new Date(iso),
  );
}

/** "3 December 2026, 14:05 (Europe/Lisbon)" in the region's time zone. */
export function formatDateTime(iso: string | Date, timeZone: string): string {
  const d = new Date(iso);
  const time = new Intl.DateTimeFormat(briefLocale(), {
    timeZone,
    hour: '2-digit',
    minute: '2-digit',
    hourCycle: 'h23',
  }).format(d);
  return `${formatDate(d, timeZone)}, ${time} (${timeZone})`;
}
