/**
 * Starts the test cluster and (re)builds the migrated template database that every test
 * file clones. Skips the rebuild when the migrations have not changed since the last one.
 */
import { createHash } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { Client } from 'pg';
import { TEMPLATE_DB, TEST_CLUSTER, testDatabaseUrl } from '../tests/support/test-cluster';
import { dropDatabase, ensureDatabase, migrate, migrationsDir } from './database';
import * as pg from './pg';

function migrationsHash(): string {
  const h = createHash('sha256');
  for (const f of fs.readdirSync(migrationsDir).sort()) {
    h.update(f).update(fs.readFileSync(path.join(migrationsDir, f)));
  }
  return h.digest('hex').slice(0, 16);
}

async function templateComment(): Promise<string | null> {
  const c = new Client({ host: '127.0.0.1', port: TEST_CLUSTER.port, user: 'postgres', database: 'postgres' });
  await c.connect();
  try {
    const { rows } = await c.query(
      `SELECT shobj_description(oid, 'pg_database') AS comment FROM pg_database WHERE datname = $1`,
      [TEMPLATE_DB],
    );
    return rows[0]?.comment ?? null;
  } finally {
    await c.end();
  }
}

export async function prepareTestTemplate(): Promise<void> {
  pg.start(TEST_CLUSTER);
  const hash = migrationsHash();
  if ((await templateComment()) === hash) return;
  await dropDatabase(TEST_CLUSTER.port, TEMPLATE_DB);
  await ensureDatabase(TEST_CLUSTER.port, TEMPLATE_DB);
  await migrate(testDatabaseUrl(TEMPLATE_DB));
  const c = new Client({ host: '127.0.0.1', port: TEST_CLUSTER.port, user: 'postgres', database: 'postgres' });
  await c.connect();
  await c.query(`COMMENT ON DATABASE "${TEMPLATE_DB}" IS '${hash}'`);
  await c.end();
}

if (require.main === module) {
  prepareTestTemplate().catch((err: Error) => {
    console.error(`[test-db] ${err.message}`);
    process.exit(1);
  });
}
