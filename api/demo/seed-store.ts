/** The demo load's SQL: the catalogue, the districts, one seed change set and its observations. */
import type { Knex } from 'knex';
import { lockForTransaction } from '../db/locks';
import { DEMO_INDICATORS } from './catalogue';
import { DEMO_SEED, generateDemoRegion } from './generate';

/** The demo's indicator catalogue (names, units, source and licence), updated where it exists. */
export async function insertDemoIndicators(db: Knex): Promise<void> {
  await db('indicators')
    .insert(
      DEMO_INDICATORS.map((i) => ({
        code: i.code,
        name: i.name,
        unit: i.unit,
        description: i.description,
        must_be_positive: i.mustBePositive,
        source: i.source,
        licence: i.licence,
      })),
    )
    .onConflict('code')
    .merge(['name', 'unit', 'description', 'must_be_positive', 'source', 'licence']);
}

export async function insertDemo(trx: Knex.Transaction): Promise<{ districts: number; observations: number }> {
  const region = generateDemoRegion();
  await insertDemoIndicators(trx);
  const indicatorIds = new Map<string, number>(
    (await trx('indicators').select('id', 'code')).map((r: { id: number; code: string }) => [r.code, r.id]),
  );
  const districtRows: { id: number; code: string }[] = await trx('districts')
    .insert(region.districts)
    .returning(['id', 'code']);
  const districtIds = new Map(districtRows.map((r) => [r.code, r.id]));
  await lockForTransaction(trx, 'observations');
  const [{ version }] = (await trx.raw(`SELECT coalesce(max(version), 0) + 1 AS version FROM uploads`)).rows;
  const [{ id: uploadId }] = await trx('uploads')
    .insert({
      kind: 'seed',
      status: 'committed',
      note: `demo region generator, seed ${DEMO_SEED}`,
      committed_at: trx.fn.now(),
      version,
      rows_read: region.observations.length,
      value_count: region.observations.length,
      insert_count: region.observations.length,
    })
    .returning('id');
  const rows = region.observations.map((o) => ({
    district_id: districtIds.get(o.districtCode)!,
    indicator_id: indicatorIds.get(o.indicator)!,
    year: o.year,
    value: o.value,
    upload_id: uploadId,
  }));
  await trx.batchInsert('observations', rows, 1000);
  return { districts: districtRows.length, observations: rows.length };
}

export async function countDistricts(trx: Knex.Transaction): Promise<number> {
  const [{ count }] = await trx('districts').count<{ count: string }[]>({ count: '*' });
  return Number(count);
}

/** Removes the region's data, its uploads and history, and the runs (with their estimates, alerts and mail) that describe it. */
export async function deleteDemoData(trx: Knex.Transaction): Promise<void> {
  await trx('outbox').del();
  await trx('runs').del();
  await trx('observation_history').del();
  await trx('observations').del();
  await trx('uploads').del();
  await trx('districts').del();
}
