/**
 * npm run db:start | db:stop | db:status | db:migrate | db:seed | db:rollback — the demo
 * cluster, or the database DATABASE_URL names.
 */
import { DEMO_DB_PORT, demoDatabaseUrl } from '../api/config';
import { createDb } from '../api/db';
import { reseedDemo } from '../api/demo/seed';
import { ensureDatabase, migrate, migrateDown } from './database';
import * as pg from './pg';

export const DEMO_CLUSTER: pg.ClusterOptions = { name: 'demo', port: DEMO_DB_PORT };
const url = process.env.DATABASE_URL ?? demoDatabaseUrl();

/** Start the demo cluster (when DATABASE_URL is not set), create and migrate the database. */
export async function prepareDemoDatabase(): Promise<string> {
  if (!process.env.DATABASE_URL) {
    pg.start(DEMO_CLUSTER);
    await ensureDatabase(DEMO_DB_PORT, 'crestwatch');
  }
  const applied = await migrate(url);
  if (applied.length) process.stderr.write(`[db] applied migrations: ${applied.join(', ')}\n`);
  return url;
}

async function main(cmd: string | undefined): Promise<void> {
  switch (cmd) {
    case 'start':
      await prepareDemoDatabase();
      console.log(`PostgreSQL is up on 127.0.0.1:${DEMO_DB_PORT} (${pg.status(DEMO_CLUSTER).dataDir})`);
      return;
    case 'stop':
      pg.stop(DEMO_CLUSTER);
      return;
    case 'status': {
      const s = pg.status(DEMO_CLUSTER);
      console.log(`${s.running ? 'running' : 'stopped'} on 127.0.0.1:${s.port}, data in ${s.dataDir}`);
      process.exitCode = s.running ? 0 : 3;
      return;
    }
    case 'migrate':
      await prepareDemoDatabase();
      return;
    case 'rollback': {
      // Undo the newest applied migration with its down(); never starts or migrates first.
      const undone = await migrateDown(url);
      console.log(undone.length ? `rolled back: ${undone.join(', ')}` : 'nothing to roll back');
      return;
    }
    case 'seed': {
      await prepareDemoDatabase();
      const db = createDb(url);
      try {
        const r = await reseedDemo(db);
        console.log(`demo region loaded: ${r.districts} districts, ${r.observations} observations`);
      } finally {
        await db.destroy();
      }
      return;
    }
    default:
      console.error('usage: db.ts start|stop|status|migrate|rollback|seed');
      process.exitCode = 2;
  }
}

if (require.main === module) {
  main(process.argv[2]).catch((err: Error) => {
    console.error(`[db] ${err.message}`);
    process.exit(1);
  });
}
