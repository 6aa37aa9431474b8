import type { Knex } from 'knex';
import type { ComputePool } from './compute/pool';
import type { Config } from './config';
import type { Jobs } from './jobs/boss';
import type { Mailer } from './mail/mailer';

/** What every feature's routes and services may use; built once per app. */
export interface AppContext {
  db: Knex;
  config: Config;
  log: (msg: string) => void;
  mailer: Mailer;
  /** The job queue; null where none was started (then starting a run answers 503). */
  jobs: Jobs | null;
  /** Worker threads for CPU-heavy work (fits, PDFs), so readers are never starved. */
  compute: ComputePool;
}
