/**
 * Districts and their data: GET /api/districts[/:code], /observations, /api/data-version,
 * plus the small system answers (health, sign-in options, the signed-in person, the latest
 * published run id).
 */
import * as z from './kit';
import { isoTime, nullableNumber, nullableString, RoleSchema } from './common';

export const CORE_INDICATOR_CODES = ['emissions_pc', 'income_pc', 'population', 'pop_density'] as const;
export const IndicatorCodeSchema = z.enum(CORE_INDICATOR_CODES);
export type IndicatorCode = z.infer<typeof IndicatorCodeSchema>;

/** One year of a district's series; a gap year has nulls. */
export const SeriesRowSchema = z.object({
  year: z.number(),
  emissionsPc: nullableNumber,
  incomePc: nullableNumber,
  population: nullableNumber,
  popDensity: nullableNumber,
});
export type SeriesRow = z.infer<typeof SeriesRowSchema>;

const districtHeaderFields = {
  code: z.string(),
  name: z.string(),
  firstYear: nullableNumber,
  lastYear: nullableNumber,
  /** years with at least one observation */
  nYears: z.number(),
};

export const DistrictSummarySchema = z.object({ ...districtHeaderFields, latest: z.nullable(SeriesRowSchema) });
export type DistrictSummary = z.infer<typeof DistrictSummarySchema>;

/**
 * A row of the district list: code and name, what the search needs (lib/district-search.ts).
 * Standings, coverage and the run come with the region answer (GET /api/region), a
 * district's details with its own answers.
 */
export const DistrictListItemSchema = z.object({ code: z.string(), name: z.string() });
export type DistrictListItem = z.infer<typeof DistrictListItemSchema>;

/** GET /api/districts: every district, by name. */
export const DistrictListResponseSchema = z.object({ districts: z.array(DistrictListItemSchema) });
export type DistrictListResponse = z.infer<typeof DistrictListResponseSchema>;

export const IndicatorSchema = z.object({ code: IndicatorCodeSchema, name: z.string(), unit: z.string() });
export type Indicator = z.infer<typeof IndicatorSchema>;

export const DistrictDetailResponseSchema = z.object({
  district: z.object(districtHeaderFields),
  indicators: z.array(IndicatorSchema),
  series: z.array(SeriesRowSchema),
});
export type DistrictDetailResponse = z.infer<typeof DistrictDetailResponseSchema>;

/** GET /api/districts/:code/observations: every indicator's values with the upload each came from. */
export const DistrictObservationsResponseSchema = z.object({
  district: z.object({ code: z.string(), name: z.string() }),
  dataVersion: z.number(),
  years: z.nullable(z.object({ first: z.number(), last: z.number() })),
  indicators: z.array(
    z.object({
      code: z.string(),
      name: z.string(),
      unit: z.string(),
      mustBePositive: z.boolean(),
      derived: z.boolean(),
      firstYear: z.number(),
      lastYear: z.number(),
      values: z.number(),
      gaps: z.array(z.number()),
      series: z.array(z.object({ year: z.number(), value: nullableNumber, uploadId: nullableNumber })),
    }),
  ),
});
export type DistrictObservationsResponse = z.infer<typeof DistrictObservationsResponseSchema>;

/** GET /api/data-version: a version of the observations and the hash of its rows. */
export const DataVersionSchema = z.object({
  version: z.number(),
  uploadId: nullableNumber,
  appliedAt: z.nullable(isoTime),
  rowsHash: z.string(),
  rows: z.number(),
});
export type DataVersion = z.infer<typeof DataVersionSchema>;

export const HealthResponseSchema = z.object({ status: z.enum(['ok', 'degraded']), database: z.enum(['up', 'down']) });
export type HealthResponse = z.infer<typeof HealthResponseSchema>;

/** GET /api/auth/options: how this server signs people in. */
export const AuthOptionsResponseSchema = z.object({ provider: z.enum(['google', 'stand-in']), signInUrl: z.string() });
export type AuthOptionsResponse = z.infer<typeof AuthOptionsResponseSchema>;

/** GET /api/me: the signed-in person (401 `unauthenticated` when nobody is). */
export const MeResponseSchema = z.object({
  id: z.number(),
  email: z.string(),
  name: nullableString,
  role: RoleSchema,
  csrfToken: z.string(),
  /** the region's number and date formats (the admin setting, BCP 47; default en-GB) */
  regionLocale: z.optional(z.string()),
});
export type MeResponse = z.infer<typeof MeResponseSchema>;

/** GET /api/published: the latest published run's id (null before the first publish). */
export const PublishedResponseSchema = z.object({ runId: nullableNumber });
export type PublishedResponse = z.infer<typeof PublishedResponseSchema>;
