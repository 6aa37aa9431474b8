import type { Knex } from 'knex';

/**
 * Two more derivation kinds: `from_boundaries` (the district's land area in km², from the
 * current boundary version, the same value for every year the district has data; no
 * sources) and `ratio` (source ÷ divisor, e.g. population density = population ÷ land
 * area). A ratio may divide by an indicator derived from boundaries.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.raw(`
    ALTER TABLE indicators
      DROP CONSTRAINT indicators_derivation_known,
      DROP CONSTRAINT indicators_derivation_sources,
      ADD CONSTRAINT indicators_derivation_known CHECK (derivation IN ('none', 'per_person', 'real_from_nominal', 'from_boundaries', 'ratio')),
      ADD CONSTRAINT indicators_derivation_sources CHECK (
        (derivation IN ('none', 'from_boundaries') AND source_indicator_id IS NULL AND divisor_indicator_id IS NULL AND base_year IS NULL)
        OR (derivation IN ('per_person', 'ratio') AND source_indicator_id IS NOT NULL AND divisor_indicator_id IS NOT NULL AND base_year IS NULL)
        OR (derivation = 'real_from_nominal' AND source_indicator_id IS NOT NULL AND divisor_indicator_id IS NOT NULL
            AND base_year BETWEEN 1900 AND 2100))`);
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw(`UPDATE indicators SET derivation = 'none' WHERE derivation = 'from_boundaries'`);
  await knex.raw(`UPDATE indicators SET derivation = 'per_person' WHERE derivation = 'ratio'`);
  await knex.raw(`
    ALTER TABLE indicators
      DROP CONSTRAINT indicators_derivation_known,
      DROP CONSTRAINT indicators_derivation_sources,
      ADD CONSTRAINT indicators_derivation_known CHECK (derivation IN ('none', 'per_person', 'real_from_nominal')),
      ADD CONSTRAINT indicators_derivation_sources CHECK (
        (derivation = 'none' AND source_indicator_id IS NULL AND divisor_indicator_id IS NULL AND base_year IS NULL)
        OR (derivation = 'per_person' AND source_indicator_id IS NOT NULL AND divisor_indicator_id IS NOT NULL AND base_year IS NULL)
        OR (derivation = 'real_from_nominal' AND source_indicator_id IS NOT NULL AND divisor_indicator_id IS NOT NULL
            AND base_year BETWEEN 1900 AND 2100))`);
}
