/**
 * Published estimates: GET /api/region, /api/districts/:code/estimate and /history. They are
 * built on the server from the run's per-district record (api/runs/estimate-record.ts) and its
 * card-level summary (summaryOf in api/estimates/service.ts).
 */
import * as z from './kit';
import { IndicatorLabelSchema, TrackRefSchema } from './tracks';
import { isoTime, nullableNumber, nullableString } from './common';

export const STANDINGS = ['approaching', 'at_turn', 'past_turn', 'no_turn', 'not_estimable'] as const;
export const StandingSchema = z.enum(STANDINGS);
export type Standing = z.infer<typeof StandingSchema>;

export const SHAPES = ['inverted_u', 'u', 'n_shape', 'inverted_n', 'increasing', 'decreasing', 'flat'] as const;
export const ShapeSchema = z.enum(SHAPES);
export type Shape = z.infer<typeof ShapeSchema>;

export const FiellerKindSchema = z.enum(['bounded', 'two_rays', 'whole_line']);
export type FiellerKind = z.infer<typeof FiellerKindSchema>;
export const EstimateStatusSchema = z.enum(['ok', 'not_estimable', 'substitute']);
export type EstimateStatus = z.infer<typeof EstimateStatusSchema>;
export const ProjectionStatusSchema = z.enum(['projected', 'already_past', 'not_on_current_trend', 'no_threshold']);
export type ProjectionStatus = z.infer<typeof ProjectionStatusSchema>;
export const IntervalMethodSchema = z.enum(['fieller', 'delta']);
export type IntervalMethod = z.infer<typeof IntervalMethodSchema>;

/** The card-level summary of a district's main estimate (`summaryOf` on the server). */
export const EstimateSummarySchema = z.object({
  status: EstimateStatusSchema,
  standing: StandingSchema,
  /** null when there is no turning point to bound */
  intervalBounded: z.nullable(z.boolean()),
  intervalMethod: IntervalMethodSchema,
  shape: z.nullable(ShapeSchema),
  /** X* in real units (income per person); null without a turning point */
  threshold: nullableNumber,
  thresholdLo: nullableNumber,
  thresholdHi: nullableNumber,
  fiellerKind: z.nullable(FiellerKindSchema),
  extrapolated: z.boolean(),
  gapPercent: nullableNumber,
  crossingYear: nullableNumber,
  crossingEarliest: nullableNumber,
  crossingLatest: nullableNumber,
  projectionStatus: z.nullable(ProjectionStatusSchema),
  lastYear: nullableNumber,
  levelNow: nullableNumber,
});
export type EstimateSummary = z.infer<typeof EstimateSummarySchema>;

/** The model part of a run's spec as answers carry it. */
export const ModelSpecViewSchema = z.object({
  form: z.enum(['quadratic', 'cubic']),
  transform: z.enum(['log', 'level']),
  covariance: z.string(),
  /** confidence level, e.g. 0.95 */
  level: z.number(),
  alpha: z.number(),
  intervalMethod: IntervalMethodSchema,
  controls: z.array(z.string()),
  trendYears: z.optional(z.number()),
  lag: z.optional(nullableNumber),
});
export type ModelSpecView = z.infer<typeof ModelSpecViewSchema>;

export const SelectionSchema = z.object({
  driver: z.string(),
  emissions: z.string(),
  controls: z.array(z.string()),
  firstYear: nullableNumber,
  lastYear: nullableNumber,
});

export const PublishedRunMetaSchema = z.object({
  id: z.number(),
  publishedAt: isoTime,
  specName: z.string(),
  model: ModelSpecViewSchema,
  selection: SelectionSchema,
  dataVersion: z.number(),
  dataHash: z.string(),
  softwareVersion: z.string(),
  /** the run's emissions and driver indicators with their units from the catalogue */
  units: z.object({ emissions: IndicatorLabelSchema, driver: IndicatorLabelSchema }),
});
export type PublishedRunMeta = z.infer<typeof PublishedRunMetaSchema>;

const FiellerEndsSchema = z.object({ kind: FiellerKindSchema, levelLo: nullableNumber, levelHi: nullableNumber });

