import type { Knex } from 'knex';

/**
 * The "default spec" gives way to the headline track: a track's spec is what runs use, and
 * the headline track is chosen in the settings. The flag and its one-default index go.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.raw('DROP INDEX IF EXISTS model_specs_one_default');
  await knex.schema.alterTable('model_specs', (t) => t.dropColumn('is_default'));
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('model_specs', (t) => t.boolean('is_default').notNullable().defaultTo(false));
  // The headline track's spec becomes the default again (the setting's track, else the first one).
  await knex.raw(`
    UPDATE model_specs SET is_default = true
     WHERE id = (SELECT t.spec_id FROM tracks t
                   LEFT JOIN settings s ON s.key = 'headline_track' AND s.value = to_jsonb(t.code)
                  WHERE t.state <> 'archived'
                  ORDER BY (s.key IS NOT NULL) DESC, t.id LIMIT 1)`);
  await knex.raw('CREATE UNIQUE INDEX model_specs_one_default ON model_specs (is_default) WHERE is_default');
}
