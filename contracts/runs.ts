/**
 * Runs: GET /api/runs, /api/runs/:id, /review, /districts/:code, and the answers of starting,
 * publishing and reproducing one (api/runs/service.ts, estimate-record.ts, alerts/compare.ts).
 */
import * as z from './kit';
import { isoTime, nullableNumber, nullableString } from './common';
import { TrackRefSchema } from './tracks';
import { AnalystNoteSchema, EstimateRecordSchema, ShapeSchema, StandingSchema } from './estimates';

export const RUN_STATES = ['queued', 'running', 'in_review', 'published', 'discarded', 'failed'] as const;
export const RunStateSchema = z.enum(RUN_STATES);
export type RunState = z.infer<typeof RunStateSchema>;

export const RunListItemSchema = z.object({
  id: z.number(),
  state: RunStateSchema,
  trigger: z.string(),
  track: z.string(),
  trackName: z.string(),
  specName: z.string(),
  createdAt: isoTime,
  finishedAt: z.nullable(isoTime),
  publishedAt: z.nullable(isoTime),
  districts: nullableNumber,
  error: nullableString,
});
export type RunListItem = z.infer<typeof RunListItemSchema>;
export const RunListResponseSchema = z.object({ runs: z.array(RunListItemSchema) });
export type RunListResponse = z.infer<typeof RunListResponseSchema>;

export const RunSpecSnapshotSchema = z.object({
  savedSpecId: z.number(),
  name: z.string(),
  selection: z.object({
    emissions: z.string(),
    driver: z.string(),
    controls: z.array(z.string()),
    firstYear: nullableNumber,
    lastYear: nullableNumber,
  }),
  model: z.looseObject({
    form: z.string(),
    transform: z.string(),
    covariance: z.string(),
    level: z.number(),
    alpha: z.number(),
    intervalMethod: z.string(),
  }),
});
export type RunSpecSnapshot = z.infer<typeof RunSpecSnapshotSchema>;

const AnswerSnapshotSchema = z.object({
  status: z.string(),
  standing: z.string(),
  threshold: nullableNumber,
  intervalLo: nullableNumber,
  intervalHi: nullableNumber,
});
export const ChangedAnswerSchema = z.object({
  code: z.string(),
  name: z.string(),
  fields: z.array(z.enum(['status', 'threshold', 'interval', 'standing'])),
  before: z.nullable(AnswerSnapshotSchema),
  after: z.nullable(AnswerSnapshotSchema),
});
export type ChangedAnswer = z.infer<typeof ChangedAnswerSchema>;

export const RunViewSchema = z.object({
  id: z.number(),
  state: RunStateSchema,
  trigger: z.string(),
  track: TrackRefSchema,
  spec: RunSpecSnapshotSchema,
  specId: z.number(),
  dataVersion: nullableNumber,
  dataHash: nullableString,
  dataRows: nullableNumber,
  softwareVersion: z.string(),
  createdAt: isoTime,
  startedAt: z.nullable(isoTime),
  finishedAt: z.nullable(isoTime),
  publishedAt: z.nullable(isoTime),
  discardedAt: z.nullable(isoTime),
  error: nullableString,
  progress: z.object({ chunksDone: z.number(), chunksTotal: nullableNumber, districts: nullableNumber }),
  timings: z.nullable(z.record(z.string(), z.number())),
  standingCounts: z.nullable(z.record(z.string(), z.number())),
  pooled: z.nullable(
    z.object({
      status: z.string(),
      shape: z.nullable(ShapeSchema),
      threshold: z.nullable(z.object({ level: nullableNumber })),
      n: nullableNumber,
      districts: nullableNumber,
    }),
  ),
  reproduction: z.nullable(
    z.object({
      of: z.number(),
      identical: z.nullable(z.boolean()),
      differences: z.number(),
      /** the reproduction ran on another software version than the original */
      softwareChanged: z.optional(z.boolean()),
      originalSoftware: z.optional(z.nullable(z.string())),
      /** districts whose published answer (threshold, interval, standing) differs (api/runs/corrections.ts) */
      changedAnswers: z.optional(z.array(ChangedAnswerSchema)),
    }),
  ),
});
export type RunView = z.infer<typeof RunViewSchema>;

export const DistrictChangeSchema = z.object({
  thresholdPercent: nullableNumber,
  standingChanged: z.boolean(),
  shapeChanged: z.boolean(),
  significanceChanged: z.boolean(),
});
export type DistrictChange = z.infer<typeof DistrictChangeSchema>;

