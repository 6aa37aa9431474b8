import type { Knex } from 'knex';

/**
 * Tracks: what the agency watches. A track names an emissions indicator and the saved spec
 * its next run uses; every run belongs to one track, and "the latest published run" is
 * asked per track. Indicators gain who publishes the series and under which terms.
 *
 * Existing data: one track per distinct emissions indicator found in the saved specs and in
 * the runs' spec snapshots; each run goes to its indicator's track; the headline track is
 * the default spec's indicator (else the indicator of the newest run); every existing
 * subscription follows all tracks.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.raw(`ALTER TABLE indicators ADD COLUMN source text NULL, ADD COLUMN licence text NULL`);

  await knex.schema.createTable('tracks', (t) => {
    t.increments('id').primary();
    t.text('code').notNullable().unique();
    t.text('name').notNullable();
    t.text('emissions_indicator').notNullable();
    t.integer('spec_id').notNullable().references('model_specs.id');
    t.text('state').notNullable().defaultTo('active');
    t.integer('created_by').nullable().references('users.id').onDelete('SET NULL');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
  await knex.raw(`ALTER TABLE tracks ADD CONSTRAINT tracks_code_format CHECK (code ~ '^[a-z][a-z0-9-]{0,31}$')`);
  await knex.raw(
    `ALTER TABLE tracks ADD CONSTRAINT tracks_state_known CHECK (state IN ('active', 'paused', 'archived'))`,
  );

  // One track per emissions indicator the saved specs or the runs name. Its spec: the default
  // spec if it watches that indicator, else the newest live spec, else the newest spec, else
  // the spec of the newest run of that indicator.
  await knex.raw(`
    WITH named AS (
      SELECT emissions_indicator AS indicator FROM model_specs
      UNION
      SELECT spec->'selection'->>'emissions' FROM runs WHERE spec->'selection'->>'emissions' IS NOT NULL
    ),
    chosen AS (
      SELECT n.indicator,
        COALESCE(
          (SELECT s.id FROM model_specs s WHERE s.emissions_indicator = n.indicator
             ORDER BY s.is_default DESC, s.archived ASC, s.updated_at DESC, s.id DESC LIMIT 1),
          (SELECT r.spec_id FROM runs r WHERE r.spec->'selection'->>'emissions' = n.indicator
             ORDER BY r.created_at DESC, r.id DESC LIMIT 1)
        ) AS spec_id
      FROM named n
    )
    INSERT INTO tracks (code, name, emissions_indicator, spec_id)
    SELECT
      left(regexp_replace(regexp_replace(lower(c.indicator), '[^a-z0-9]+', '-', 'g'), '^[^a-z]+|-+$', '', 'g'), 32),
      COALESCE(i.name, c.indicator),
      c.indicator,
      c.spec_id
    FROM chosen c LEFT JOIN indicators i ON i.code = c.indicator
    WHERE c.spec_id IS NOT NULL`);

  await knex.raw(`ALTER TABLE runs ADD COLUMN track_id integer NULL REFERENCES tracks(id)`);
  await knex.raw(`
    UPDATE runs r SET track_id = t.id
    FROM model_specs s, tracks t
    WHERE s.id = r.spec_id
      AND t.emissions_indicator = COALESCE(r.spec->'selection'->>'emissions', s.emissions_indicator)`);
  await knex.raw(`ALTER TABLE runs ALTER COLUMN track_id SET NOT NULL`);
  await knex.raw(`DROP INDEX IF EXISTS runs_one_active_per_spec`);
  await knex.raw(
    `CREATE UNIQUE INDEX runs_one_active_per_track ON runs (track_id) WHERE state IN ('queued', 'running')`,
  );
  await knex.raw(`DROP INDEX IF EXISTS runs_published`);
  await knex.raw(`CREATE INDEX runs_published ON runs (track_id, published_at DESC) WHERE state = 'published'`);

  // The headline track: the default spec's indicator, else the newest run's.
  await knex.raw(`
    INSERT INTO settings (key, value)
    SELECT 'headline_track', to_jsonb(t.code)
    FROM tracks t
    ORDER BY
      EXISTS (SELECT 1 FROM model_specs s WHERE s.is_default AND s.emissions_indicator = t.emissions_indicator) DESC,
      (SELECT max(r.created_at) FROM runs r WHERE r.track_id = t.id) DESC NULLS LAST,
      t.id
    LIMIT 1
    ON CONFLICT (key) DO NOTHING`);

  // A subscription follows every track (including tracks created later) or the ones chosen.
  await knex.raw(`
    ALTER TABLE subscriptions
      ADD COLUMN all_tracks boolean NOT NULL DEFAULT true,
      ADD COLUMN track_ids integer[] NOT NULL DEFAULT '{}'`);
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw(`ALTER TABLE subscriptions DROP COLUMN track_ids, DROP COLUMN all_tracks`);
  await knex.raw(`DELETE FROM settings WHERE key = 'headline_track'`);
  await knex.raw(`DROP INDEX IF EXISTS runs_published`);
  await knex.raw(`CREATE INDEX runs_published ON runs (published_at DESC) WHERE state = 'published'`);
  await knex.raw(`DROP INDEX IF EXISTS runs_one_active_per_track`);
  await knex.raw(`CREATE UNIQUE INDEX runs_one_active_per_spec ON runs (spec_id) WHERE state IN ('queued', 'running')`);
  await knex.raw(`ALTER TABLE runs DROP COLUMN track_id`);
  await knex.schema.dropTable('tracks');
  await knex.raw(`ALTER TABLE indicators DROP COLUMN source, DROP COLUMN licence`);
}