export const ThresholdRecordSchema = z.object({
  x: z.number(),
  level: nullableNumber,
  kind: z.enum(['peak', 'trough']),
  inRange: z.boolean(),
  extrapolated: z.boolean(),
  intervalBounded: z.boolean(),
  delta: z.object({ se: nullableNumber, levelLo: nullableNumber, levelHi: nullableNumber }),
  fieller: FiellerEndsSchema,
});
export type ThresholdRecord = z.infer<typeof ThresholdRecordSchema>;

export const XYSchema = z.object({ x: z.number(), y: z.number() });
export type XY = z.infer<typeof XYSchema>;

/**
 * Why a district's curve could not be read (api/estimation/types.ts CurveNotEstimable); input
 * errors of the engine may also appear, hence a plain string. `numerical_failure`: the result
 * failed its own check (e.g. a cubic Fieller set that did not contain its turning point) and
 * no number is shown.
 */
export const ReasonSchema = z.object({ code: z.string(), message: z.string() });

/** One district's estimate under one variant (api/runs/estimate-record.ts). */
export const EstimateRecordSchema = z.object({
  variant: z.string(),
  status: EstimateStatusSchema,
  reason: z.nullable(ReasonSchema),
  model: z.extend(ModelSpecViewSchema, { lag: nullableNumber }),
  n: z.number(),
  k: z.number(),
  firstYear: nullableNumber,
  lastYear: nullableNumber,
  droppedYears: z.array(z.number()),
  rSquared: nullableNumber,
  range: z.nullable(z.object({ levelMin: z.number(), levelMax: z.number(), levelNow: z.number(), xNow: z.number() })),
  threshold: z.nullable(ThresholdRecordSchema),
  turningPoints: z.array(ThresholdRecordSchema),
  standing: z.object({
    standing: StandingSchema,
    intervalMethod: IntervalMethodSchema,
    intervalBounded: z.nullable(z.boolean()),
    levelLo: nullableNumber,
    levelHi: nullableNumber,
    note: nullableString,
  }),
  shape: z.nullable(z.object({ shape: ShapeSchema, decidedBy: z.string(), notes: z.array(z.string()) })),
  uTest: z.nullable(
    z.object({ statistic: nullableNumber, pValue: nullableNumber, rejects: z.boolean(), orientation: z.string() }),
  ),
  gapPercent: nullableNumber,
  elasticity: z.nullable(
    z.object({ value: nullableNumber, se: nullableNumber, lo: nullableNumber, hi: nullableNumber }),
  ),
  trendPerYear: nullableNumber,
  projection: z.nullable(
    z.object({
      status: ProjectionStatusSchema,
      crossingYear: nullableNumber,
      earliest: nullableNumber,
      latest: nullableNumber,
      note: nullableString,
    }),
  ),
  /** observed points in real units, year order */
  points: z.array(z.object({ year: z.number(), x: z.number(), y: z.number() })),
  /** fitted curve over the observed range, real units */
  curve: z.array(XYSchema),
  /** the regional pooled curve through this district's mean point, same axes */
  pooledCurve: z.array(XYSchema),
});
export type EstimateRecord = z.infer<typeof EstimateRecordSchema>;

export const VARIANT_NAMES = ['no_controls', 'cubic', 'last20', 'level'] as const;
export const VariantNameSchema = z.enum(VARIANT_NAMES);
export type VariantName = z.infer<typeof VariantNameSchema>;

export const VariantSummarySchema = z.extend(EstimateSummarySchema, {
  variant: VariantNameSchema,
  reason: z.nullable(ReasonSchema),
});
export type VariantSummary = z.infer<typeof VariantSummarySchema>;

export const AnalystNoteSchema = z.object({ note: z.string(), authorEmail: nullableString, updatedAt: isoTime });

export const DistrictRefSchema = z.object({ code: z.string(), name: z.string() });

/** One compact row per active track at the top of a district card. */
export const TrackStandingSchema = z.extend(TrackRefSchema, {
  /** null when the track has no published run or the district is not in it */
  standing: z.nullable(StandingSchema),
  gapPercent: nullableNumber,
  shape: z.nullable(ShapeSchema),
  runId: nullableNumber,
});
export type TrackStanding = z.infer<typeof TrackStandingSchema>;

