import { coverageText } from '@/components/district/district-summary-text';
import { gapShort, levelPercent } from '@/lib/estimate-words';
import {
  countGapYears,
  DEFAULT_LOCALE,
  formatCount,
  formatDecimal,
  formatDensity,
  formatEmissions,
  formatIncome,
  formatPopulation,
  regionLocale,
  setRegionLocale,
} from '@/lib/format';
import { formatDate, formatDateTime, formatLongDate } from '@/lib/format-time';

describe('number formats', () => {
  it('prints each indicator at one precision per column', () => {
    expect(formatEmissions(6.2)).toBe('6.20');
    expect(formatEmissions(11.634)).toBe('11.63');
    expect(formatIncome(37706.6)).toBe('37,707');
    expect(formatPopulation(9876)).toBe('9,876');
    expect(formatPopulation(738_412)).toBe('738k');
    expect(formatPopulation(1_240_000)).toBe('1.24M');
    expect(formatPopulation(999_700)).toBe('1M');
    expect(formatDensity(42.25)).toBe('42.3');
    expect(formatDensity(705.4)).toBe('705');
  });
});

describe('coverage', () => {
  it('counts the years inside the span that have no observation', () => {
    expect(countGapYears(1995, 2025, 30)).toBe(1);
    expect(countGapYears(1995, 2025, 31)).toBe(0);
    expect(countGapYears(null, null, 0)).toBe(0);
  });

  it('words the span, the count and the gaps', () => {
    expect(coverageText({ firstYear: 1995, lastYear: 2025, nYears: 30 })).toBe(
      '1995–2025 · 30 years of data · 1 gap year',
    );
    expect(coverageText({ firstYear: 1995, lastYear: 2025, nYears: 28 }, 'compact')).toBe('1995–2025 · 3 gap years');
    expect(coverageText({ firstYear: 2011, lastYear: 2011, nYears: 1 })).toBe('2011 · 1 year of data');
    expect(coverageText({ firstYear: null, lastYear: null, nYears: 0 })).toBe('No data yet');
  });
});

// The region locale (admin setting `regionLocale`): every screen formats through Intl in it.
// Expected strings come from the CLDR data in Node's ICU (Node 20, ICU 78, CLDR 48): de-DE
// groups with "." and decimals with ","; fr-FR groups with U+202F NARROW NO-BREAK SPACE and
// puts U+00A0 NO-BREAK SPACE before "%"; en-GB is today's British format.
describe('formats in the region locale', () => {
  afterEach(() => setRegionLocale(DEFAULT_LOCALE));

  it('writes numbers the locale’s way', () => {
    setRegionLocale('en-GB');
    expect(formatDecimal(1234.5, 1)).toBe('1,234.5');
    expect(formatIncome(37706.6)).toBe('37,707');
    setRegionLocale('de-DE');
    expect(formatDecimal(1234.5, 1)).toBe('1.234,5');
    expect(formatIncome(37706.6)).toBe('37.707');
    expect(formatEmissions(6.2)).toBe('6,20');
    expect(levelPercent(0.95)).toBe('95\u00a0%');
    setRegionLocale('fr-FR');
    expect(formatDecimal(1234.5, 1)).toBe('1\u202f234,5');
    expect(formatCount(12345)).toBe('12\u202f345');
    expect(gapShort(-18.2)).toBe('−18\u00a0%');
  });

  it('writes dates the locale’s way', () => {
    const day = '2026-12-04T10:00:00.000Z';
    setRegionLocale('en-GB');
    expect(formatLongDate(day, 'UTC')).toBe('4 December 2026');
    expect(formatDate(day, 'UTC')).toBe('4 Dec 2026');
    expect(formatDateTime(day, 'UTC')).toBe('4 Dec 2026, 10:00 UTC');
    setRegionLocale('de-DE');
    expect(formatLongDate(day, 'UTC')).toBe('4. Dezember 2026');
    expect(formatDate(day, 'UTC')).toBe('4. Dez. 2026');
    setRegionLocale('fr-FR');
    expect(formatLongDate(day, 'UTC')).toBe('4 décembre 2026');
  });

  it('keeps the default for a tag Intl refuses', () => {
    setRegionLocale('not a tag');
    expect(regionLocale()).toBe('en-GB');
    expect(formatDecimal(1234.5, 1)).toBe('1,234.5');
  });
});
