/**
 * npm start: start PostgreSQL, migrate, seed the demo region when the database is empty,
 * build the web app when stale, and serve everything on one port.
 */
import { loadConfig } from '../api/config';
import { createDb } from '../api/db';
import { seedDemoBoundariesIfEmpty } from '../api/demo/boundaries';
import { publishInitialDemoRuns } from '../api/demo/initial-run';
import { seedDemoIfEmpty } from '../api/demo/seed';
import { closeOnSignals, startServer } from '../api/server';
import { prepareDemoDatabase } from './db';
import { buildWebIfStale } from './web-build';

async function main(): Promise<void> {
  const config = loadConfig();
  // The first log line says when the demo runs because nothing chose a mode.
  if (config.modeNotice) console.log(config.modeNotice);
  await prepareDemoDatabase();
  if (config.mode === 'demo') {
    const db = createDb(config.databaseUrl);
    try {
      const r = await seedDemoIfEmpty(db);
      if (r.seeded) console.log(`Loaded the demo region: ${r.districts} districts, ${r.observations} observations.`);
      const b = await seedDemoBoundariesIfEmpty(db, config.boundaryMaxVertices);
      if (b.seeded) console.log(`Loaded the demo region's boundaries: ${b.districts} districts.`);
    } finally {
      await db.destroy();
    }
  }
  buildWebIfStale();
  const running = await startServer(config);
  closeOnSignals(running);
  console.log(`\nCrestwatch is ready: ${running.url}\n`);
  if (config.mode === 'demo') {
    publishInitialDemoRuns(running.ctx, config.firstAdminEmail).then(
      (ids) =>
        ids && console.log(`Published the first demo runs (${ids.map((id) => `#${id}`).join(', ')}), one per track.`),
      (err: Error) => console.error(`The first demo run could not be published: ${err.message}`),
    );
  }
}

main().catch((err: Error) => {
  console.error(`Crestwatch could not start: ${err.message}`);
  process.exit(1);
});
