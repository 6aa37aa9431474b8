/**
 * Tracks: what the agency watches (an emissions indicator and its current model spec).
 * GET /api/tracks, POST /api/tracks, PATCH /api/tracks/:code, PUT /api/tracks/:code/spec.
 * Runs, published estimates, alerts, subscriptions and briefs belong to a track.
 */
import * as z from './kit';
import { isoTime, nullableNumber, nullableString } from './common';

export const TRACK_STATES = ['active', 'paused', 'archived'] as const;
export const TrackStateSchema = z.enum(TRACK_STATES);
export type TrackState = z.infer<typeof TrackStateSchema>;

/** An indicator as the catalogue describes it, with who publishes the series and under which terms. */
export const IndicatorLabelSchema = z.object({
  code: z.string(),
  name: z.string(),
  unit: z.string(),
  source: nullableString,
  licence: nullableString,
});
export type IndicatorLabel = z.infer<typeof IndicatorLabelSchema>;

/** A track as lists and pickers show it. */
export const TrackRefSchema = z.object({
  code: z.string(),
  name: z.string(),
  /** the emissions indicator the track watches, with its unit from the catalogue */
  indicator: IndicatorLabelSchema,
});
export type TrackRef = z.infer<typeof TrackRefSchema>;

export const TrackSchema = z.extend(TrackRefSchema, {
  /** the headline track opens first (a setting; exactly one track is the headline) */
  headline: z.boolean(),
  state: TrackStateSchema,
  /** the saved spec the track's next run uses */
  specId: z.number(),
  specName: z.string(),
  /** the track's latest published run, if any */
  publishedRunId: nullableNumber,
  publishedAt: z.nullable(isoTime),
  createdAt: isoTime,
});
export type Track = z.infer<typeof TrackSchema>;

export const TracksResponseSchema = z.object({ tracks: z.array(TrackSchema) });
export type TracksResponse = z.infer<typeof TracksResponseSchema>;
export const TrackAnswerSchema = z.object({ track: TrackSchema });
export type TrackAnswer = z.infer<typeof TrackAnswerSchema>;

/** POST /api/tracks (admin): the indicator is the saved spec's emissions indicator. */
export const TrackCreateInputSchema = z.object({ code: z.string(), name: z.string(), specId: z.number() });
export type TrackCreateInput = z.infer<typeof TrackCreateInputSchema>;

/** PATCH /api/tracks/:code (admin): rename, pause, resume, archive, or make it the headline. */
export const TrackPatchInputSchema = z.object({
  name: z.optional(z.string()),
  state: z.optional(TrackStateSchema),
  headline: z.optional(z.literal(true)),
});
export type TrackPatchInput = z.infer<typeof TrackPatchInputSchema>;

/** PUT /api/tracks/:code/spec (staff): take up a saved spec whose emissions indicator is the track's. */
export const TrackSpecInputSchema = z.object({ specId: z.number() });
export type TrackSpecInput = z.infer<typeof TrackSpecInputSchema>;
