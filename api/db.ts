import knexFactory, { type Knex } from 'knex';

/** One Knex instance per database URL; the caller destroys it on shutdown. */
export function createDb(databaseUrl: string, pool = { min: 0, max: 10 }): Knex {
  return knexFactory({ client: 'pg', connection: databaseUrl, pool });
}

export type Db = Knex;
