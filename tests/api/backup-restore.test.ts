/**
 * Backups that restore: a database with uploads, two published runs and their alerts and
 * mail is written with `npm run db:backup`, restored with `npm run db:restore` into a new,
 * empty database, and every table (the app's, the migration log and the job queue's) reads
 * back with the same checksum, every sequence at the same value. The restored copy then
 * goes one migration down (`npm run db:rollback`) and back up (`npm run db:migrate`).
 */
import { execFile } from 'node:child_process';
import fs from 'node:fs';
import type { Server } from 'node:http';
import os from 'node:os';
import path from 'node:path';
import { promisify } from 'node:util';
import type { Knex } from 'knex';
import type { CrestwatchApp } from '../../api/app';
import { createDb } from '../../api/db';
import { seedDemoIfEmpty } from '../../api/demo/seed';
import type { Jobs } from '../../api/jobs/boss';
import { ensureDemoAccounts } from '../../api/people/service';
import { codeSchemaVersion, schemaVersion } from '../../scripts/backup';
import { dropDatabase, ensureDatabase, migrationsDir } from '../../scripts/database';
import { closeServer, DEMO, listen, signInAs } from '../support/auth';
import { startRunAndWait, testJobs, workIn } from '../support/jobs';
import { TEST_CLUSTER, testDatabaseUrl } from '../support/test-cluster';
import { testApp } from '../support/test-app';
import { freshDatabase, type TestDatabase } from '../support/test-db';
import { upload } from './upload-helpers';

jest.setTimeout(300_000);

const run = promisify(execFile);
const root = path.resolve(__dirname, '..', '..');

/** Every user table's rows, each as its row text, sorted: one md5 a table. */
async function tableChecksums(db: Knex): Promise<Record<string, string>> {
  const { rows: tables } = await db.raw(`
    SELECT schemaname, tablename FROM pg_tables
     WHERE schemaname NOT IN ('pg_catalog', 'information_schema') ORDER BY 1, 2`);
  const sums: Record<string, string> = {};
  for (const { schemaname, tablename } of tables as { schemaname: string; tablename: string }[]) {
    const q = `"${schemaname}"."${tablename}"`;
    const { rows } = await db.raw(
      `SELECT count(*)::int AS n, md5(coalesce(string_agg(t::text, E'\\n' ORDER BY t::text), '')) AS sum FROM ${q} t`,
    );
    sums[`${schemaname}.${tablename}`] = `${rows[0].n}:${rows[0].sum}`;
  }
  return sums;
}

async function sequenceValues(db: Knex): Promise<Record<string, string>> {
  const { rows } = await db.raw(
    `SELECT schemaname || '.' || sequencename AS name, coalesce(last_value, 0)::text AS v FROM pg_sequences ORDER BY 1`,
  );
  return Object.fromEntries((rows as { name: string; v: string }[]).map((r) => [r.name, r.v]));
}

let t: TestDatabase;
let restoredName: string;
let restored: Knex | undefined;
let dir: string;

beforeAll(async () => {
  dir = fs.mkdtempSync(path.join(os.tmpdir(), 'crestwatch-backup-'));
  t = await freshDatabase();
  await seedDemoIfEmpty(t.db);
  await ensureDemoAccounts(t.db);
  const app: CrestwatchApp = testApp(t.db);
  const jobs: Jobs = await testJobs(t.url);
  app.locals.ctx.jobs = jobs;
  let server: Server | undefined;
  try {
    await workIn(app.locals.ctx, jobs);
    server = await listen(app);
    const analyst = (await signInAs(server, DEMO.analyst)).agent;
    const official = (await signInAs(server, DEMO.official)).agent;
    expect((await official.post('/api/subscriptions').send({ scope: 'region', delivery: 'instant' })).status).toBe(201);
    const first = await startRunAndWait(analyst);
    expect((await analyst.post(`/api/runs/${first.run.id}/publish`)).status).toBe(200);
    const revision = fs.readFileSync(path.join(root, 'assets', 'demo-data', 'income-revision-2025.csv'));
    expect((await upload(analyst, revision, 'income-revision-2025.csv', { commit: true })).status).toBe(201);
    const second = await startRunAndWait(analyst);
    const published = await analyst.post(`/api/runs/${second.run.id}/publish`);
    expect(published.status).toBe(200);
    // The demo revision moves D13 across its band (tests/api/runs.test.ts): at least one alert.
    expect(published.body.alerts).toBeGreaterThan(0);
  } finally {
    await jobs.stop();
    if (server) await closeServer(server, app);
  }
});