export const ReviewRowSchema = z.object({
  code: z.string(),
  name: z.string(),
  status: z.string(),
  standing: StandingSchema,
  shape: z.nullable(ShapeSchema),
  threshold: nullableNumber,
  gapPercent: nullableNumber,
  crossingYear: nullableNumber,
  uTestRejects: z.nullable(z.boolean()),
  intervalBounded: z.nullable(z.boolean()),
  lastYear: nullableNumber,
  previous: z.nullable(
    z.object({
      standing: StandingSchema,
      shape: z.nullable(ShapeSchema),
      threshold: nullableNumber,
      uTestRejects: z.nullable(z.boolean()),
    }),
  ),
  change: DistrictChangeSchema,
  note: nullableString,
});
export type ReviewRow = z.infer<typeof ReviewRowSchema>;

export const ReviewResponseSchema = z.object({
  runId: z.number(),
  track: TrackRefSchema,
  previousRunId: nullableNumber,
  /** the settings' threshold-shift limit (percent) the comparison marks moves against */
  thresholdShiftPercent: z.number(),
  districts: z.array(ReviewRowSchema),
});
export type ReviewResponse = z.infer<typeof ReviewResponseSchema>;

export const VARIANTS = ['main', 'no_controls', 'cubic', 'last20', 'level'] as const;
export const VariantSchema = z.enum(VARIANTS);
export type Variant = z.infer<typeof VariantSchema>;

const pValue = nullableNumber;
export const DiagnosticsSchema = z.object({
  durbinWatson: z.object({ statistic: z.number(), pValue }),
  breuschGodfrey: z.array(z.object({ order: z.number(), statistic: nullableNumber, df: z.number(), pValue })),
  breuschPagan: z.object({ statistic: nullableNumber, df: z.number(), pValue }),
  jarqueBera: z.object({ statistic: nullableNumber, skewness: nullableNumber, kurtosis: nullableNumber, pValue }),
  largestLeverage: z.nullable(z.object({ value: z.number(), year: z.number(), row: z.number() })),
  residualsByYear: z.array(z.object({ year: z.number(), residual: z.number() })),
});
export type Diagnostics = z.infer<typeof DiagnosticsSchema>;

/** A run's record of one district and variant: the published shape plus its residual diagnostics. */
export const RunEstimateRecordSchema = z.extend(EstimateRecordSchema, {
  variant: VariantSchema,
  diagnostics: z.nullable(DiagnosticsSchema),
});
export type RunEstimateRecord = z.infer<typeof RunEstimateRecordSchema>;

export const MovementSchema = z.object({
  previous: nullableNumber,
  current: nullableNumber,
  previousSpecOnNewData: nullableNumber,
  dataPart: nullableNumber,
  specPart: nullableNumber,
  softwareChanged: z.boolean(),
  previousSoftware: z.string(),
  specChanged: z.boolean(),
});
export type Movement = z.infer<typeof MovementSchema>;

export const DistrictReviewSchema = z.object({
  runId: z.number(),
  code: z.string(),
  records: z.array(RunEstimateRecordSchema),
  previousRunId: nullableNumber,
  previous: z.nullable(RunEstimateRecordSchema),
  movement: z.nullable(MovementSchema),
  note: z.nullable(AnalystNoteSchema),
});
export type DistrictReview = z.infer<typeof DistrictReviewSchema>;

/** POST /api/runs and /api/runs/:id/reproduce: the queued run (the first one), and every run started. */
const StartedRunSchema = z.object({ id: z.number(), state: RunStateSchema, track: z.string() });
export const RunStartedSchema = z.extend(StartedRunSchema, { runs: z.array(StartedRunSchema) });
export type RunStarted = z.infer<typeof RunStartedSchema>;

/** The body of POST /api/runs: one track's code, or 'all' for every active track (default: the headline track). */
export const RunStartInputSchema = z.object({ track: z.optional(z.string()) });
export type RunStartInput = z.infer<typeof RunStartInputSchema>;

export const PublishAnswerSchema = z.object({ previousRunId: nullableNumber, alerts: z.number(), mails: z.number() });
export type PublishAnswer = z.infer<typeof PublishAnswerSchema>;

/** PUT /api/runs/:id/districts/:code/note. */
export const NoteInputSchema = z.object({ note: z.string() });
