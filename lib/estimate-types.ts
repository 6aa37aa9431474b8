// Shapes of the published-estimate answers as the client reads them: GET /api/region,
// /api/districts/:code/estimate, /history, /alerts, GET /api/alerts and /api/subscriptions.
// They mirror api/estimates/service.ts (summaryOf, publishedRunMeta) and
// api/runs/estimate-record.ts (EstimateRecord); only the fields screens read are typed.

export const STANDINGS = ['approaching', 'at_turn', 'past_turn', 'no_turn', 'not_estimable'] as const;
export type Standing = (typeof STANDINGS)[number];

export const SHAPES = ['inverted_u', 'u', 'n_shape', 'inverted_n', 'increasing', 'decreasing', 'flat'] as const;
export type Shape = (typeof SHAPES)[number];

/**
 * Why a district's curve could not be read (api/estimation/types.ts CurveNotEstimable);
 * input-error codes of the engine may also appear, hence the open end.
 * `numerical_failure`: the result failed its own check (e.g. a cubic Fieller set that did
 * not contain its turning point) and no number is shown.
 */
export type NotEstimableCode =
  | 'too_few_rows' | 'rank_deficient' | 'covariance_undefined' | 'numerical_failure' | (string & Record<never, never>);

export type FiellerKind = 'bounded' | 'two_rays' | 'whole_line';
export type EstimateStatus = 'ok' | 'not_estimable' | 'substitute';
export type ProjectionStatus = 'projected' | 'already_past' | 'not_on_current_trend' | 'no_threshold';
export type IntervalMethod = 'fieller' | 'delta';

/** The card-level summary of a district's main estimate (`summaryOf` on the server). */
export type EstimateSummary = {
  status: EstimateStatus;
  standing: Standing;
  /** null when there is no turning point to bound. */
  intervalBounded: boolean | null;
  intervalMethod: IntervalMethod;
  shape: Shape | null;
  /** X* in real units (income per person); null without a turning point. */
  threshold: number | null;
  thresholdLo: number | null;
  thresholdHi: number | null;
  fiellerKind: FiellerKind | null;
  extrapolated: boolean;
  gapPercent: number | null;
  crossingYear: number | null;
  crossingEarliest: number | null;
  crossingLatest: number | null;
  projectionStatus: ProjectionStatus | null;
  lastYear: number | null;
  levelNow: number | null;
};

export type ModelSpecView = {
  form: 'quadratic' | 'cubic';
  transform: 'log' | 'level';
  covariance: string;
  /** Confidence level, e.g. 0.95. */
  level: number;
  alpha: number;
  intervalMethod: IntervalMethod;
  controls: string[];
  trendYears?: number;
  lag?: number | null;
};

export type PublishedRunMeta = {
  id: number;
  publishedAt: string;
  specName: string;
  model: ModelSpecView;
  selection: { driver: string; emissions: string; controls: string[]; firstYear: number | null; lastYear: number | null };
  dataVersion: number;
  dataHash: string;
  softwareVersion: string;
};

export type ThresholdRecord = {
  x: number;
  level: number | null;
  kind: 'peak' | 'trough';
  inRange: boolean;
  extrapolated: boolean;
  intervalBounded: boolean;
  delta: { se: number | null; levelLo: number | null; levelHi: number | null };
  fieller: { kind: FiellerKind; levelLo: number | null; levelHi: number | null };
};

export type XY = { x: number; y: number };

/** One district's estimate under one variant (api/runs/estimate-record.ts). */
export type EstimateRecord = {
  variant: string;
  status: EstimateStatus;
  reason: { code: NotEstimableCode; message: string } | null;
  model: ModelSpecView & { lag: number | null };
  n: number;
  k: number;
  firstYear: number | null;
  lastYear: number | null;
  droppedYears: number[];
  rSquared: number | null;
  range: { levelMin: number; levelMax: number; levelNow: number; xNow: number } | null;
  threshold: ThresholdRecord | null;
  turningPoints: ThresholdRecord[];
  standing: {
    standing: Standing;
    intervalMethod: IntervalMethod;
    intervalBounded: boolean | null;
    levelLo: number | null;
    levelHi: number | null;
    note: string | null;
  };
  shape: { shape: Shape; decidedBy: string; notes: string[] } | null;
  uTest: { statistic: number | null; pValue: number | null; rejects: boolean; orientation: string } | null;
  gapPercent: number | null;
  elasticity: { value: number | null; se: number | null; lo: number | null; hi: number | null } | null;
  trendPerYear: number | null;
  projection: {
    status: ProjectionStatus;
    crossingYear: number | null;
    earliest: number | null;
    latest: number | null;
    note: string | null;
  } | null;
  /** Observed points in real units, year order. */
  points: { year: number; x: number; y: number }[];
  /** Fitted curve over the observed range, real units. */
  curve: XY[];
  /** The regional pooled curve through this district's mean point, same axes. */
  pooledCurve: XY[];
};

export type VariantName = 'no_controls' | 'cubic' | 'last20' | 'level';

export type VariantSummary = EstimateSummary & {
  variant: VariantName;
  reason: { code: NotEstimableCode; message: string } | null;
};

export type DistrictEstimateResponse = {
  district: { code: string; name: string };
  run: PublishedRunMeta | null;
  main: EstimateRecord | null;
  variants: VariantSummary[];
  /** The reviewing analyst's note on this district in the published run. */
  note: { note: string; authorEmail: string | null; updatedAt: string } | null;
  /** Dated notice while the latest publish corrected this district's answer (api/runs/corrections.ts). */
  correction?: { softwareVersion: string; previousSoftware: string; date: string; fields: string[]; text: string } | null;
};

export type RegionDistrict = { code: string; name: string; estimate: EstimateSummary | null };

export type RegionResponse = {
  run: PublishedRunMeta | null;
  counts: Partial<Record<Standing, number>>;
  pooled: {
    shape: Shape | null;
    threshold: number | null;
    fieller: { kind: FiellerKind; levelLo: number | null; levelHi: number | null } | null;
    range?: { levelMin: number; levelMax: number };
  } | null;
  districts: RegionDistrict[];
};

export type HistoryEntry = EstimateSummary & { runId: number; publishedAt: string; dataVersion: number };
export type DistrictHistoryResponse = { district: { code: string; name: string }; history: HistoryEntry[] };

export const ALERT_KINDS = ['crossing', 'threshold_shift', 'shape_change', 'significance_change'] as const;
export type AlertKind = (typeof ALERT_KINDS)[number];

export type DistrictAlert = {
  id: number;
  runId: number;
  kind: AlertKind;
  details: Record<string, unknown>;
  createdAt: string;
};
export type DistrictAlertsResponse = { alerts: DistrictAlert[] };

export type FeedAlert = DistrictAlert & { districtCode: string; districtName: string; read: boolean };
export type AlertFeedResponse = { alerts: FeedAlert[]; unread: number };

export type Subscription = {
  id: number;
  scope: 'district' | 'districts' | 'region';
  districtCodes: string[];
  kinds: AlertKind[];
  delivery: 'instant' | 'digest';
  attachBrief: boolean;
  createdAt: string;
};
export type SubscriptionsResponse = { subscriptions: Subscription[] };
export type SubscriptionInput = Omit<Subscription, 'id' | 'createdAt'>;
