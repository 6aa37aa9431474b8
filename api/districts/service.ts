/**
 * District summaries and series: the rules (year span, gaps as nulls) live here. Other
 * features find a district by code through this service (one lookup, one 404 wording).
 */
import type { Knex } from 'knex';
import { NotFoundError } from '../http/errors';
import * as store from './store';

export type { DistrictRef } from './store';

/** The district with this code, or a 404 naming the code. */
export async function districtByCode(db: Knex, code: string): Promise<store.DistrictRef> {
  const d = await store.findDistrictByCode(db, code);
  if (!d) throw new NotFoundError(`No district with code ${code}`, { code });
  return d;
}

/** The districts with these codes (each once, in the order given), or a 404 naming every missing code. */
export async function districtsByCodes(db: Knex, codes: string[]): Promise<store.DistrictRef[]> {
  const wanted = [...new Set(codes)];
  const found = new Map((await store.findDistrictsByCodes(db, wanted)).map((d) => [d.code, d]));
  const missing = wanted.filter((c) => !found.has(c));
  if (missing.length) throw new NotFoundError(`No district with code ${missing.join(', ')}`, { missing });
  return wanted.map((c) => found.get(c)!);
}

export const districtNames = (db: Knex) => store.listDistrictNames(db);

/** The indicators every district screen shows, and their field names in the API. */
export const CORE_INDICATORS = {
  emissions_pc: 'emissionsPc',
  income_pc: 'incomePc',
  population: 'population',
  pop_density: 'popDensity',
} as const;

type CoreCode = keyof typeof CORE_INDICATORS;
type CoreField = (typeof CORE_INDICATORS)[CoreCode];
export type CoreValues = Record<CoreField, number | null>;

function coreValues(source: Record<string, number> | undefined): CoreValues {
  const out = {} as CoreValues;
  for (const [code, field] of Object.entries(CORE_INDICATORS) as [CoreCode, CoreField][]) {
    const v = source?.[code];
    out[field] = v === undefined ? null : Number(v);
  }
  return out;
}

function publicSummary(d: store.DistrictSummaryRow) {
  return {
    code: d.code,
    name: d.name,
    firstYear: d.firstYear,
    lastYear: d.lastYear,
    nYears: d.nYears,
    latest: d.lastYear === null ? null : { year: d.lastYear, ...coreValues(d.latest ?? undefined) },
  };
}

export type DistrictSummary = ReturnType<typeof publicSummary>;

/**
 * Every district with its data span and latest values, by name. (The list with standings,
 * `GET /api/districts`, is the published estimates' view: `estimates/service.ts`.)
 */
export async function districtSummaries(db: Knex): Promise<DistrictSummary[]> {
  return (await store.listDistrictSummaries(db)).map(publicSummary);
}

export async function getDistrict(db: Knex, code: string) {
  const d = await store.findDistrictSummary(db, code);
  if (!d) throw new NotFoundError(`No district with code ${code}`, { code });
  const observations = await store.listObservations(db, d.id);
  const byYear = new Map<number, Record<string, number>>();
  for (const o of observations) {
    const row = byYear.get(o.year) ?? {};
    row[o.indicator] = o.value;
    byYear.set(o.year, row);
  }
  const series: ({ year: number } & CoreValues)[] = [];
  if (d.firstYear !== null && d.lastYear !== null) {
    for (let year = d.firstYear; year <= d.lastYear; year++) series.push({ year, ...coreValues(byYear.get(year)) });
  }
  const { latest: _latest, ...district } = publicSummary(d);
  const indicators = await store.listIndicators(db, Object.keys(CORE_INDICATORS));
  return { district, indicators, series };
}
