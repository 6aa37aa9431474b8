// Invented published estimates in the engine's output shape (api/runs/estimate-record.ts),
// for component tests. Plumbing only: the figures are made up to exercise the screens.
import type { Track, TrackRef, TracksResponse } from '@/contracts/tracks';
import type {
  DistrictEstimateResponse,
  TrackStanding,
  EstimateRecord,
  EstimateSummary,
  PublishedRunMeta,
  RegionDistrict,
  RegionResponse,
  VariantSummary,
} from '@/contracts/estimates';

/** ln y = a + b1 ln x + b2 (ln x)², peak at x* = 30,000 (ln x* ≈ 10.309). */
function curveY(x: number): number {
  const u = Math.log(x);
  const b2 = -0.5;
  const b1 = -2 * b2 * Math.log(30000);
  return Math.exp(-50 + b1 * u + b2 * u * u + 50 - (b1 * Math.log(30000) + b2 * Math.log(30000) ** 2) + Math.log(8));
}

const years = Array.from({ length: 20 }, (_, i) => 2006 + i);
const incomes = years.map((_, i) => Math.round(14000 * Math.exp(0.04 * i)));

/** Invented catalogue labels: the units are the ones the demo catalogue uses for these series. */
export const co2Indicator = {
  code: 'emissions_pc',
  name: 'CO₂ emissions per person',
  unit: 't CO₂ per person',
  source: 'Regional inventory office',
  licence: 'CC BY 4.0',
};
export const incomeIndicator = {
  code: 'income_pc',
  name: 'Real income per person',
  unit: '€ per person',
  source: null,
  licence: null,
};
export const co2Track: TrackRef = { code: 'co2', name: 'CO₂ per person', indicator: co2Indicator };
export const pm25Track: TrackRef = {
  code: 'pm25',
  name: 'Fine particles',
  indicator: {
    code: 'pm25',
    name: 'PM2.5 annual mean',
    unit: 'µg/m³',
    source: 'Air monitoring network',
    licence: null,
  },
};
export const so2Track: TrackRef = {
  code: 'so2',
  name: 'SO₂ per person',
  indicator: { code: 'so2_pc', name: 'SO₂ emissions per person', unit: 'kg per person', source: null, licence: null },
};

/** The card's rows: CO₂ approaching, PM2.5 past the turn, SO₂ with no published run. */
export const trackRows: TrackStanding[] = [
  { ...co2Track, standing: 'approaching', gapPercent: -12.4, shape: 'inverted_u', runId: 7 },
  { ...pm25Track, standing: 'past_turn', gapPercent: 8.1, shape: 'inverted_u', runId: 9 },
  { ...so2Track, standing: null, gapPercent: null, shape: null, runId: null },
];

function track(ref: TrackRef, over: Partial<Track>): Track {
  return {
    ...ref,
    headline: false,
    state: 'active',
    specId: 1,
    specName: 'Regional default',
    publishedRunId: null,
    publishedAt: null,
    createdAt: '2026-01-05T09:00:00.000Z',
    ...over,
  };
}

/** GET /api/tracks: CO₂ the headline, PM2.5 published, SO₂ without a published run, one archived track. */
export const tracksAnswer: TracksResponse = {
  tracks: [
    track(pm25Track, {
      specId: 2,
      specName: 'Particles default',
      publishedRunId: 9,
      publishedAt: '2026-10-03T09:00:00.000Z',
    }),
    track(co2Track, { headline: true, publishedRunId: 7, publishedAt: '2026-10-02T09:00:00.000Z' }),
    track(so2Track, { specId: 3, specName: 'Sulphur default' }),
    track(
      {
        code: 'nox',
        name: 'Nitrogen oxides',
        indicator: { code: 'nox_pc', name: 'NOx per person', unit: 'kg per person', source: null, licence: null },
      },
      { specId: 4, specName: 'Old NOx', state: 'archived' },
    ),
  ],
};

