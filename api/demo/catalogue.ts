/** The demo region's indicator catalogue. */
export interface IndicatorDef {
  code: string;
  name: string;
  unit: string;
  description: string;
  mustBePositive: boolean;
}

export const DEMO_INDICATORS: IndicatorDef[] = [
  {
    code: 'emissions_pc',
    name: 'CO2 emissions per person',
    unit: 't CO2 per person',
    description: 'Territorial CO2 emissions divided by resident population.',
    mustBePositive: true,
  },
  {
    code: 'income_pc',
    name: 'Real income per person',
    unit: 'constant 2020 currency units per person',
    description: 'Household and business income per resident, deflated to 2020 prices.',
    mustBePositive: true,
  },
  {
    code: 'population',
    name: 'Population',
    unit: 'persons',
    description: 'Resident population at mid-year.',
    mustBePositive: true,
  },
  {
    code: 'pop_density',
    name: 'Population density',
    unit: 'persons per km²',
    description: 'Resident population divided by land area.',
    mustBePositive: true,
  },
  {
    code: 'industry_share',
    name: 'Industry share of output',
    unit: '% of gross value added',
    description: 'Share of manufacturing, mining and utilities in gross value added.',
    mustBePositive: true,
  },
  {
    code: 'trade_openness',
    name: 'Trade openness',
    unit: '% of output',
    description: 'Exports plus imports relative to output.',
    mustBePositive: true,
  },
];
