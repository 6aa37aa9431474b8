import type { Knex } from 'knex';

/**
 * Indicator derivations: a derived series is computed in the database on load, never typed
 * by hand. `per_person` = source ÷ divisor (a total ÷ population); `real_from_nominal` =
 * source ÷ divisor × 100 (a nominal series ÷ a price index whose base year, recorded in
 * `base_year`, is 100). Sources are plain (non-derived) indicators; the divisor must be a
 * positive indicator so the division is always defined.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('indicators', (t) => {
    t.text('derivation').notNullable().defaultTo('none');
    t.integer('source_indicator_id').nullable().references('indicators.id').onDelete('RESTRICT');
    t.integer('divisor_indicator_id').nullable().references('indicators.id').onDelete('RESTRICT');
    t.integer('base_year').nullable();
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
  await knex.raw(`
    ALTER TABLE indicators
      ADD CONSTRAINT indicators_derivation_known CHECK (derivation IN ('none', 'per_person', 'real_from_nominal')),
      ADD CONSTRAINT indicators_derivation_sources CHECK (
        (derivation = 'none' AND source_indicator_id IS NULL AND divisor_indicator_id IS NULL AND base_year IS NULL)
        OR (derivation = 'per_person' AND source_indicator_id IS NOT NULL AND divisor_indicator_id IS NOT NULL AND base_year IS NULL)
        OR (derivation = 'real_from_nominal' AND source_indicator_id IS NOT NULL AND divisor_indicator_id IS NOT NULL
            AND base_year BETWEEN 1900 AND 2100)),
      ADD CONSTRAINT indicators_derivation_not_self CHECK (source_indicator_id <> id AND divisor_indicator_id <> id
        AND source_indicator_id <> divisor_indicator_id)`);
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw(`
    ALTER TABLE indicators
      DROP CONSTRAINT IF EXISTS indicators_derivation_not_self,
      DROP CONSTRAINT IF EXISTS indicators_derivation_sources,
      DROP CONSTRAINT IF EXISTS indicators_derivation_known`);
  await knex.schema.alterTable('indicators', (t) => {
    t.dropColumn('updated_at');
    t.dropColumn('base_year');
    t.dropColumn('divisor_indicator_id');
    t.dropColumn('source_indicator_id');
    t.dropColumn('derivation');
  });
}
