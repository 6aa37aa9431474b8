// District boundaries (api/boundaries): the upload's preview or commit, the version history
// and the simplified GeoJSON the map draws. GeoJSON keeps every member it has (loose
// objects): the map reads geometry and properties, and RFC 7946 allows foreign members.
import { isoTime, nullableNumber, nullableString } from './common';
import * as z from './kit';

export const BoundaryFeatureSchema = z.looseObject({
  type: z.literal('Feature'),
  properties: z.looseObject({ code: z.string(), name: z.string() }),
});

export const BoundaryCollectionSchema = z.looseObject({
  type: z.literal('FeatureCollection'),
  features: z.array(BoundaryFeatureSchema),
});

export const BoundaryProblemCodeSchema = z.enum([
  'not_feature_collection',
  'foreign_crs',
  'not_feature',
  'no_code',
  'duplicate_code',
  'unknown_code',
  'not_polygon',
  'bad_coordinates',
  'short_ring',
  'unclosed_ring',
  'out_of_range',
  'too_many_vertices',
  'self_intersection',
  'repaired',
  'dropped_z',
  'no_boundary',
  'crs84_member',
]);
export type BoundaryProblemCode = z.infer<typeof BoundaryProblemCodeSchema>;

/** One problem of a boundary file: the feature (index in `features`, from 0) and its code when known, and why. */
export const BoundaryProblemSchema = z.object({
  feature: nullableNumber,
  code: nullableString,
  problem: BoundaryProblemCodeSchema,
  severity: z.enum(['error', 'warning']),
  reason: z.string(),
});
export type BoundaryProblem = z.infer<typeof BoundaryProblemSchema>;

/**
 * A dry run's preview or a commit: counts and the problems found, by feature (the first
 * 200; the counts cover them all), the first features as they would be written, and the
 * districts the file leaves without a boundary. A refused commit (422
 * `boundaries_rejected`) carries the same fields as its details.
 */
export const BoundaryUploadAnswerSchema = z.object({
  accepted: z.boolean(),
  committed: z.boolean(),
  versionId: nullableNumber,
  uploadId: nullableNumber,
  dataVersion: nullableNumber,
  counts: z.object({
    features: z.number(),
    vertices: z.number(),
    matched: z.number(),
    missing: z.number(),
    repaired: z.number(),
    errors: z.number(),
    warnings: z.number(),
  }),
  problems: z.array(BoundaryProblemSchema),
  preview: z.array(z.object({ feature: z.number(), code: z.string(), name: z.string(), areaKm2: z.number() })),
  missingDistricts: z.array(z.string()),
});
export type BoundaryUploadAnswer = z.infer<typeof BoundaryUploadAnswerSchema>;

/** What the screen sends with a boundary file (query parameters of POST /api/boundaries). */
export type BoundaryUploadOptions = { codeProperty: string; repair: boolean; commit: boolean };

/** One boundary version: who loaded it, when, its counts, and whether it is the one in force. */
export const BoundaryVersionSchema = z.object({
  id: z.number(),
  uploadId: z.number(),
  dataVersion: nullableNumber,
  status: z.string(),
  fileName: nullableString,
  userEmail: nullableString,
  createdAt: isoTime,
  codeProperty: z.string(),
  features: z.number(),
  vertices: z.number(),
  repaired: z.number(),
  missing: z.number(),
  current: z.boolean(),
});
export type BoundaryVersion = z.infer<typeof BoundaryVersionSchema>;

/** GET /api/boundaries/versions: newest first. */
export const BoundaryVersionsSchema = z.object({ versions: z.array(BoundaryVersionSchema) });
export type BoundaryVersions = z.infer<typeof BoundaryVersionsSchema>;

/** POST /api/boundaries/versions/:id/revert: the reverted version, the revert's change set, the version now in force. */
export const BoundaryRevertAnswerSchema = z.object({
  reverted: z.nullable(BoundaryVersionSchema),
  revertUploadId: z.number(),
  dataVersion: nullableNumber,
  restored: z.object({ changedBack: z.number(), removed: z.number(), reinserted: z.number(), derived: z.number() }),
  currentVersionId: nullableNumber,
});
export type BoundaryRevertAnswer = z.infer<typeof BoundaryRevertAnswerSchema>;
