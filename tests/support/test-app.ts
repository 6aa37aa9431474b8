import type { Knex } from 'knex';
import { createApp } from '../../api/app';
import { loadConfig, type Config } from '../../api/config';

/** The exported app against a test database, quiet, with an optional web build folder. */
export function testApp(db: Knex, overrides: Partial<Config> = {}) {
  const config: Config = { ...loadConfig({ CRESTWATCH_MODE: 'test' }), logRequests: false, ...overrides };
  return createApp({ db, config, log: () => {} });
}
