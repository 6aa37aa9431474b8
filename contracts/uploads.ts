/** Uploads: POST /api/uploads, /:id/commit, /:id/revert, GET /api/uploads[/:id] (api/uploads/present.ts, problems.ts, change-sets.ts). */
import * as z from './kit';
import { isoTime, nullableNumber, nullableString } from './common';

export const UploadKindSchema = z.enum(['file', 'seed', 'revert', 'derivation', 'boundaries']);
export type UploadKind = z.infer<typeof UploadKindSchema>;
export const UploadStatusSchema = z.enum(['previewed', 'committed', 'reverted', 'failed']);
export type UploadStatus = z.infer<typeof UploadStatusSchema>;
const FormatSchema = z.nullable(z.enum(['long', 'wide']));

export const UploadCountsSchema = z.object({
  rowsRead: z.number(),
  values: z.number(),
  insert: z.number(),
  change: z.number(),
  unchanged: z.number(),
  remove: z.number(),
  derived: z.number(),
  errors: z.number(),
  warnings: z.number(),
});
export type UploadCounts = z.infer<typeof UploadCountsSchema>;

export const UploadSummarySchema = z.object({
  id: z.number(),
  kind: UploadKindSchema,
  status: UploadStatusSchema,
  fileName: nullableString,
  checksum: nullableString,
  byteSize: nullableNumber,
  format: FormatSchema,
  options: z.record(z.string(), z.unknown()),
  by: z.nullable(z.object({ userId: nullableNumber, email: nullableString })),
  note: nullableString,
  createdAt: isoTime,
  committedAt: z.nullable(isoTime),
  version: nullableNumber,
  revertsUploadId: nullableNumber,
  revertedByUploadId: nullableNumber,
  revertedAt: z.nullable(isoTime),
  counts: UploadCountsSchema,
  canCommit: z.boolean(),
  canRevert: z.boolean(),
});
export type UploadSummary = z.infer<typeof UploadSummarySchema>;

const kindCounts = { insert: z.number(), change: z.number(), unchanged: z.number() };
export const KindCountsSchema = z.object(kindCounts);
export type KindCounts = z.infer<typeof KindCountsSchema>;

export const UploadPreviewSchema = z.object({
  format: FormatSchema,
  delimiter: nullableString,
  decimalComma: z.boolean(),
  rowsRead: z.number(),
  values: z.number(),
  blankLines: z.number(),
  years: z.object({ first: nullableNumber, last: nullableNumber }),
  totals: KindCountsSchema,
  byIndicator: z.array(z.object({ indicator: z.string(), name: z.string(), ...kindCounts })),
  byDistrict: z.array(
    z.object({
      district: z.string(),
      name: z.string(),
      isNew: z.boolean(),
      indicators: z.record(z.string(), KindCountsSchema),
      ...kindCounts,
    }),
  ),
  newDistricts: z.array(z.object({ code: z.string(), name: z.string(), line: z.number() })),
  derived: z.array(z.object({ indicator: z.string(), insert: z.number(), change: z.number(), remove: z.number() })),
  expiresAt: z.nullable(isoTime),
});
export type UploadPreview = z.infer<typeof UploadPreviewSchema>;

/** One problem of a file: where it is (line, column, header name), its stable code and its reason. */
export const UploadProblemSchema = z.object({
  line: nullableNumber,
  column: nullableNumber,
  field: nullableString,
  code: z.string(),
  severity: z.enum(['error', 'warning']),
  reason: z.string(),
});
export type UploadProblem = z.infer<typeof UploadProblemSchema>;

