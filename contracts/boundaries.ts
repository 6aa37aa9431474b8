// District boundaries (api/boundaries): the upload's preview or commit, the version history
// and the simplified GeoJSON the map draws. GeoJSON keeps every member it has (loose
// objects): the map reads geometry and properties, and RFC 7946 allows foreign members.
import { isoTime, nullableNumber } from './common';
import * as z from './kit';

export const BoundaryFeatureSchema = z.looseObject({
  type: z.literal('Feature'),
  properties: z.looseObject({ code: z.string(), name: z.string() }),
});

export const BoundaryCollectionSchema = z.looseObject({
  type: z.literal('FeatureCollection'),
  features: z.array(BoundaryFeatureSchema),
});

/** A dry run's preview or a commit: counts and the problems found, by feature. */
export const BoundaryUploadAnswerSchema = z.looseObject({
  committed: z.boolean(),
  uploadId: z.optional(nullableNumber),
  versionId: z.optional(nullableNumber),
});

export const BoundaryVersionsSchema = z.looseObject({
  versions: z.array(z.looseObject({ id: z.number(), createdAt: z.optional(isoTime) })),
});

export const BoundaryRevertAnswerSchema = z.looseObject({
  revertUploadId: z.optional(nullableNumber),
});
