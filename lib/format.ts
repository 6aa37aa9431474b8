// Number and year formatting for screens, in the region's locale: the admin setting
// `regionLocale` (BCP 47), which GET /api/me carries. Never the device's locale, so the
// static HTML (written in the default) and the browser print the same digits until the
// setting is known; the root layout sets it and redraws the screens once when it differs.

/** Today's formats, the setting's default. */
export const DEFAULT_LOCALE = 'en-GB';
let locale = DEFAULT_LOCALE;

/** Sets the locale every formatter here and in lib/format-time.ts writes in; a tag Intl refuses keeps the default. */
export function setRegionLocale(tag: string | null | undefined): void {
  if (!tag) {
    locale = DEFAULT_LOCALE;
    return;
  }
  try {
    locale = Intl.getCanonicalLocales(tag)[0] ?? DEFAULT_LOCALE;
  } catch {
    locale = DEFAULT_LOCALE;
  }
}

/** The locale screens format in now. */
export function regionLocale(): string {
  return locale;
}

const formatters = new Map<string, Intl.NumberFormat>();
function formatter(options: Intl.NumberFormatOptions): Intl.NumberFormat {
  const key = `${locale} ${JSON.stringify(options)}`;
  let f = formatters.get(key);
  if (!f) {
    f = new Intl.NumberFormat(locale, options);
    formatters.set(key, f);
  }
  return f;
}

/** Counts: whole numbers with the locale's grouping ("1,234", "1.234", "1 234"). */
export function formatCount(value: number): string {
  return formatter({ maximumFractionDigits: 0 }).format(value);
}

/** A number with at most `digits` decimals (and at least `min`), in the region's locale. */
export function formatDecimal(value: number, digits: number, min = 0): string {
  return formatter({ minimumFractionDigits: min, maximumFractionDigits: digits }).format(value);
}

/** A fraction as a percent: 0.95 → "95%" (en-GB), "95 %" (de-DE); one decimal where needed. */
export function formatPercentOf(fraction: number): string {
  return formatter({ style: 'percent', maximumFractionDigits: 1 }).format(fraction);
}

/** Emissions per person (t CO2): always two decimals, so a column reads at one precision. */
export function formatEmissions(value: number): string {
  return formatter({ minimumFractionDigits: 2, maximumFractionDigits: 2 }).format(value);
}

/** Real income per person: whole currency units with thousands separators. */
export function formatIncome(value: number): string {
  return formatter({ maximumFractionDigits: 0 }).format(value);
}

/**
 * Population: exact below 10,000, else three significant digits with k or M (412k, 1.24M).
 * Written out rather than Intl's compact notation, whose en-GB "1.24m" reads as metres.
 */
export function formatPopulation(value: number): string {
  const abs = Math.abs(value);
  if (abs < 10_000) return formatter({ maximumFractionDigits: 0 }).format(value);
  const threeDigits = formatter({ maximumSignificantDigits: 3 });
  if (abs < 999_500) return `${threeDigits.format(value / 1_000)}k`;
  return `${threeDigits.format(value / 1_000_000)}M`;
}

/** Persons per km²: one decimal below 100, whole numbers above. */
export function formatDensity(value: number): string {
  const digits = Math.abs(value) < 100 ? 1 : 0;
  return formatter({ minimumFractionDigits: digits, maximumFractionDigits: digits }).format(value);
}

/** "1995–2025", "2011" for a single year, or null when the district has no data yet. */
export function formatYearSpan(firstYear: number | null, lastYear: number | null): string | null {
  if (firstYear === null || lastYear === null) return null;
  return firstYear === lastYear ? String(firstYear) : `${firstYear}–${lastYear}`;
}

/** "31 years of data", "1 year of data". */
export function formatYearCount(n: number): string {
  return `${n} ${n === 1 ? 'year' : 'years'} of data`;
}

/**
 * Years inside the span with no observation at all. The API counts years with data
 * (nYears); the span is inclusive.
 */
export function countGapYears(firstYear: number | null, lastYear: number | null, nYears: number): number {
  if (firstYear === null || lastYear === null) return 0;
  return Math.max(0, lastYear - firstYear + 1 - nYears);
}
