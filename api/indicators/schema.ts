/** The indicator catalogue's request schemas. */
import { z } from 'zod';
import { INDICATOR_CODE, INDICATOR_CODE_RULE } from '../../contracts/patterns';

export const indicatorCode = z.string().regex(INDICATOR_CODE, INDICATOR_CODE_RULE);

export const derivationInput = z.discriminatedUnion('kind', [
  z.object({
    kind: z.literal('per_person'),
    /** The total, e.g. emissions in t CO2. */
    source: indicatorCode,
    /** The population indicator. */
    divisor: indicatorCode,
  }),
  z.object({
    kind: z.literal('real_from_nominal'),
    /** The series in current prices. */
    source: indicatorCode,
    /** The price index, 100 in the base year. */
    divisor: indicatorCode,
    baseYear: z.number().int().min(1900).max(2100),
  }),
  z.object({
    /** The district's land area in km², from the current boundaries, for every year it has data. */
    kind: z.literal('from_boundaries'),
    measure: z.literal('area_km2').default('area_km2'),
  }),
  z.object({
    kind: z.literal('ratio'),
    /** The numerator, e.g. population. */
    source: indicatorCode,
    /** The denominator, e.g. land area (from boundaries). */
    divisor: indicatorCode,
  }),
]);
export type DerivationInput = z.infer<typeof derivationInput>;

/** Who publishes the series and under which terms; blank text means "not recorded" (null). */
const provenance = (what: string, max: number) =>
  z
    .string()
    .trim()
    .max(max, `${what} is at most ${max} characters`)
    .nullable()
    .transform((v) => (v === null || v === '' ? null : v));

export const createIndicatorBody = z.object({
  code: indicatorCode,
  name: z.string().trim().min(1).max(120),
  unit: z.string().trim().min(1).max(80),
  description: z.string().trim().max(2000).default(''),
  mustBePositive: z.boolean().default(false),
  source: provenance('source', 300).default(null),
  licence: provenance('licence', 300).default(null),
  derivation: derivationInput.nullable().default(null),
});
export type CreateIndicator = z.infer<typeof createIndicatorBody>;

export const updateIndicatorBody = z
  .object({
    name: z.string().trim().min(1).max(120),
    unit: z.string().trim().min(1).max(80),
    description: z.string().trim().max(2000),
    mustBePositive: z.boolean(),
    /** who publishes the series, e.g. "Regional statistics office"; null or blank clears it */
    source: provenance('source', 300),
    /** the terms of use, e.g. "CC BY 4.0"; null or blank clears it */
    licence: provenance('licence', 300),
    /** null makes a derived indicator plain again (its values stay). */
    derivation: derivationInput.nullable(),
  })
  .partial()
  .refine((b) => Object.keys(b).length > 0, 'give at least one field to change');
export type UpdateIndicator = z.infer<typeof updateIndicatorBody>;

export const indicatorParams = z.object({ code: indicatorCode });
