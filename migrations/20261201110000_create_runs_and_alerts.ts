import type { Knex } from 'knex';

/**
 * Settings, saved model specs, runs and their estimates, alerts, subscriptions and the
 * mail outbox.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('settings', (t) => {
    t.text('key').primary();
    t.jsonb('value').notNullable();
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.integer('updated_by').nullable().references('users.id').onDelete('SET NULL');
  });

  await knex.schema.createTable('model_specs', (t) => {
    t.increments('id').primary();
    t.text('name').notNullable().unique();
    t.text('description').notNullable().defaultTo('');
    t.text('emissions_indicator').notNullable();
    t.text('driver_indicator').notNullable();
    t.specificType('controls', 'text[]').notNullable().defaultTo('{}');
    t.specificType('level_controls', 'text[]').notNullable().defaultTo('{}');
    t.text('form').notNullable();
    t.text('transform').notNullable();
    t.text('covariance').notNullable();
    t.integer('lag').nullable();
    t.text('interval_method').notNullable().defaultTo('fieller');
    t.integer('first_year').nullable();
    t.integer('last_year').nullable();
    t.integer('min_years').nullable();
    t.boolean('is_default').notNullable().defaultTo(false);
    t.boolean('archived').notNullable().defaultTo(false);
    t.integer('created_by').nullable().references('users.id').onDelete('SET NULL');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
  await knex.raw(`CREATE UNIQUE INDEX model_specs_one_default ON model_specs (is_default) WHERE is_default`);

  await knex.schema.createTable('runs', (t) => {
    t.increments('id').primary();
    t.integer('spec_id').notNullable().references('model_specs.id');
    t.jsonb('spec').notNullable();
    t.text('state').notNullable().defaultTo('queued');
    t.text('trigger').notNullable().defaultTo('manual');
    t.integer('reproduces_run_id').nullable().references('runs.id');
    t.integer('data_version').nullable();
    t.text('data_hash').nullable();
    t.integer('data_rows').nullable();
    t.text('software_version').notNullable();
    t.integer('requested_by').nullable().references('users.id').onDelete('SET NULL');
    t.integer('reviewed_by').nullable().references('users.id').onDelete('SET NULL');
    t.integer('chunks_total').nullable();
    t.integer('districts_total').nullable();
    t.jsonb('pooled').nullable();
    t.jsonb('timings').nullable();
    t.text('error').nullable();
    t.integer('attempts').notNullable().defaultTo(0);
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('started_at', { useTz: true }).nullable();
    t.timestamp('finished_at', { useTz: true }).nullable();
    t.timestamp('published_at', { useTz: true }).nullable();
    t.timestamp('discarded_at', { useTz: true }).nullable();
  });
  await knex.raw(
    `ALTER TABLE runs ADD CONSTRAINT runs_state_known CHECK (state IN ('queued', 'running', 'in_review', 'published', 'discarded', 'failed'))`,
  );
  // Only one run per spec at a time.
  await knex.raw(`CREATE UNIQUE INDEX runs_one_active_per_spec ON runs (spec_id) WHERE state IN ('queued', 'running')`);
  await knex.raw(`CREATE INDEX runs_published ON runs (published_at DESC) WHERE state = 'published'`);

  await knex.schema.createTable('run_chunks', (t) => {
    t.integer('run_id').notNullable().references('runs.id').onDelete('CASCADE');
    t.integer('chunk').notNullable();
    t.timestamp('done_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.primary(['run_id', 'chunk']);
  });

  // One row per district and variant. Estimates of a run are read only once the run has
  // reached in_review, so a crash mid-run shows nothing half-written.
  await knex.schema.createTable('run_estimates', (t) => {
    t.integer('run_id').notNullable().references('runs.id').onDelete('CASCADE');
    t.integer('district_id').notNullable().references('districts.id').onDelete('CASCADE');
    t.text('variant').notNullable();
    t.text('status').notNullable();
    t.text('standing').notNullable();
    t.text('shape').nullable();
    t.double('threshold').nullable();
    t.double('gap_percent').nullable();
    t.integer('crossing_year').nullable();
    t.boolean('u_test_rejects').nullable();
    t.boolean('interval_bounded').nullable();
    t.integer('last_year').nullable();
    t.jsonb('result').notNullable();
    t.primary(['run_id', 'district_id', 'variant']);
  });

  await knex.schema.createTable('run_notes', (t) => {
    t.increments('id').primary();
    t.integer('run_id').notNullable().references('runs.id').onDelete('CASCADE');
    t.integer('district_id').notNullable().references('districts.id').onDelete('CASCADE');
    t.text('note').notNullable();
    t.integer('author_id').nullable().references('users.id').onDelete('SET NULL');
    t.text('author_email').nullable();
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.unique(['run_id', 'district_id']);
  });

  await knex.schema.createTable('alerts', (t) => {
    t.increments('id').primary();
    t.integer('run_id').notNullable().references('runs.id').onDelete('CASCADE');
    t.integer('previous_run_id').nullable().references('runs.id').onDelete('SET NULL');
    t.integer('district_id').notNullable().references('districts.id').onDelete('CASCADE');
    t.text('kind').notNullable();
    t.jsonb('details').notNullable();
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.unique(['run_id', 'district_id', 'kind']);
  });
  await knex.raw(
    `ALTER TABLE alerts ADD CONSTRAINT alerts_kind_known CHECK (kind IN ('crossing', 'threshold_shift', 'shape_change', 'significance_change'))`,
  );

  await knex.schema.createTable('alert_reads', (t) => {
    t.integer('alert_id').notNullable().references('alerts.id').onDelete('CASCADE');
    t.integer('user_id').notNullable().references('users.id').onDelete('CASCADE');
    t.timestamp('read_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.primary(['alert_id', 'user_id']);
  });

  await knex.schema.createTable('subscriptions', (t) => {
    t.increments('id').primary();
    t.integer('user_id').notNullable().references('users.id').onDelete('CASCADE');
    t.text('scope').notNullable();
    t.specificType('district_ids', 'integer[]').notNullable().defaultTo('{}');
    t.specificType('kinds', 'text[]').notNullable();
    t.text('delivery').notNullable().defaultTo('instant');
    t.boolean('attach_brief').notNullable().defaultTo(false);
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
  await knex.raw(
    `ALTER TABLE subscriptions ADD CONSTRAINT subscriptions_scope_known CHECK (scope IN ('district', 'districts', 'region'))`,
  );
  await knex.raw(
    `ALTER TABLE subscriptions ADD CONSTRAINT subscriptions_delivery_known CHECK (delivery IN ('instant', 'digest'))`,
  );

  // Each (alert, subscriber) or (run, digest subscriber) is one row: sent exactly once.
  await knex.schema.createTable('outbox', (t) => {
    t.bigIncrements('id').primary();
    t.text('dedupe_key').notNullable().unique();
    t.integer('user_id').nullable().references('users.id').onDelete('CASCADE');
    t.integer('run_id').nullable().references('runs.id').onDelete('CASCADE');
    t.text('to_address').notNullable();
    t.jsonb('message').notNullable();
    t.text('status').notNullable().defaultTo('pending');
    t.integer('attempts').notNullable().defaultTo(0);
    t.timestamp('next_attempt_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.text('last_error').nullable();
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('sent_at', { useTz: true }).nullable();
  });
  await knex.raw(`CREATE INDEX outbox_pending ON outbox (next_attempt_at) WHERE status = 'pending'`);
}

export async function down(knex: Knex): Promise<void> {
  for (const table of [
    'outbox',
    'subscriptions',
    'alert_reads',
    'alerts',
    'run_notes',
    'run_estimates',
    'run_chunks',
    'runs',
    'model_specs',
    'settings',
  ]) {
    await knex.schema.dropTableIfExists(table);
  }
}
