/**
 * A saved model specification: which series (emissions indicator, driver, controls),
 * which sample window and minimum years, and the engine's model fields. The model fields
 * are the engine's own `ModelSpec` schema, so the engine, /api/estimate and saved specs
 * validate the same way. Level and α are not part of a spec: they come from the settings
 * at run time and are recorded with each run.
 */
import { z } from 'zod';
import { ModelSpec } from '../estimation/model-spec';
import { INDICATOR_CODE, INDICATOR_CODE_RULE } from '../../contracts/patterns';

const indicatorCode = z.string().regex(INDICATOR_CODE, INDICATOR_CODE_RULE);

export const SpecModelFields = ModelSpec.pick({
  form: true,
  transform: true,
  covariance: true,
  lag: true,
  intervalMethod: true,
  levelControls: true,
});

export const SavedSpecInput = z
  .object({
    name: z.string().trim().min(1).max(80),
    description: z.string().max(500).default(''),
    emissionsIndicator: indicatorCode,
    driverIndicator: indicatorCode,
    controls: z.array(indicatorCode).max(8).default([]),
    firstYear: z.number().int().min(1900).max(2100).nullable().default(null),
    lastYear: z.number().int().min(1900).max(2100).nullable().default(null),
    minYears: z.number().int().min(3).max(200).nullable().default(null),
  })
  .extend(SpecModelFields.shape)
  .refine((s) => s.covariance !== 'cluster', {
    message: 'cluster covariance is for the pooled panel; choose classical, hc1, hc3 or newey_west',
    path: ['covariance'],
  })
  .refine((s) => s.emissionsIndicator !== s.driverIndicator, {
    message: 'the driver must differ from the emissions indicator',
    path: ['driverIndicator'],
  })
  .refine((s) => !s.controls.includes(s.emissionsIndicator) && !s.controls.includes(s.driverIndicator), {
    message: 'controls must differ from the emissions indicator and the driver',
    path: ['controls'],
  })
  .refine((s) => s.firstYear === null || s.lastYear === null || s.firstYear <= s.lastYear, {
    message: 'firstYear must not be after lastYear',
    path: ['firstYear'],
  });
export type SavedSpecInput = z.infer<typeof SavedSpecInput>;

export interface SavedSpec extends SavedSpecInput {
  id: number;
  /** Names of the tracks (not archived) whose runs use this spec. */
  tracks: string[];
  archived: boolean;
  createdAt: string;
  updatedAt: string;
}

/** The spec a first track starts from: log–quadratic with density as control, Newey–West errors. */
export const DEFAULT_SPEC: SavedSpecInput = SavedSpecInput.parse({
  name: 'Regional default',
  description: 'Log–quadratic in real income per person, population density as control, Newey–West errors.',
  emissionsIndicator: 'emissions_pc',
  driverIndicator: 'income_pc',
  controls: ['pop_density'],
  form: 'quadratic',
  transform: 'log',
  covariance: 'newey_west',
  intervalMethod: 'fieller',
});
