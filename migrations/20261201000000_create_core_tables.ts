import type { Knex } from 'knex';

/** The core tables: districts, indicators, observations, users and the session table. */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('districts', (t) => {
    t.increments('id').primary();
    t.text('code').notNullable().unique();
    t.text('name').notNullable();
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });

  await knex.schema.createTable('indicators', (t) => {
    t.increments('id').primary();
    t.text('code').notNullable().unique();
    t.text('name').notNullable();
    t.text('unit').notNullable();
    t.text('description').notNullable().defaultTo('');
    t.boolean('must_be_positive').notNullable().defaultTo(false);
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
  await knex.raw(
    `ALTER TABLE indicators ADD CONSTRAINT indicators_code_format CHECK (code ~ '^[a-z][a-z0-9_]{0,62}$')`,
  );

  await knex.schema.createTable('observations', (t) => {
    t.bigIncrements('id').primary();
    t.integer('district_id').notNullable().references('districts.id').onDelete('CASCADE');
    t.integer('indicator_id').notNullable().references('indicators.id').onDelete('RESTRICT');
    t.integer('year').notNullable();
    t.double('value').notNullable();
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.unique(['district_id', 'indicator_id', 'year']);
  });
  await knex.raw(`ALTER TABLE observations ADD CONSTRAINT observations_year_range CHECK (year BETWEEN 1900 AND 2100)`);
  await knex.raw(
    `ALTER TABLE observations ADD CONSTRAINT observations_value_finite CHECK (value <> 'NaN'::float8 AND value < 'Infinity'::float8 AND value > '-Infinity'::float8)`,
  );

  await knex.schema.createTable('users', (t) => {
    t.increments('id').primary();
    t.text('email').notNullable();
    t.text('name').notNullable().defaultTo('');
    t.text('role').notNullable();
    t.boolean('active').notNullable().defaultTo(true);
    t.text('google_sub').nullable().unique();
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('last_sign_in_at', { useTz: true }).nullable();
  });
  await knex.raw(`CREATE UNIQUE INDEX users_email_lower ON users (lower(email))`);
  await knex.raw(`ALTER TABLE users ADD CONSTRAINT users_role_known CHECK (role IN ('admin', 'analyst', 'official'))`);

  // connect-pg-simple's table, created here (createTableIfMissing: false) so parallel
  // test workers never race to create it.
  await knex.schema.createTable('session', (t) => {
    t.string('sid').primary();
    t.json('sess').notNullable();
    t.timestamp('expire', { precision: 6 }).notNullable().index('session_expire_idx');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('session');
  await knex.schema.dropTableIfExists('users');
  await knex.schema.dropTableIfExists('observations');
  await knex.schema.dropTableIfExists('indicators');
  await knex.schema.dropTableIfExists('districts');
}