export const DistrictEstimateResponseSchema = z.object({
  district: DistrictRefSchema,
  /** the track this card shows (?track=, else the headline track) */
  track: TrackRefSchema,
  /** every active track's standing here, the headline track first */
  tracks: z.array(TrackStandingSchema),
  run: z.nullable(PublishedRunMetaSchema),
  main: z.nullable(EstimateRecordSchema),
  variants: z.array(VariantSummarySchema),
  /** the reviewing analyst's note on this district in the published run */
  note: z.nullable(AnalystNoteSchema),
  /** Dated notice while the latest publish corrected this district's answer (api/runs/corrections.ts). */
  correction: z.optional(
    z.nullable(
      z.object({
        softwareVersion: z.string(),
        previousSoftware: z.string(),
        date: z.string(),
        fields: z.array(z.string()),
        text: z.string(),
      }),
    ),
  ),
});
export type DistrictEstimateResponse = z.infer<typeof DistrictEstimateResponseSchema>;

/**
 * A district's published estimate as the region list, map and counts show it: the standing
 * and its marks, the gap and the crossing; nothing the card alone shows (the threshold's
 * interval, its Fieller kind, the crossing's range, the current level). Figures are
 * rounded to the precision shown (api/estimates/region-rows.ts); the card has them all.
 */
export const RegionEstimateSchema = z.pick(EstimateSummarySchema, {
  status: true,
  standing: true,
  intervalBounded: true,
  shape: true,
  threshold: true,
  gapPercent: true,
  crossingYear: true,
  projectionStatus: true,
});
export type RegionEstimate = z.infer<typeof RegionEstimateSchema>;

export const RegionDistrictSchema = z.object({
  code: z.string(),
  name: z.string(),
  /** the years of data (the list row's coverage) */
  firstYear: nullableNumber,
  lastYear: nullableNumber,
  nYears: z.number(),
  estimate: z.nullable(RegionEstimateSchema),
});
export type RegionDistrict = z.infer<typeof RegionDistrictSchema>;

export const RegionResponseSchema = z.object({
  /** the track this answer shows (?track=, else the headline track) */
  track: TrackRefSchema,
  run: z.nullable(PublishedRunMetaSchema),
  counts: z.partialRecord(StandingSchema, z.number()),
  pooled: z.nullable(
    z.object({
      shape: z.nullable(ShapeSchema),
      threshold: nullableNumber,
      fieller: z.nullable(FiellerEndsSchema),
      terms: z.optional(z.array(z.string())),
      coefficients: z.optional(z.array(z.number())),
      range: z.optional(z.object({ levelMin: z.number(), levelMax: z.number() })),
    }),
  ),
  districts: z.array(RegionDistrictSchema),
});
export type RegionResponse = z.infer<typeof RegionResponseSchema>;

export const HistoryEntrySchema = z.extend(EstimateSummarySchema, {
  runId: z.number(),
  publishedAt: isoTime,
  dataVersion: z.number(),
});
export type HistoryEntry = z.infer<typeof HistoryEntrySchema>;
export const DistrictHistoryResponseSchema = z.object({
  district: DistrictRefSchema,
  /** the track whose published runs these are (?track=, else the headline track) */
  track: z.optional(TrackRefSchema),
  history: z.array(HistoryEntrySchema),
});
export type DistrictHistoryResponse = z.infer<typeof DistrictHistoryResponseSchema>;

/**
 * The regional pooled curve as a run stores it (the engine's panel fit, JSON). Only the parts
 * that answers read are spelled out; the rest of the fit is kept as it is.
 */
const PooledTurningPointSchema = z.looseObject({
  x: z.number(),
  level: nullableNumber,
  kind: z.enum(['peak', 'trough']),
  fieller: FiellerEndsSchema,
});
export const PooledCurveSchema = z.union([
  z.looseObject({
    status: z.literal('ok'),
    terms: z.array(z.string()),
    coefficients: z.array(z.number()),
    n: z.number(),
    districts: z.number(),
    range: z.looseObject({ xMin: z.number(), xMax: z.number(), levelMin: z.number(), levelMax: z.number() }),
    turningPoints: z.array(PooledTurningPointSchema),
    shape: z.looseObject({ shape: ShapeSchema, decidedBy: z.string(), notes: z.array(z.string()) }),
  }),
  z.looseObject({
    status: z.literal('not_estimable'),
    n: z.number(),
    k: z.number(),
    reason: z.looseObject({ code: z.string(), message: z.string() }),
  }),
]);
export type PooledCurve = z.infer<typeof PooledCurveSchema>;
