/** Shared by the upload tests: a signed-in app over a fresh database, and checksums of the data. */
import type { Server } from 'node:http';
import type TestAgent from 'supertest/lib/agent';
import type { CrestwatchApp } from '../../api/app';
import { seedDemoIfEmpty } from '../../api/demo/seed';
import { ensureDemoAccounts } from '../../api/people/service';
import { closeServer, DEMO, listen, signInAs } from '../support/auth';
import { testApp } from '../support/test-app';
import { freshDatabase, type TestDatabase } from '../support/test-db';
import type { Config } from '../../api/config';

export interface UploadWorld {
  t: TestDatabase;
  app: CrestwatchApp;
  server: Server;
  analyst: TestAgent;
  official: TestAgent;
  close(): Promise<void>;
}

export async function uploadWorld(overrides: Partial<Config> = {}): Promise<UploadWorld> {
  const t = await freshDatabase();
  await seedDemoIfEmpty(t.db);
  await ensureDemoAccounts(t.db);
  const app = testApp(t.db, overrides);
  const server = await listen(app);
  const analyst = (await signInAs(server, DEMO.analyst)).agent;
  const official = (await signInAs(server, DEMO.official)).agent;
  return {
    t,
    app,
    server,
    analyst,
    official,
    async close() {
      await closeServer(server, app);
      await t.drop();
    },
  };
}

export interface UploadQuery {
  commit?: boolean;
  allowNewDistricts?: boolean;
  decimalComma?: boolean;
  changeFactor?: number;
}

export function upload(agent: TestAgent, content: string | Buffer, fileName: string, query: UploadQuery = {}) {
  const body = typeof content === 'string' ? Buffer.from(content, 'utf8') : content;
  return agent.post('/api/uploads').query(query).attach('file', body, { filename: fileName, contentType: 'text/csv' });
}

/**
 * Every column of every observation row and where it lies (ctid: a rewritten row moves),
 * in key order: "byte-for-byte unchanged" means this md5 is the same.
 */
export async function observationsChecksum(db: TestDatabase['db']): Promise<string> {
  const { rows } = await db.raw(`
    SELECT md5(coalesce(string_agg(concat_ws('|', o.ctid::text, o.district_id, o.indicator_id, o.year, o.value::text,
                                              o.updated_at, o.upload_id), E'\\n' ORDER BY o.district_id, o.indicator_id, o.year), '')) AS sum
      FROM observations o`);
  return rows[0].sum;
}

export async function storedValue(
  db: TestDatabase['db'],
  district: string,
  indicator: string,
  year: number,
): Promise<number | null> {
  const row = await db('observations as o')
    .join('districts as d', 'd.id', 'o.district_id')
    .join('indicators as i', 'i.id', 'o.indicator_id')
    .where({ 'd.code': district, 'i.code': indicator, 'o.year': year })
    .first('o.value');
  return row ? Number(row.value) : null;
}
