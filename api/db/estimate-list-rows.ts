/**
 * The summary columns of a run's stored estimates (run_estimates joined with districts),
 * read by two features: runs (the review table, the export) and estimates (what officials
 * see, briefs). One query and one row shape for both, in the database layer.
 */
import type { Knex } from 'knex';

export interface EstimateListRow {
  districtId: number;
  code: string;
  name: string;
  status: string;
  standing: string;
  shape: string | null;
  threshold: number | null;
  gapPercent: number | null;
  crossingYear: number | null;
  uTestRejects: boolean | null;
  intervalBounded: boolean | null;
  lastYear: number | null;
}

const num = (v: unknown) => (v === null || v === undefined ? null : Number(v));

/** One variant's summary rows of a run, in district-code order. */
export async function estimateListRows(db: Knex, runId: number, variant: string): Promise<EstimateListRow[]> {
  const rows: Record<string, unknown>[] = await db('run_estimates as e')
    .join('districts as d', 'd.id', 'e.district_id')
    .where({ 'e.run_id': runId, 'e.variant': variant })
    .orderBy('d.code')
    .select(
      'e.district_id',
      'e.status',
      'e.standing',
      'e.shape',
      'e.threshold',
      'e.gap_percent',
      'e.crossing_year',
      'e.u_test_rejects',
      'e.interval_bounded',
      'e.last_year',
      'd.code',
      'd.name',
    );
  return rows.map((r) => ({
    districtId: Number(r.district_id),
    code: String(r.code),
    name: String(r.name),
    status: String(r.status),
    standing: String(r.standing),
    shape: (r.shape as string | null) ?? null,
    threshold: num(r.threshold),
    gapPercent: num(r.gap_percent),
    crossingYear: num(r.crossing_year),
    uTestRejects: (r.u_test_rejects as boolean | null) ?? null,
    intervalBounded: (r.interval_bounded as boolean | null) ?? null,
    lastYear: num(r.last_year),
  }));
}
