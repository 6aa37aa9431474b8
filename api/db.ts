import knexFactory, { type Knex } from 'knex';

export interface DbOptions {
  pool?: { min: number; max: number };
  /** Silence Knex's own console logging (for connections expected to fail). */
  quiet?: boolean;
}

/** One Knex instance per database URL; the caller destroys it on shutdown. */
export function createDb(databaseUrl: string, { pool = { min: 0, max: 10 }, quiet = false }: DbOptions = {}): Knex {
  const silent = () => {};
  return knexFactory({
    client: 'pg',
    connection: databaseUrl,
    pool,
    ...(quiet ? { log: { warn: silent, error: silent, debug: silent, deprecate: silent } } : {}),
  });
}

export type Db = Knex;
