// Shapes of the settings, specs and indicator catalogue APIs (api/settings, api/specs, api/indicators).

export type Settings = {
  confidenceLevel: number;
  alpha: number;
  thresholdShiftPercent: number;
  uploadChangeFactor: number;
  regionTimeZone: string;
  briefPaperSize: 'A4' | 'LETTER';
  scheduleCron: string;
  scheduleEnabled: boolean;
  /** Days an invitation can be used (default 14); edited on the People screen. */
  invitationDays?: number;
};

export type Schedule = { cron: string; timeZone: string; enabled: boolean; nextRunAt: string | null };

export type SettingsResponse = { settings: Settings; schedule: Schedule };

export type SpecForm = 'quadratic' | 'cubic';
export type SpecTransform = 'log' | 'level';
export type SpecCovariance = 'classical' | 'hc1' | 'hc3' | 'newey_west';
export type SpecInterval = 'fieller' | 'delta';

/** The body of POST /api/specs and PUT /api/specs/:id. */
export type SpecInput = {
  name: string;
  description: string;
  emissionsIndicator: string;
  driverIndicator: string;
  controls: string[];
  firstYear: number | null;
  lastYear: number | null;
  minYears: number | null;
  isDefault: boolean;
  form: SpecForm;
  transform: SpecTransform;
  covariance: SpecCovariance;
  lag?: number;
  intervalMethod: SpecInterval;
  levelControls: string[];
};

export type SavedSpec = SpecInput & { id: number; archived: boolean; createdAt: string; updatedAt: string };

export type SpecsResponse = { specs: SavedSpec[]; defaultSpecId: number };

export type CatalogueIndicator = {
  code: string;
  name: string;
  unit: string;
  description: string;
  mustBePositive: boolean;
  /** from_boundaries has no source or divisor */
  derivation: null | { kind: string; source?: string; divisor?: string; formula: string };
  stats: { districts: number; values: number; firstYear: number | null; lastYear: number | null };
};

export type IndicatorsResponse = { indicators: CatalogueIndicator[] };
