import type { Knex } from 'knex';
import type { Config } from './config';

/** What every feature's routes and services may use; built once by app.ts's caller. */
export interface AppContext {
  db: Knex;
  config: Config;
  log: (msg: string) => void;
}