export const run: PublishedRunMeta = {
  id: 7,
  publishedAt: '2026-10-02T09:00:00.000Z',
  specName: 'Regional default',
  model: {
    form: 'quadratic',
    transform: 'log',
    covariance: 'newey_west',
    level: 0.95,
    alpha: 0.05,
    intervalMethod: 'fieller',
    controls: ['pop_density'],
    trendYears: 10,
  },
  selection: {
    driver: 'income_pc',
    emissions: 'emissions_pc',
    controls: ['pop_density'],
    firstYear: null,
    lastYear: null,
  },
  dataVersion: 3,
  dataHash: 'ab'.repeat(32),
  softwareVersion: '0.1.0',
  units: { emissions: co2Indicator, driver: incomeIndicator },
};

export function estimateRecord(over: Partial<EstimateRecord>): EstimateRecord {
  const points = years.map((year, i) => ({ year, x: incomes[i], y: curveY(incomes[i]) * (1 + ((i % 3) - 1) * 0.02) }));
  const lo = Math.min(...incomes);
  const hi = Math.max(...incomes);
  const curve = Array.from({ length: 41 }, (_, i) => {
    const x = Math.exp(Math.log(lo) + ((Math.log(hi) - Math.log(lo)) * i) / 40);
    return { x, y: curveY(x) };
  });
  const levelNow = incomes[incomes.length - 1];
  return {
    variant: 'main',
    status: 'ok',
    reason: null,
    model: { ...run.model, lag: 2 },
    n: 20,
    k: 4,
    firstYear: 2006,
    lastYear: 2025,
    droppedYears: [],
    rSquared: 0.91,
    range: { levelMin: lo, levelMax: hi, levelNow, xNow: Math.log(levelNow) },
    threshold: {
      x: Math.log(30000),
      level: 30000,
      kind: 'peak',
      inRange: false,
      extrapolated: false,
      intervalBounded: true,
      delta: { se: 0.1, levelLo: 25500, levelHi: 35000 },
      fieller: { kind: 'bounded', levelLo: 26000, levelHi: 36000 },
    },
    turningPoints: [],
    standing: {
      standing: 'approaching',
      intervalMethod: 'fieller',
      intervalBounded: true,
      levelLo: 26000,
      levelHi: 36000,
      note: null,
    },
    shape: { shape: 'inverted_u', decidedBy: 'u_test', notes: [] },
    uTest: { statistic: 2.4, pValue: 0.012, rejects: true, orientation: 'inverted_u' },
    gapPercent: -18.2,
    elasticity: { value: 0.21, se: 0.08, lo: 0.05, hi: 0.37 },
    trendPerYear: 0.04,
    projection: { status: 'projected', crossingYear: 2031, earliest: 2028, latest: 2040, note: null },
    points,
    curve,
    pooledCurve: curve.map((p) => ({ x: p.x, y: p.y * 0.9 })),
    ...over,
  };
}

/** A record whose Fieller set is the whole line: no band may be drawn. */
export function wholeLineRecord(): EstimateRecord {
  const r = estimateRecord({});
  return {
    ...r,
    threshold: {
      ...r.threshold!,
      intervalBounded: false,
      fieller: { kind: 'whole_line', levelLo: null, levelHi: null },
    },
    standing: {
      standing: 'approaching',
      intervalMethod: 'fieller',
      intervalBounded: false,
      levelLo: null,
      levelHi: null,
      note: 'interval not bounded at 95%',
    },
    projection: {
      status: 'projected',
      crossingYear: 2031,
      earliest: null,
      latest: null,
      note: 'range not on current trend (interval not bounded)',
    },
  };
}

export function notEstimableRecord(): EstimateRecord {
  const r = estimateRecord({});
  return {
    ...r,
    status: 'not_estimable',
    reason: { code: 'too_few_rows', message: 'Only 6 usable years; the model needs at least 9' },
    n: 6,
    range: null,
    threshold: null,
    standing: {
      standing: 'not_estimable',
      intervalMethod: 'fieller',
      intervalBounded: null,
      levelLo: null,
      levelHi: null,
      note: null,
    },
    shape: null,
    uTest: null,
    gapPercent: null,
    elasticity: null,
    projection: null,
    points: r.points.slice(-6),
    curve: [],
    pooledCurve: [],
  };
}

