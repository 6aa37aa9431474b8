/** Shared steps for the demo and test databases: create if missing, migrate. */
import path from 'node:path';
import { Client } from 'pg';
import { createDb } from '../api/db';

export const migrationsDir = path.resolve(__dirname, '..', 'migrations');

export async function ensureDatabase(port: number, name: string, template?: string): Promise<void> {
  const client = new Client({ host: '127.0.0.1', port, user: 'postgres', database: 'postgres' });
  await client.connect();
  try {
    const { rowCount } = await client.query('SELECT 1 FROM pg_database WHERE datname = $1', [name]);
    if (!rowCount) {
      const tpl = template ? ` TEMPLATE "${template}"` : '';
      await client.query(`CREATE DATABASE "${name}"${tpl} ENCODING 'UTF8'`);
    }
  } finally {
    await client.end();
  }
}

export async function dropDatabase(port: number, name: string): Promise<void> {
  const client = new Client({ host: '127.0.0.1', port, user: 'postgres', database: 'postgres' });
  await client.connect();
  try {
    await client.query(`DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`);
  } finally {
    await client.end();
  }
}

export async function migrate(databaseUrl: string): Promise<string[]> {
  const db = createDb(databaseUrl, { pool: { min: 0, max: 2 } });
  try {
    const [, applied] = await db.migrate.latest({ directory: migrationsDir, loadExtensions: ['.ts'] });
    return applied as string[];
  } finally {
    await db.destroy();
  }
}

/** Runs the down() of the newest applied migration; returns its name (empty when none). */
export async function migrateDown(databaseUrl: string): Promise<string[]> {
  const db = createDb(databaseUrl, { pool: { min: 0, max: 2 } });
  try {
    const [, undone] = await db.migrate.down({ directory: migrationsDir, loadExtensions: ['.ts'] });
    return undone as string[];
  } finally {
    await db.destroy();
  }
}
