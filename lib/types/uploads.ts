// Shapes of the uploads API (api/uploads/present.ts, problems.ts, change-sets.ts).

export type UploadKind = 'file' | 'seed' | 'revert' | 'derivation' | 'boundaries';
export type UploadStatus = 'previewed' | 'committed' | 'reverted' | 'failed';

export type UploadCounts = {
  rowsRead: number;
  values: number;
  insert: number;
  change: number;
  unchanged: number;
  remove: number;
  derived: number;
  errors: number;
  warnings: number;
};

export type UploadSummary = {
  id: number;
  kind: UploadKind;
  status: UploadStatus;
  fileName: string | null;
  checksum: string | null;
  byteSize: number | null;
  format: 'long' | 'wide' | null;
  options: Record<string, unknown>;
  by: { userId: number | null; email: string | null } | null;
  note: string | null;
  createdAt: string;
  committedAt: string | null;
  version: number | null;
  revertsUploadId: number | null;
  revertedByUploadId: number | null;
  revertedAt: string | null;
  counts: UploadCounts;
  canCommit: boolean;
  canRevert: boolean;
};

export type KindCounts = { insert: number; change: number; unchanged: number };

export type UploadPreview = {
  format: 'long' | 'wide' | null;
  delimiter: string | null;
  decimalComma: boolean;
  rowsRead: number;
  values: number;
  blankLines: number;
  years: { first: number | null; last: number | null };
  totals: KindCounts;
  byIndicator: ({ indicator: string; name: string } & KindCounts)[];
  byDistrict: ({ district: string; name: string; isNew: boolean; indicators: Record<string, KindCounts> } & KindCounts)[];
  newDistricts: { code: string; name: string; line: number }[];
  derived: { indicator: string; insert: number; change: number; remove: number }[];
  expiresAt: string | null;
};

export type UploadProblem = {
  line: number | null;
  column: number | null;
  field: string | null;
  code: string;
  severity: 'error' | 'warning';
  reason: string;
};

/** POST /api/uploads and POST /api/uploads/:id/commit. */
export type UploadAnswer =
  | { noop: false; upload: UploadSummary; preview: UploadPreview; problems: UploadProblem[]; problemsTruncated: boolean; bulk?: boolean }
  | { noop: true; upload: UploadSummary; message: string };

/** The `details` of a 422 `upload_rejected`: nothing was written. */
export type UploadRejectionDetails = {
  uploadId: number | null;
  problems: UploadProblem[];
  errorCount: number;
  warningCount: number;
  truncated: boolean;
  preview: UploadPreview | null;
};

export type UploadListResponse = { uploads: UploadSummary[]; nextBefore: number | null };

export type UploadDetailResponse = { upload: UploadSummary; preview: UploadPreview | null; problems: UploadProblem[] };

export type RevertAnswer = {
  reverted: UploadSummary;
  revert: UploadSummary;
  restored: { changedBack: number; removed: number; reinserted: number; derived: number };
};

/** Options the analyst sets before a dry run (query parameters of POST /api/uploads). */
export type UploadOptions = { allowNewDistricts: boolean; decimalComma: boolean; changeFactor?: number };
