/** The demo region's indicator catalogue. */
export interface IndicatorDef {
  code: string;
  name: string;
  unit: string;
  description: string;
  mustBePositive: boolean;
  /** who publishes the series and under which terms (invented for the demo) */
  source: string;
  licence: string;
}

/** Every demo series comes from the same invented office. */
const DEMO_SOURCE = 'Demo region statistics office (invented)';
const DEMO_LICENCE = 'Invented demonstration data: free to copy and change, describes no real place';

export const DEMO_INDICATORS: IndicatorDef[] = [
  {
    code: 'emissions_pc',
    name: 'CO2 emissions per person',
    unit: 't CO2 per person',
    description: 'Territorial CO2 emissions divided by resident population.',
    mustBePositive: true,
    source: DEMO_SOURCE,
    licence: DEMO_LICENCE,
  },
  {
    code: 'income_pc',
    name: 'Real income per person',
    unit: 'constant 2020 currency units per person',
    description: 'Household and business income per resident, deflated to 2020 prices.',
    mustBePositive: true,
    source: DEMO_SOURCE,
    licence: DEMO_LICENCE,
  },
  {
    code: 'population',
    name: 'Population',
    unit: 'persons',
    description: 'Resident population at mid-year.',
    mustBePositive: true,
    source: DEMO_SOURCE,
    licence: DEMO_LICENCE,
  },
  {
    code: 'pop_density',
    name: 'Population density',
    unit: 'persons per km²',
    description: 'Resident population divided by land area.',
    mustBePositive: true,
    source: DEMO_SOURCE,
    licence: DEMO_LICENCE,
  },
  {
    code: 'industry_share',
    name: 'Industry share of output',
    unit: '% of gross value added',
    description: 'Share of manufacturing, mining and utilities in gross value added.',
    mustBePositive: true,
    source: DEMO_SOURCE,
    licence: DEMO_LICENCE,
  },
  {
    code: 'trade_openness',
    name: 'Trade openness',
    unit: '% of output',
    description: 'Exports plus imports relative to output.',
    mustBePositive: true,
    source: DEMO_SOURCE,
    licence: DEMO_LICENCE,
  },
  {
    code: 'pm25',
    name: 'PM2.5 annual mean concentration',
    unit: 'µg/m³',
    description: 'Fine particles (PM2.5), annual mean of the district’s monitoring stations.',
    mustBePositive: true,
    source: DEMO_SOURCE,
    licence: DEMO_LICENCE,
  },
  {
    code: 'so2_pc',
    name: 'SO2 emissions per person',
    unit: 'kg per person',
    description: 'Sulphur dioxide emissions divided by resident population.',
    mustBePositive: true,
    source: DEMO_SOURCE,
    licence: DEMO_LICENCE,
  },
];
