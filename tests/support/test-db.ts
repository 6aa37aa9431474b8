/**
 * One fresh database per test file, cloned from the migrated template.
 */
import { randomBytes } from 'node:crypto';
import type { Knex } from 'knex';
import { createDb } from '../../api/db';
import { dropDatabase, ensureDatabase } from '../../scripts/database';
import { TEMPLATE_DB, TEST_CLUSTER, testDatabaseUrl } from './test-cluster';

export interface TestDatabase {
  db: Knex;
  url: string;
  name: string;
  drop(): Promise<void>;
}

export async function freshDatabase(): Promise<TestDatabase> {
  const name = `cw_test_${process.pid}_${randomBytes(4).toString('hex')}`;
  for (let attempt = 1; ; attempt++) {
    try {
      await ensureDatabase(TEST_CLUSTER.port, name, TEMPLATE_DB);
      break;
    } catch (err) {
      // Another session briefly touching the template makes CREATE DATABASE fail: retry.
      if (attempt >= 5 || !/being accessed by other users/.test(String(err))) throw err;
      await new Promise((r) => setTimeout(r, 200 * attempt));
    }
  }
  const url = testDatabaseUrl(name);
  const db = createDb(url, { pool: { min: 0, max: 5 } });
  return {
    db,
    url,
    name,
    async drop() {
      await db.destroy();
      await dropDatabase(TEST_CLUSTER.port, name);
    },
  };
}
