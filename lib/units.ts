// Names and units of the two indicators a published run relates, from the indicator
// catalogue (the run meta's `units`). Without a run there is nothing to label, so the
// fallback words name no pollutant and no unit.
import type { PublishedRunMeta } from '@/contracts/estimates';

export type RunUnits = {
  /** "PM2.5 annual mean", "CO₂ emissions per person" */
  emissionsName: string;
  /** "µg/m³", "t CO₂ per person" ('' when unknown) */
  emissionsUnit: string;
  incomeName: string;
  incomeUnit: string;
};

export const UNKNOWN_UNITS: RunUnits = {
  emissionsName: 'Emissions',
  emissionsUnit: '',
  incomeName: 'Income',
  incomeUnit: '',
};

export function runUnits(run: Pick<PublishedRunMeta, 'units'> | null | undefined): RunUnits {
  if (!run) return UNKNOWN_UNITS;
  return {
    emissionsName: run.units.emissions.name,
    emissionsUnit: run.units.emissions.unit,
    incomeName: run.units.driver.name,
    incomeUnit: run.units.driver.unit,
  };
}

/** "24,000 € per person"; the bare figure when the unit is unknown. */
export function withUnit(figure: string, unit: string): string {
  return unit ? `${figure} ${unit}` : figure;
}

/** "Real income per person (€ per person)" for an axis or a heading. */
export function nameWithUnit(name: string, unit: string): string {
  return unit ? `${name} (${unit})` : name;
}
