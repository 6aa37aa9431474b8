/**
 * A brief's content: what GET /api/briefs/district/:code and GET /api/briefs/region answer,
 * and what the server's PDF renderer draws. The server builds it once (api/briefs/*-content.ts,
 * every figure already rounded for reading by api/briefs/format.ts); the PDF and the
 * print-friendly view in the app both render this object, so they cannot say different things.
 */
import * as z from './kit';
import { nullableString } from './common';
import { PAPER_SIZES } from './settings';

/** Semantic colours of a chart; each renderer maps them to its own palette. */
export const BriefToneSchema = z.enum([
  'ink',
  'muted',
  'grid',
  'curve',
  'pooled',
  'band',
  'threshold',
  'latest',
  'point',
  'projection',
  // the region map: a standing's mark, its fill (a light tint), the land of other districts, the sea
  'approaching',
  'at_turn',
  'past_turn',
  'no_turn',
  'not_estimable',
  'approaching_fill',
  'at_turn_fill',
  'past_turn_fill',
  'no_turn_fill',
  'not_estimable_fill',
  'land',
  'sea',
]);
export type BriefTone = z.infer<typeof BriefToneSchema>;

export const ChartItemSchema = z.discriminatedUnion('kind', [
  z.object({
    kind: z.literal('path'),
    /** SVG path data in the scene's coordinates (origin top left, y down, points) */
    d: z.string(),
    stroke: z.optional(BriefToneSchema),
    fill: z.optional(BriefToneSchema),
    width: z.optional(z.number()),
    /** dash and gap lengths */
    dash: z.optional(z.tuple([z.number(), z.number()])),
    opacity: z.optional(z.number()),
  }),
  z.object({
    kind: z.literal('circle'),
    cx: z.number(),
    cy: z.number(),
    r: z.number(),
    fill: z.optional(BriefToneSchema),
    stroke: z.optional(BriefToneSchema),
    width: z.optional(z.number()),
    opacity: z.optional(z.number()),
  }),
  z.object({
    kind: z.literal('text'),
    x: z.number(),
    /** the text's baseline */
    y: z.number(),
    text: z.string(),
    size: z.number(),
    tone: BriefToneSchema,
    anchor: z.enum(['start', 'middle', 'end']),
    bold: z.optional(z.boolean()),
  }),
]);
export type ChartItem = z.infer<typeof ChartItemSchema>;

/** A chart as vectors: drawn with pdfkit paths in the PDF and with SVG in the app. */
export const ChartSceneSchema = z.object({
  width: z.number(),
  height: z.number(),
  title: z.string(),
  /** one sentence saying what the chart shows (alt text in the app) */
  description: z.string(),
  items: z.array(ChartItemSchema),
});
export type ChartScene = z.infer<typeof ChartSceneSchema>;

/** One labelled figure of a brief: a value and a line of detail under it. */
export const BriefFigureSchema = z.object({
  key: z.string(),
  label: z.string(),
  value: z.string(),
  detail: nullableString,
});
export type BriefFigure = z.infer<typeof BriefFigureSchema>;

/** Where the numbers came from, printed on every page. */
export const BriefTraceSchema = z.object({
  runId: z.number(),
  /** e.g. "3 December 2026, 14:05 (UTC)" in the region's time zone */
  publishedAt: z.string(),
  publishedAtIso: nullableString,
  dataVersion: z.string(),
  /** first 12 hex digits of the run's data hash */
  dataHash: z.string(),
  softwareVersion: z.string(),
  generatedAt: z.string(),
  timeZone: z.string(),
  /** the region's locale the figures are written in (BCP 47; the PDF's document language) */
  locale: z.optional(z.string()),
  /** "Run #12 · published … · data version 3 (hash 1a2b3c4d5e6f) · Crestwatch 0.1.0" */
  line: z.string(),
});
export type BriefTrace = z.infer<typeof BriefTraceSchema>;

export const BriefPaperSizeSchema = z.enum(PAPER_SIZES);
export type BriefPaperSize = z.infer<typeof BriefPaperSizeSchema>;

