/**
 * Loads the demo region into the database: the indicator catalogue, the districts and
 * their observations, in one transaction. The load is recorded as a change set of kind
 * 'seed' (the next data version), so every observation has an upload and the history can
 * rebuild any later data version. `seedDemoIfEmpty` leaves a database that already has
 * districts alone; `reseedDemo` replaces the demo data, its uploads and their history.
 */
import type { Knex } from 'knex';
import { lockForTransaction } from '../db/locks';
import * as store from './seed-store';

export async function seedDemoIfEmpty(db: Knex): Promise<{ seeded: boolean; districts: number; observations: number }> {
  return db.transaction(async (trx) => {
    // Serialise concurrent starters on one advisory lock.
    await lockForTransaction(trx, 'demoSeed');
    const count = await store.countDistricts(trx);
    if (count > 0) return { seeded: false, districts: count, observations: 0 };
    return { seeded: true, ...(await store.insertDemo(trx)) };
  });
}

export async function reseedDemo(db: Knex): Promise<{ districts: number; observations: number }> {
  return db.transaction(async (trx) => {
    await lockForTransaction(trx, 'demoSeed');
    // Runs (with their estimates, alerts and mail) describe the old data: they go too.
    await store.deleteDemoData(trx);
    return store.insertDemo(trx);
  });
}
