/**
 * npm run db:backup [-- --out <folder or file.dump>]
 * npm run db:restore -- <file.dump> [--url <database url>]
 *
 * A backup is one pg_dump file in PostgreSQL's custom format (compressed, restorable table
 * by table with pg_restore) of the whole database: the app's tables, the migration log and
 * the job queue's schema. Its name carries the schema version, the newest applied
 * migration, so an operator can tell which release wrote it:
 *   crestwatch-<schema version>-<UTC time>.dump
 * Restore goes into an empty database only (create it first); afterwards
 * `npm run db:migrate` brings an older backup up to the running release.
 *
 * Both use the PostgreSQL client programs from Debian's postgresql-client package
 * (pg_dump, pg_restore on PATH); DATABASE_URL names the database (default: the demo one).
 */
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { Client } from 'pg';
import { demoDatabaseUrl } from '../api/config';
import { migrationsDir } from './database';

const BACKUP_NAME = /^crestwatch-(\d{14}_[a-z0-9_]+|empty)-(\d{8}T\d{6}Z)\.dump$/;

export interface BackupResult {
  file: string;
  schemaVersion: string;
  bytes: number;
}

function tool(name: 'pg_dump' | 'pg_restore', args: string[]): void {
  const r = spawnSync(name, args, { encoding: 'utf8' });
  if (r.error && (r.error as NodeJS.ErrnoException).code === 'ENOENT') {
    throw new Error(`${name} is not installed: run \`apt-get install -y postgresql-client\` (Debian) and try again.`);
  }
  if (r.status !== 0) throw new Error(`${name} failed (exit ${r.status}): ${(r.stderr || r.stdout || '').trim()}`);
}

async function withClient<T>(url: string, fn: (c: Client) => Promise<T>): Promise<T> {
  const c = new Client({ connectionString: url });
  await c.connect();
  try {
    return await fn(c);
  } finally {
    await c.end();
  }
}

/** The newest applied migration's name without its extension, or 'empty' on an unmigrated database. */
export async function schemaVersion(url: string): Promise<string> {
  return withClient(url, async (c) => {
    const { rows } = await c.query(`SELECT to_regclass('public.knex_migrations') IS NOT NULL AS migrated`);
    if (!rows[0].migrated) return 'empty';
    const last = await c.query(`SELECT name FROM knex_migrations ORDER BY name DESC LIMIT 1`);
    return last.rows.length ? String(last.rows[0].name).replace(/\.[cm]?[jt]s$/, '') : 'empty';
  });
}

/** The newest migration this checkout ships (what `npm run db:migrate` would reach). */
export function codeSchemaVersion(): string {
  const names = fs
    .readdirSync(migrationsDir)
    .filter((f) => /^\d{14}_.*\.[cm]?[jt]s$/.test(f))
    .sort();
  return names.length ? names[names.length - 1].replace(/\.[cm]?[jt]s$/, '') : 'empty';
}

export function backupFileName(version: string, at = new Date()): string {
  const stamp = at
    .toISOString()
    .replace(/[-:]/g, '')
    .replace(/\.\d+Z$/, 'Z');
  return `crestwatch-${version}-${stamp}.dump`;
}

/** Reads the schema version back from a backup's file name (null when the name is not ours). */
export function versionOfBackup(file: string): string | null {
  const m = BACKUP_NAME.exec(path.basename(file));
  return m ? m[1] : null;
}

export async function backup(url: string, out: string): Promise<BackupResult> {
  const version = await schemaVersion(url);
  const file = out.endsWith('.dump') ? out : path.join(out, backupFileName(version));
  fs.mkdirSync(path.dirname(file), { recursive: true });
  tool('pg_dump', ['--format=custom', '--no-owner', '--no-privileges', `--file=${file}`, `--dbname=${url}`]);
  return { file, schemaVersion: version, bytes: fs.statSync(file).size };
}

/** Restores into an empty database; refuses one that already holds tables. */
export async function restore(url: string, file: string): Promise<{ schemaVersion: string }> {
  if (!fs.existsSync(file)) throw new Error(`no backup file at ${file}`);
  const tables = await withClient(url, async (c) => {
    const { rows } = await c.query(
      `SELECT count(*)::int AS n FROM pg_tables WHERE schemaname NOT IN ('pg_catalog', 'information_schema')`,
    );
    return rows[0].n as number;
  });
  if (tables > 0) {
    throw new Error(
      `the target database already holds ${tables} tables: restore into a new, empty database (createdb) and point DATABASE_URL or --url at it`,
    );
  }
  tool('pg_restore', [
    '--no-owner',
    '--no-privileges',
    '--exit-on-error',
    '--single-transaction',
    `--dbname=${url}`,
    file,
  ]);
  return { schemaVersion: await schemaVersion(url) };
}

function option(args: string[], name: string): string | undefined {
  const i = args.indexOf(name);
  return i >= 0 ? args[i + 1] : undefined;
}

async function main(argv: string[]): Promise<void> {
  const [cmd, ...rest] = argv;
  const url = option(rest, '--url') ?? process.env.DATABASE_URL ?? demoDatabaseUrl();
  if (cmd === 'backup') {
    const r = await backup(url, option(rest, '--out') ?? path.resolve(__dirname, '..', 'backups'));
    console.log(`backup written: ${r.file} (${r.bytes} bytes, schema ${r.schemaVersion})`);
    return;
  }
  if (cmd === 'restore') {
    const file = rest.find((a, i) => !a.startsWith('--') && rest[i - 1] !== '--url');
    if (!file) throw new Error('usage: npm run db:restore -- <file.dump> [--url <database url>]');
    const named = versionOfBackup(file);
    const code = codeSchemaVersion();
    if (named && named !== 'empty' && named > code) {
      throw new Error(
        `the backup's schema ${named} is newer than this release's ${code}: restore it with the release that wrote it`,
      );
    }
    const r = await restore(url, file);
    const next = r.schemaVersion < code ? `; run \`npm run db:migrate\` to bring it to ${code}` : '';
    console.log(`restored ${path.basename(file)} (schema ${r.schemaVersion})${next}`);
    return;
  }
  console.error('usage: backup.ts backup [--out <folder|file.dump>] [--url <url>] | restore <file.dump> [--url <url>]');
  process.exitCode = 2;
}

if (require.main === module) {
  main(process.argv.slice(2)).catch((err: Error) => {
    console.error(`[backup] ${err.message}`);
    process.exit(1);
  });
}
