// Shapes of the API's JSON answers as the client reads them (see the route table in api/).

export type IndicatorCode = 'emissions_pc' | 'income_pc' | 'population' | 'pop_density';

/** One year of a district's series; a gap year has nulls. */
export type SeriesRow = {
  year: number;
  emissionsPc: number | null;
  incomePc: number | null;
  population: number | null;
  popDensity: number | null;
};

export type DistrictSummary = {
  code: string;
  name: string;
  firstYear: number | null;
  lastYear: number | null;
  /** Years with at least one observation. */
  nYears: number;
  latest: SeriesRow | null;
};

export type DistrictListResponse = { districts: DistrictSummary[] };

export type Indicator = { code: IndicatorCode; name: string; unit: string };

export type DistrictDetailResponse = {
  district: Omit<DistrictSummary, 'latest'>;
  indicators: Indicator[];
  series: SeriesRow[];
};

export type HealthResponse = { status: 'ok'; database: 'up' | 'down' };

/** The one error shape every API failure answers with. */
export type ApiErrorBody = { error: { code: string; message: string; details?: unknown } };

/** GET /api/auth/options: how this server signs people in. */
export type AuthOptionsResponse = { provider: 'google' | 'stand-in'; signInUrl: string };

/** GET /api/me: the signed-in person (401 `unauthenticated` when nobody is). */
export type MeResponse = { id: number | string; email: string; name: string | null; role: string; csrfToken: string };