afterAll(async () => {
  await restored?.destroy();
  if (restoredName) await dropDatabase(TEST_CLUSTER.port, restoredName);
  await t?.drop();
  fs.rmSync(dir, { recursive: true, force: true });
});

describe('db:backup and db:restore', () => {
  let file: string;

  it('writes one custom-format file named with the schema version', async () => {
    const { stdout } = await run('npm', ['run', '--silent', 'db:backup', '--', '--out', dir], {
      cwd: root,
      env: { ...process.env, DATABASE_URL: t.url },
    });
    const files = fs.readdirSync(dir);
    expect(files).toHaveLength(1);
    file = path.join(dir, files[0]);
    expect(stdout).toContain(files[0]);
    // The database is migrated to the newest migration in migrations/, which names the file.
    expect(files[0]).toMatch(new RegExp(`^crestwatch-${codeSchemaVersion()}-\\d{8}T\\d{6}Z\\.dump$`));
    // pg_dump's custom format starts with the magic "PGDMP" (PostgreSQL docs, pg_dump -Fc).
    expect(fs.readFileSync(file).subarray(0, 5).toString('latin1')).toBe('PGDMP');
  });

  it('restores into a fresh database with every table and sequence equal', async () => {
    const source = await tableChecksums(t.db);
    for (const table of [
      'public.uploads',
      'public.runs',
      'public.run_estimates',
      'public.alerts',
      'public.outbox',
      'public.observations',
      'public.audit_log',
    ]) {
      expect(source[table]).toBeDefined();
      expect(source[table].startsWith('0:')).toBe(false);
    }
    restoredName = `${t.name}_restored`;
    await ensureDatabase(TEST_CLUSTER.port, restoredName);
    const { stdout } = await run('npm', ['run', '--silent', 'db:restore', '--', file], {
      cwd: root,
      env: { ...process.env, DATABASE_URL: testDatabaseUrl(restoredName) },
    });
    expect(stdout).toContain(`schema ${codeSchemaVersion()}`);
    restored = createDb(testDatabaseUrl(restoredName), { pool: { min: 0, max: 2 } });
    expect(await tableChecksums(restored)).toEqual(source);
    expect(await sequenceValues(restored)).toEqual(await sequenceValues(t.db));
  });

  it('refuses to restore over a database that already holds tables, leaving it untouched', async () => {
    const before = await tableChecksums(t.db);
    await expect(
      run('npm', ['run', '--silent', 'db:restore', '--', file], {
        cwd: root,
        env: { ...process.env, DATABASE_URL: t.url },
      }),
    ).rejects.toMatchObject({
      stderr: expect.stringMatching(/already holds \d+ tables: restore into a new, empty database/),
    });
    expect(await tableChecksums(t.db)).toEqual(before);
  });

  it('refuses a backup written by a newer release (its schema version is past the last migration here)', async () => {
    const future = path.join(dir, 'crestwatch-29991231000000_from_a_later_release-29991231T000000Z.dump');
    fs.copyFileSync(file, future);
    await expect(
      run('npm', ['run', '--silent', 'db:restore', '--', future], {
        cwd: root,
        env: { ...process.env, DATABASE_URL: t.url },
      }),
    ).rejects.toMatchObject({
      stderr: expect.stringContaining(
        `schema 29991231000000_from_a_later_release is newer than this release's ${codeSchemaVersion()}`,
      ),
    });
  });

  it('steps the restored copy back one migration with db:rollback and forward again with db:migrate', async () => {
    const names = fs
      .readdirSync(migrationsDir)
      .filter((f) => /^\d{14}_/.test(f))
      .sort()
      .map((f) => f.replace(/\.ts$/, ''));
    const env = { ...process.env, DATABASE_URL: testDatabaseUrl(restoredName) };
    const down = await run('npm', ['run', '--silent', 'db:rollback'], { cwd: root, env });
    expect(down.stdout).toContain(`rolled back: ${names[names.length - 1]}`);
    expect(await schemaVersion(testDatabaseUrl(restoredName))).toBe(names[names.length - 2]);
    await run('npm', ['run', '--silent', 'db:migrate'], { cwd: root, env });
    expect(await schemaVersion(testDatabaseUrl(restoredName))).toBe(codeSchemaVersion());
  });
});
