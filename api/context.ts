import type { Knex } from 'knex';
import type { Config } from './config';
import type { Mailer } from './mail/mailer';

/** What every feature's routes and services may use; built once per app. */
export interface AppContext {
  db: Knex;
  config: Config;
  log: (msg: string) => void;
  mailer: Mailer;
}