/** POST /api/uploads and POST /api/uploads/:id/commit. */
export const UploadAnswerSchema = z.discriminatedUnion('noop', [
  z.object({
    noop: z.literal(false),
    upload: UploadSummarySchema,
    preview: UploadPreviewSchema,
    problems: z.array(UploadProblemSchema),
    problemsTruncated: z.boolean(),
    bulk: z.optional(z.boolean()),
    /** milliseconds per step (receive, read, check, merge) and whether the merge took the bulk path */
    timings: z.optional(
      z.object({
        receiveMs: z.optional(z.number()),
        readMs: z.optional(z.number()),
        checkMs: z.optional(z.number()),
        mergeMs: z.optional(z.number()),
        bulkPath: z.optional(z.boolean()),
      }),
    ),
  }),
  /** The same file was loaded before: `upload` is that earlier upload; nothing changed. */
  z.object({ noop: z.literal(true), upload: UploadSummarySchema, message: z.string() }),
]);
export type UploadAnswer = z.infer<typeof UploadAnswerSchema>;

/** The server's phases of an upload, in order: read and check each row, check against stored data, merge. */
export const UPLOAD_PHASES = ['reading', 'checking', 'merging'] as const;
export const UploadPhaseSchema = z.enum(UPLOAD_PHASES);
export type UploadPhase = z.infer<typeof UploadPhaseSchema>;

/** Where a failed or refused upload stopped: its phase, and the line of the first error (null when no line applies). */
export const UploadStopSchema = z.object({ phase: UploadPhaseSchema, line: nullableNumber });
export type UploadStop = z.infer<typeof UploadStopSchema>;

/** What a phase has counted so far (rows and values read; values new, changed and unchanged once checked). */
export const UploadPhaseCountsSchema = z.object({
  bytesRead: z.number(),
  bytesTotal: z.number(),
  rowsRead: z.number(),
  values: z.number(),
  insert: nullableNumber,
  change: nullableNumber,
  unchanged: nullableNumber,
  derived: nullableNumber,
});
export type UploadPhaseCounts = z.infer<typeof UploadPhaseCountsSchema>;

/** GET /api/uploads/progress/:key: an upload's progress, under the key its client chose (?progress=key). */
export const UploadProgressSchema = z.object({
  key: z.string(),
  /** `done` once answered; `failed` when refused or broken (then `stoppedAt` says where). */
  state: z.enum(['running', 'done', 'failed']),
  phase: UploadPhaseSchema,
  /** The phases entered so far, in order, each with when it began (ms since the upload started). */
  phases: z.array(z.object({ phase: UploadPhaseSchema, atMs: z.number() })),
  counts: UploadPhaseCountsSchema,
  commit: z.boolean(),
  stoppedAt: z.nullable(UploadStopSchema),
});
export type UploadProgress = z.infer<typeof UploadProgressSchema>;

/** The `details` of a 422 `upload_rejected`: nothing was written. */
export const UploadRejectionDetailsSchema = z.object({
  uploadId: nullableNumber,
  problems: z.array(UploadProblemSchema),
  errorCount: z.number(),
  warningCount: z.number(),
  truncated: z.boolean(),
  preview: z.nullable(UploadPreviewSchema),
  /** Where the work stopped: the phase, and the line of the first error when there is one. */
  stoppedAt: z.optional(UploadStopSchema),
});
export type UploadRejectionDetails = z.infer<typeof UploadRejectionDetailsSchema>;

export const UploadListResponseSchema = z.object({ uploads: z.array(UploadSummarySchema), nextBefore: nullableNumber });
export type UploadListResponse = z.infer<typeof UploadListResponseSchema>;

export const UploadDetailResponseSchema = z.object({
  upload: UploadSummarySchema,
  preview: z.nullable(UploadPreviewSchema),
  problems: z.array(UploadProblemSchema),
});
export type UploadDetailResponse = z.infer<typeof UploadDetailResponseSchema>;

export const RevertAnswerSchema = z.object({
  reverted: UploadSummarySchema,
  revert: UploadSummarySchema,
  restored: z.object({ changedBack: z.number(), removed: z.number(), reinserted: z.number(), derived: z.number() }),
});
export type RevertAnswer = z.infer<typeof RevertAnswerSchema>;

/** Options the analyst sets before a dry run (query parameters of POST /api/uploads). */
export type UploadOptions = { allowNewDistricts: boolean; decimalComma: boolean; changeFactor?: number };
