/** Settings, saved model specs and the indicator catalogue: api/settings, api/specs, api/indicators. */
import * as z from './kit';
import { isoTime, nullableNumber, nullableString } from './common';
import { UploadSummarySchema } from './uploads';

export const PAPER_SIZES = ['A4', 'LETTER'] as const;

export const SettingsSchema = z.object({
  confidenceLevel: z.number(),
  alpha: z.number(),
  thresholdShiftPercent: z.number(),
  uploadChangeFactor: z.number(),
  regionTimeZone: z.string(),
  /** BCP 47 tag whose number and date formats screens and briefs use (default en-GB). */
  regionLocale: z.optional(z.string()),
  briefPaperSize: z.enum(PAPER_SIZES),
  scheduleCron: z.string(),
  scheduleEnabled: z.boolean(),
  /** Days an invitation can be used (default 14); edited on the People screen. */
  invitationDays: z.optional(z.number()),
  /** Retention (nightly job): days sent mail and unread alerts are kept. */
  sentMailRetentionDays: z.optional(z.number()),
  unreadAlertRetentionDays: z.optional(z.number()),
  /** Days a scheduled run may wait in review before staff are told (default 7; api/run-watch). */
  reviewWaitDays: z.optional(z.number()),
});
export type Settings = z.infer<typeof SettingsSchema>;

export const ScheduleSchema = z.object({
  cron: z.string(),
  timeZone: z.string(),
  enabled: z.boolean(),
  nextRunAt: z.nullable(isoTime),
});
export type Schedule = z.infer<typeof ScheduleSchema>;

export const SettingsResponseSchema = z.object({ settings: SettingsSchema, schedule: ScheduleSchema });
export type SettingsResponse = z.infer<typeof SettingsResponseSchema>;

export const SpecFormSchema = z.enum(['quadratic', 'cubic']);
export type SpecForm = z.infer<typeof SpecFormSchema>;
export const SpecTransformSchema = z.enum(['log', 'level']);
export type SpecTransform = z.infer<typeof SpecTransformSchema>;
export const SpecCovarianceSchema = z.enum(['classical', 'hc1', 'hc3', 'newey_west']);
export type SpecCovariance = z.infer<typeof SpecCovarianceSchema>;
export const SpecIntervalSchema = z.enum(['fieller', 'delta']);
export type SpecInterval = z.infer<typeof SpecIntervalSchema>;

const specInputFields = {
  name: z.string(),
  description: z.string(),
  emissionsIndicator: z.string(),
  driverIndicator: z.string(),
  controls: z.array(z.string()),
  firstYear: nullableNumber,
  lastYear: nullableNumber,
  minYears: nullableNumber,
  form: SpecFormSchema,
  transform: SpecTransformSchema,
  covariance: SpecCovarianceSchema,
  lag: z.optional(z.number()),
  intervalMethod: SpecIntervalSchema,
  levelControls: z.array(z.string()),
};
/** The body of POST /api/specs and PUT /api/specs/:id, as the app sends it. */
export const SpecInputSchema = z.object(specInputFields);
export type SpecInput = z.infer<typeof SpecInputSchema>;

export const SavedSpecSchema = z.object({
  id: z.number(),
  ...specInputFields,
  /** Names of the tracks (not archived) whose runs use this spec. */
  tracks: z.array(z.string()),
  archived: z.boolean(),
  createdAt: isoTime,
  updatedAt: isoTime,
});
export type SavedSpec = z.infer<typeof SavedSpecSchema>;

export const SpecsResponseSchema = z.object({ specs: z.array(SavedSpecSchema), headlineSpecId: nullableNumber });
export type SpecsResponse = z.infer<typeof SpecsResponseSchema>;
export const SpecAnswerSchema = z.object({ spec: SavedSpecSchema });
export type SpecAnswer = z.infer<typeof SpecAnswerSchema>;

export const CatalogueIndicatorSchema = z.object({
  code: z.string(),
  name: z.string(),
  unit: z.string(),
  description: z.string(),
  mustBePositive: z.boolean(),
  /** who publishes the series and under which terms (null: not recorded); shown on the method page and briefs */
  source: nullableString,
  licence: nullableString,
  derivation: z.nullable(
    // from_boundaries has no source or divisor
    z.object({
      kind: z.string(),
      source: z.optional(z.string()),
      divisor: z.optional(z.string()),
      formula: z.string(),
      baseYear: z.optional(z.number()),
    }),
  ),
  stats: z.object({ districts: z.number(), values: z.number(), firstYear: nullableNumber, lastYear: nullableNumber }),
});
export type CatalogueIndicator = z.infer<typeof CatalogueIndicatorSchema>;

export const IndicatorsResponseSchema = z.object({ indicators: z.array(CatalogueIndicatorSchema) });
export type IndicatorsResponse = z.infer<typeof IndicatorsResponseSchema>;

/** POST /api/indicators and PATCH /api/indicators/:code: the indicator and the recomputation it caused. */
export const IndicatorAnswerSchema = z.object({
  indicator: CatalogueIndicatorSchema,
  recomputed: z.nullable(UploadSummarySchema),
});
export type IndicatorAnswer = z.infer<typeof IndicatorAnswerSchema>;

/** POST /api/estimate: one what-if fit; `result` is the engine's fit (status `ok` or `not_estimable`). */
export const WhatIfAnswerSchema = z.object({
  source: z.enum(['rows', 'district']),
  district: z.optional(z.string()),
  dataVersion: z.optional(z.number()),
  droppedYears: z.optional(z.array(z.number())),
  result: z.looseObject({
    status: z.string(),
    reason: z.optional(z.looseObject({ code: z.string(), message: nullableString })),
  }),
});
export type WhatIfAnswer = z.infer<typeof WhatIfAnswerSchema>;
