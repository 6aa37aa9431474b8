/** The SQL of briefs and exports: a run's main estimates without what only charts draw. */
import type { Knex } from 'knex';
import type { EstimateRecord } from '../runs/estimate-record';

/** The fields a region table row and an export row leave out (a district's charts and diagnostics). */
export const CHART_ONLY_FIELDS = [
  'diagnostics',
  'points',
  'curve',
  'pooledCurve',
  'turningPoints',
  'coefficients',
  'standardErrors',
  'pValues',
  'terms',
] as const;

export type SummaryRecord = Omit<EstimateRecord, (typeof CHART_ONLY_FIELDS)[number]> & { code: string; name: string };

/**
 * Every district's main estimate of a run in code order, with the chart-only fields
 * dropped in the database: a 3,000-district region brief then reads a few MB, not tens.
 */
export async function summaryRecords(db: Knex, runId: number): Promise<SummaryRecord[]> {
  const minus = CHART_ONLY_FIELDS.map(() => ' - ?').join('');
  const rows = await db('run_estimates as e')
    .join('districts as d', 'd.id', 'e.district_id')
    .where({ 'e.run_id': runId, 'e.variant': 'main' })
    .orderBy('d.code')
    .select(db.raw(`e.result${minus} AS result`, [...CHART_ONLY_FIELDS]), 'd.code', 'd.name');
  return rows.map((r: { result: SummaryRecord; code: string; name: string }) => ({
    ...r.result,
    code: r.code,
    name: r.name,
  }));
}

/** The words a brief uses for each indicator: code → name, unit, source and licence. */
export async function indicatorWords(
  db: Knex,
): Promise<Map<string, { name: string; unit: string; source: string | null; licence: string | null }>> {
  const rows: { code: string; name: string; unit: string; source: string | null; licence: string | null }[] = await db(
    'indicators',
  ).select('code', 'name', 'unit', 'source', 'licence');
  return new Map(rows.map((r) => [r.code, { name: r.name, unit: r.unit, source: r.source, licence: r.licence }]));
}