/** The track a brief reads (its watched indicator, from the catalogue). */
export const BriefTrackSchema = z.object({ code: z.string(), name: z.string() });
export type BriefTrack = z.infer<typeof BriefTrackSchema>;

/** One indicator the brief's model reads, with who publishes it and under which terms. */
export const BriefSourceLineSchema = z.object({
  code: z.string(),
  name: z.string(),
  unit: z.string(),
  source: nullableString,
  licence: nullableString,
  /** "PM2.5 annual mean concentration (µg/m³): Demo region statistics office (invented); licence: …" */
  line: z.string(),
});
export type BriefSourceLine = z.infer<typeof BriefSourceLineSchema>;

export const DistrictBriefContentSchema = z.object({
  kind: z.literal('district'),
  /** the track the brief reads (absent in briefs made before tracks) */
  track: z.optional(BriefTrackSchema),
  /** the indicators the model reads, each with its source and licence */
  sources: z.optional(z.array(BriefSourceLineSchema)),
  code: z.string(),
  name: z.string(),
  /** "District brief · D07 · published run #12 · 3 December 2026" */
  subtitle: z.string(),
  headline: z.string(),
  standing: z.object({ key: z.string(), label: z.string(), note: nullableString }),
  /** standing, threshold, income now, projected crossing, elasticity, shape */
  figures: z.array(BriefFigureSchema),
  charts: z.object({ curve: ChartSceneSchema, path: ChartSceneSchema }),
  /** Where the district lies among its neighbours (null: no boundaries loaded). */
  locator: z.optional(z.nullable(ChartSceneSchema)),
  /** "Threshold corrected in software version … on …" while the latest publish corrects an earlier one */
  correctionNotice: z.optional(nullableString),
  /** three plain-language lines */
  reading: z.array(z.string()),
  /** said when the regional pooled curve stands in for the district's own */
  substitute: nullableString,
  analystNote: nullableString,
  modelLine: z.string(),
  cautions: z.array(z.string()),
  trace: BriefTraceSchema,
  paperSize: BriefPaperSizeSchema,
  pdfPath: z.string(),
});
export type DistrictBriefContent = z.infer<typeof DistrictBriefContentSchema>;

const REGION_COLUMNS = ['code', 'name', 'standing', 'gap', 'threshold', 'interval', 'crossing'] as const;
export const RegionBriefRowSchema = z.object({
  code: z.string(),
  name: z.string(),
  standing: z.string(),
  gap: z.string(),
  threshold: z.string(),
  interval: z.string(),
  crossing: z.string(),
});
export type RegionBriefRow = z.infer<typeof RegionBriefRowSchema>;

export const RegionBriefContentSchema = z.object({
  kind: z.literal('region'),
  track: z.optional(BriefTrackSchema),
  sources: z.optional(z.array(BriefSourceLineSchema)),
  subtitle: z.string(),
  headline: z.string(),
  counts: z.array(z.object({ key: z.string(), label: z.string(), count: z.number() })),
  crossed: z.array(z.object({ code: z.string(), name: z.string(), text: z.string() })),
  /** said when the list is empty or there is nothing to compare with */
  crossedNote: nullableString,
  shifts: z.array(z.object({ code: z.string(), name: z.string(), text: z.string(), overLimit: z.boolean() })),
  shiftsNote: nullableString,
  pooled: z.object({ figures: z.array(BriefFigureSchema), chart: z.nullable(ChartSceneSchema), note: nullableString }),
  /** The standings map, the same scene as the region view's (null: no boundaries loaded). */
  map: z.optional(z.nullable(ChartSceneSchema)),
  table: z.object({
    columns: z.array(z.object({ key: z.enum(REGION_COLUMNS), label: z.string() })),
    rows: z.array(RegionBriefRowSchema),
  }),
  modelLine: z.string(),
  cautions: z.array(z.string()),
  trace: BriefTraceSchema,
  paperSize: BriefPaperSizeSchema,
  pdfPath: z.string(),
});
export type RegionBriefContent = z.infer<typeof RegionBriefContentSchema>;
