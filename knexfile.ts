import type { Knex } from 'knex';
import { TEST_DB_PORT, demoDatabaseUrl } from './api/config';

const migrations: Knex.MigratorConfig = {
  directory: './migrations',
  extension: 'ts',
  loadExtensions: ['.ts'],
  tableName: 'knex_migrations',
};

const base = (connection: string): Knex.Config => ({
  client: 'pg',
  connection,
  pool: { min: 0, max: 10 },
  migrations,
});

const config: Record<string, Knex.Config> = {
  development: base(process.env.DATABASE_URL ?? demoDatabaseUrl()),
  test: base(process.env.TEST_DATABASE_URL ?? demoDatabaseUrl(TEST_DB_PORT, 'crestwatch_template')),
  production: base(process.env.DATABASE_URL ?? ''),
};

export default config;
