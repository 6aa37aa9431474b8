import type { Knex } from 'knex';

/**
 * observations are keyed by what they are — (district, indicator, year) — instead of a
 * surrogate id that nothing reads: a million-row first load no longer draws a million
 * sequence values and builds a second index, and each row is 8 bytes shorter.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.raw(`
    ALTER TABLE observations
      DROP COLUMN id,
      DROP CONSTRAINT observations_district_id_indicator_id_year_unique,
      ADD CONSTRAINT observations_pkey PRIMARY KEY (district_id, indicator_id, year)`);
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw(`
    ALTER TABLE observations
      DROP CONSTRAINT observations_pkey,
      ADD CONSTRAINT observations_district_id_indicator_id_year_unique UNIQUE (district_id, indicator_id, year),
      ADD COLUMN id bigserial PRIMARY KEY`);
}
