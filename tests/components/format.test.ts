import { coverageText } from '@/components/district/district-summary-text';
import { countGapYears, formatDensity, formatEmissions, formatIncome, formatPopulation } from '@/lib/format';

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
