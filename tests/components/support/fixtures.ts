// Invented districts for component tests (plumbing only: no figure here means anything).
import type { DistrictDetailResponse, DistrictSummary, SeriesRow } from '@/contracts/districts';

export const districtSummaries: DistrictSummary[] = [
  {
    code: 'T01',
    name: 'Ashgrove',
    firstYear: 2001,
    lastYear: 2010,
    nYears: 10,
    latest: { year: 2010, emissionsPc: 6.25, incomePc: 18400, population: 52000, popDensity: 140.5 },
  },
  {
    code: 'T02',
    name: 'Bryn Ødegård',
    firstYear: 2001,
    lastYear: 2010,
    nYears: 9,
    latest: { year: 2010, emissionsPc: null, incomePc: 21950, population: 80400, popDensity: 312 },
  },
  { code: 'T03', name: 'Coldwater', firstYear: null, lastYear: null, nYears: 0, latest: null },
];

function row(year: number, values: Partial<SeriesRow> = {}): SeriesRow {
  return {
    year,
    emissionsPc: 5 + (year - 2000) / 10,
    incomePc: 15000 + (year - 2000) * 300,
    population: 80000,
    popDensity: 312,
    ...values,
  };
}

/** T02: 2004 has no value at all (a gap year); 2007 lacks only its emissions value. */
export const gappyDetail: DistrictDetailResponse = {
  district: { code: 'T02', name: 'Bryn Ødegård', firstYear: 2001, lastYear: 2010, nYears: 9 },
  indicators: [
    { code: 'emissions_pc', name: 'CO2 emissions per person', unit: 't CO2 per person' },
    { code: 'income_pc', name: 'Real income per person', unit: 'constant currency units per person' },
    { code: 'population', name: 'Population', unit: 'persons' },
    { code: 'pop_density', name: 'Population density', unit: 'persons per km²' },
  ],
  series: Array.from({ length: 10 }, (_, i) => {
    const year = 2001 + i;
    if (year === 2004) return { year, emissionsPc: null, incomePc: null, population: null, popDensity: null };
    if (year === 2007) return row(year, { emissionsPc: null });
    return row(year);
  }),
};
