// Number and year formatting for screens. One fixed locale so the static HTML and the
// browser print the same digits (a locale taken from the device would break hydration).

const LOCALE = 'en-GB';

const formatters = new Map<string, Intl.NumberFormat>();
function formatter(options: Intl.NumberFormatOptions): Intl.NumberFormat {
  const key = JSON.stringify(options);
  let f = formatters.get(key);
  if (!f) {
    f = new Intl.NumberFormat(LOCALE, options);
    formatters.set(key, f);
  }
  return f;
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
