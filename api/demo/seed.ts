/**
 * Loads the demo region into the database: the indicator catalogue, the districts and
 * their observations, in one transaction. The load is recorded as a change set of kind
 * 'seed' (the next data version), so every observation has an upload and the history can
 * rebuild any later data version. `seedDemoIfEmpty` leaves a database that already has
 * districts alone; `reseedDemo` replaces the demo data, its uploads and their history.
 */
import type { Knex } from 'knex';
import { lockForTransaction } from '../db/locks';
import { DEMO_INDICATORS } from './catalogue';
import { DEMO_SEED, generateDemoRegion } from './generate';

async function insertDemo(trx: Knex.Transaction): Promise<{ districts: number; observations: number }> {
  const region = generateDemoRegion();
  await trx('indicators')
    .insert(
      DEMO_INDICATORS.map((i) => ({
        code: i.code,
        name: i.name,
        unit: i.unit,
        description: i.description,
        must_be_positive: i.mustBePositive,
      })),
    )
    .onConflict('code')
    .merge(['name', 'unit', 'description', 'must_be_positive']);
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

export async function seedDemoIfEmpty(db: Knex): Promise<{ seeded: boolean; districts: number; observations: number }> {
  return db.transaction(async (trx) => {
    // Serialise concurrent starters on one advisory lock.
    await lockForTransaction(trx, 'demoSeed');
    const [{ count }] = await trx('districts').count<{ count: string }[]>({ count: '*' });
    if (Number(count) > 0) return { seeded: false, districts: Number(count), observations: 0 };
    return { seeded: true, ...(await insertDemo(trx)) };
  });
}

export async function reseedDemo(db: Knex): Promise<{ districts: number; observations: number }> {
  return db.transaction(async (trx) => {
    await lockForTransaction(trx, 'demoSeed');
    // Runs (with their estimates, alerts and mail) describe the old data: they go too.
    await trx('outbox').del();
    await trx('runs').del();
    await trx('observation_history').del();
    await trx('observations').del();
    await trx('uploads').del();
    await trx('districts').del();
    return insertDemo(trx);
  });
}
