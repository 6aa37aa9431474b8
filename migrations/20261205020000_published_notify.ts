import type { Knex } from 'knex';

/**
 * Published answers (region, list, card, history) are kept per server process and named by
 * a version read from these tables. A change to any of them now also sends a notification
 * on the `crestwatch_published` channel when its transaction commits, so every process
 * listening (api/estimates/published-cache.ts) knows its version must be read again and
 * need not read it on every request. Statement-level triggers: one notification per
 * statement whatever the rows, and PostgreSQL folds repeats within a transaction.
 */
const TABLES = ['runs', 'tracks', 'settings', 'run_notes', 'uploads', 'districts'];

export async function up(knex: Knex): Promise<void> {
  await knex.raw(`
    CREATE FUNCTION crestwatch_published_changed() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      PERFORM pg_notify('crestwatch_published', '');
      RETURN NULL;
    END $$`);
  for (const table of TABLES) {
    await knex.raw(`
      CREATE TRIGGER ${table}_published_changed
        AFTER INSERT OR UPDATE OR DELETE OR TRUNCATE ON ${table}
        FOR EACH STATEMENT EXECUTE FUNCTION crestwatch_published_changed()`);
  }
}

export async function down(knex: Knex): Promise<void> {
  for (const table of TABLES) await knex.raw(`DROP TRIGGER IF EXISTS ${table}_published_changed ON ${table}`);
  await knex.raw('DROP FUNCTION IF EXISTS crestwatch_published_changed()');
}
