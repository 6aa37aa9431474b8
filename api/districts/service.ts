/** District summaries and series: the rules (year span, gaps as nulls) live here. */
import type { Knex } from 'knex';
import { publishedRunMeta, publishedSummaries } from '../estimates/service';
import { NotFoundError } from '../http/errors';
import * as store from './store';

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

/** Every district with its data span, latest values and its standing in the latest published run. */
export async function listDistricts(db: Knex) {
  const [rows, published] = await Promise.all([store.listDistrictSummaries(db), publishedSummaries(db)]);
  return {
    publishedRunId: published.run?.id ?? null,
    /** The run the standings come from (what the region list's header names). */
    run: published.run ? publishedRunMeta(published.run) : null,
    districts: rows.map((d) => ({ ...publicSummary(d), estimate: published.byCode.get(d.code) ?? null })),
  };
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
