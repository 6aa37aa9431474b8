/** A district's stored values, current or as of a data version. */
import type { Knex } from 'knex';

export interface SeriesRow {
  indicatorId: number;
  year: number;
  value: number;
  uploadId: number | null;
}

export async function latestVersion(db: Knex): Promise<number> {
  const { rows } = await db.raw(`SELECT coalesce(max(version), 0)::int AS v FROM uploads`);
  return rows[0].v;
}

export async function seriesOf(db: Knex, districtId: number, asOf: number | null): Promise<SeriesRow[]> {
  // The observation set of a past data version is the database function observations_as_of (see its migration).
  const source = asOf === null ? 'observations' : 'observations_as_of(?::int)';
  const { rows } = await db.raw(
    `SELECT o.indicator_id, o.year, o.value, o.upload_id FROM ${source} o WHERE o.district_id = ? ORDER BY o.indicator_id, o.year`,
    asOf === null ? [districtId] : [asOf, districtId],
  );
  return rows.map((r: Record<string, number>) => ({
    indicatorId: r.indicator_id,
    year: r.year,
    value: r.value,
    uploadId: r.upload_id,
  }));
}

export interface CatalogueRow {
  id: number;
  code: string;
  name: string;
  unit: string;
  mustBePositive: boolean;
  derivation: string;
}

export async function catalogue(db: Knex): Promise<CatalogueRow[]> {
  const rows = await db('indicators')
    .orderBy('id')
    .select('id', 'code', 'name', 'unit', 'must_be_positive', 'derivation');
  return rows.map((r: Record<string, unknown>) => ({
    id: Number(r.id),
    code: String(r.code),
    name: String(r.name),
    unit: String(r.unit),
    mustBePositive: Boolean(r.must_be_positive),
    derivation: String(r.derivation),
  }));
}
