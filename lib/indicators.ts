// How each indicator the client shows is labelled and formatted. Full names and units come
// from the API (GET /api/districts/:code `indicators`); these short labels fit a 390 px
// table header and a list row, where the API's long unit would not.
import type { IndicatorCode, SeriesRow } from '@/contracts/districts';
import { formatDensity, formatEmissions, formatIncome, formatPopulation } from './format';

export type IndicatorColumn = {
  code: IndicatorCode;
  /** Field of a SeriesRow holding this indicator. */
  field: Exclude<keyof SeriesRow, 'year'>;
  /** Header in the series table. */
  short: string;
  /** Unit in a few characters, under the header and beside list values; null: the catalogue's unit as it stands. */
  shortUnit: string | null;
  format: (value: number) => string;
};

export const INDICATOR_COLUMNS: readonly IndicatorColumn[] = [
  {
    code: 'emissions_pc',
    field: 'emissionsPc',
    short: 'Emissions',
    // Which pollutant and unit this series holds is the catalogue's to say (GET /api/districts/:code `indicators`).
    shortUnit: null,
    format: formatEmissions,
  },
  { code: 'income_pc', field: 'incomePc', short: 'Income', shortUnit: 'per person, real', format: formatIncome },
  { code: 'population', field: 'population', short: 'People', shortUnit: 'persons', format: formatPopulation },
  { code: 'pop_density', field: 'popDensity', short: 'Density', shortUnit: 'per km²', format: formatDensity },
];

export function indicatorColumn(code: IndicatorCode): IndicatorColumn {
  const column = INDICATOR_COLUMNS.find((c) => c.code === code);
  if (!column) throw new Error(`No display settings for indicator ${code}`);
  return column;
}