export function summaryOf(r: EstimateRecord): EstimateSummary {
  return {
    status: r.status,
    standing: r.standing.standing,
    intervalBounded: r.standing.intervalBounded,
    intervalMethod: r.standing.intervalMethod,
    shape: r.shape?.shape ?? null,
    threshold: r.threshold?.level ?? null,
    thresholdLo: r.standing.levelLo,
    thresholdHi: r.standing.levelHi,
    fiellerKind: r.threshold?.fieller.kind ?? null,
    extrapolated: r.threshold?.extrapolated ?? false,
    gapPercent: r.gapPercent,
    crossingYear: r.projection?.crossingYear ?? null,
    crossingEarliest: r.projection?.earliest ?? null,
    crossingLatest: r.projection?.latest ?? null,
    projectionStatus: r.projection?.status ?? null,
    lastYear: r.lastYear,
    levelNow: r.range?.levelNow ?? null,
  };
}

export function variants(): VariantSummary[] {
  const main = summaryOf(estimateRecord({}));
  return [
    { ...main, variant: 'no_controls', threshold: 28000, thresholdLo: 25000, thresholdHi: 31000, reason: null },
    { ...main, variant: 'cubic', threshold: 33000, thresholdLo: 24000, thresholdHi: 52000, reason: null },
    {
      ...main,
      variant: 'last20',
      intervalBounded: false,
      fiellerKind: 'two_rays',
      threshold: 31000,
      thresholdLo: 20000,
      thresholdHi: 60000,
      reason: null,
    },
    {
      ...main,
      variant: 'level',
      status: 'not_estimable',
      standing: 'not_estimable',
      threshold: null,
      thresholdLo: null,
      thresholdHi: null,
      fiellerKind: null,
      intervalBounded: null,
      reason: { code: 'too_few_rows', message: 'Too few rows' },
    },
  ];
}

export function estimateResponse(
  main: EstimateRecord | null,
  over: Partial<DistrictEstimateResponse> = {},
): DistrictEstimateResponse {
  return {
    district: { code: 'T02', name: 'Bryn Ødegård' },
    run,
    main,
    variants: main ? variants() : [],
    note: null,
    track: co2Track,
    tracks: trackRows,
    ...over,
  };
}

/** Every GET the card makes for T02, answered; override any path. */
export function cardAnswers(main: EstimateRecord | null, over: Record<string, unknown> = {}): Record<string, unknown> {
  return {
    '/api/tracks': tracksAnswer,
    '/api/districts/T02/estimate': estimateResponse(main),
    '/api/districts/T02/history': {
      district: { code: 'T02', name: 'Bryn Ødegård' },
      history: main ? [{ ...summaryOf(main), runId: 7, publishedAt: run.publishedAt, dataVersion: 3 }] : [],
    },
    '/api/districts/T02/alerts?limit=20': { alerts: [] },
    '/api/subscriptions': { subscriptions: [] },
    ...over,
  };
}

/**
 * GET /api/region's answer over these rows (each a district summary with an optional
 * estimate summary): the list, the map and the run line all read it.
 */
export function regionAnswer(
  rows: readonly (Pick<RegionDistrict, 'code' | 'name' | 'firstYear' | 'lastYear' | 'nYears'> & {
    estimate?: RegionDistrict['estimate'];
  })[],
  over: Partial<RegionResponse> = {},
): RegionResponse {
  const districts = rows.map((d) => ({
    code: d.code,
    name: d.name,
    firstYear: d.firstYear,
    lastYear: d.lastYear,
    nYears: d.nYears,
    estimate: d.estimate ?? null,
  }));
  const counts: RegionResponse['counts'] = {};
  for (const d of districts) {
    const s = d.estimate?.standing ?? 'not_estimable';
    counts[s] = (counts[s] ?? 0) + 1;
  }
  return { track: co2Track, run, counts, pooled: null, districts, ...over };
}
