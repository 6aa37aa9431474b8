// Shapes of the runs API (api/runs/service.ts, estimate-record.ts, alerts/compare.ts). The
// per-district record is the published one (lib/estimate-types.ts) with its diagnostics.
import type { EstimateRecord, Shape, Standing } from '@/lib/estimate-types';

export type RunState = 'queued' | 'running' | 'in_review' | 'published' | 'discarded' | 'failed';

export type RunListItem = {
  id: number;
  state: RunState;
  trigger: string;
  specName: string;
  createdAt: string;
  finishedAt: string | null;
  publishedAt: string | null;
  districts: number | null;
  error: string | null;
};

export type RunListResponse = { runs: RunListItem[] };

export type RunSpecSnapshot = {
  savedSpecId: number;
  name: string;
  selection: { emissions: string; driver: string; controls: string[]; firstYear: number | null; lastYear: number | null };
  model: { form: string; transform: string; covariance: string; level: number; alpha: number; intervalMethod: string; [key: string]: unknown };
};

export type RunView = {
  id: number;
  state: RunState;
  trigger: string;
  spec: RunSpecSnapshot;
  specId: number;
  dataVersion: number | null;
  dataHash: string | null;
  dataRows: number | null;
  softwareVersion: string;
  createdAt: string;
  startedAt: string | null;
  finishedAt: string | null;
  publishedAt: string | null;
  discardedAt: string | null;
  error: string | null;
  progress: { chunksDone: number; chunksTotal: number | null; districts: number | null };
  timings: Record<string, number> | null;
  standingCounts: Record<string, number> | null;
  pooled: { status: string; shape: string | null; threshold: { level: number | null } | null; n: number | null; districts: number | null } | null;
  reproduction: {
    of: number;
    identical: boolean | null;
    differences: number;
    /** the reproduction ran on another software version than the original */
    softwareChanged?: boolean;
    originalSoftware?: string | null;
    /** districts whose published answer (threshold, interval, standing) differs (api/runs/corrections.ts) */
    changedAnswers?: ChangedAnswer[];
  } | null;
};

export type ChangedAnswer = {
  code: string;
  name: string;
  fields: ('status' | 'threshold' | 'interval' | 'standing')[];
  before: { status: string; standing: string; threshold: number | null; intervalLo: number | null; intervalHi: number | null } | null;
  after: { status: string; standing: string; threshold: number | null; intervalLo: number | null; intervalHi: number | null } | null;
};

export type DistrictChange = {
  thresholdPercent: number | null;
  standingChanged: boolean;
  shapeChanged: boolean;
  significanceChanged: boolean;
};

export type ReviewRow = {
  code: string;
  name: string;
  status: string;
  standing: Standing;
  shape: Shape | null;
  threshold: number | null;
  gapPercent: number | null;
  crossingYear: number | null;
  uTestRejects: boolean | null;
  intervalBounded: boolean | null;
  lastYear: number | null;
  previous: { standing: Standing; shape: Shape | null; threshold: number | null; uTestRejects: boolean | null } | null;
  change: DistrictChange;
  note: string | null;
};

export type ReviewResponse = { runId: number; previousRunId: number | null; districts: ReviewRow[] };

export type Variant = 'main' | 'no_controls' | 'cubic' | 'last20' | 'level';

export type Diagnostics = {
  durbinWatson: { statistic: number; pValue: number | null };
  breuschGodfrey: { order: number; statistic: number | null; df: number; pValue: number | null }[];
  breuschPagan: { statistic: number | null; df: number; pValue: number | null };
  jarqueBera: { statistic: number | null; skewness: number | null; kurtosis: number | null; pValue: number | null };
  largestLeverage: { value: number; year: number; row: number } | null;
  residualsByYear: { year: number; residual: number }[];
};

/** A run's record of one district and variant: the published shape plus its residual diagnostics. */
export type RunEstimateRecord = Omit<EstimateRecord, 'variant'> & { variant: Variant; diagnostics: Diagnostics | null };

export type Movement = {
  previous: number | null;
  current: number | null;
  previousSpecOnNewData: number | null;
  dataPart: number | null;
  specPart: number | null;
  softwareChanged: boolean;
  previousSoftware: string;
  specChanged: boolean;
};

export type DistrictReview = {
  runId: number;
  code: string;
  records: RunEstimateRecord[];
  previousRunId: number | null;
  previous: RunEstimateRecord | null;
  movement: Movement | null;
  note: { note: string; authorEmail: string | null; updatedAt: string } | null;
};

export type PublishAnswer = { previousRunId: number | null; alerts: number; mails: number };
