import type { Knex } from 'knex';

/**
 * Uploads and observation history.
 *
 * `uploads` is the log of change sets: a CSV file (`kind = 'file'`), the demo seed, a
 * revert of an earlier upload, or a recomputation of a derived indicator. A change set
 * that has been applied carries a `version`: the data version numbers 1, 2, 3 … in the
 * order changes were applied (not the order uploads were previewed), assigned as
 * max + 1 under the observations advisory lock that every change takes.
 *
 * Every value ever written is kept with the upload that wrote it: the current value of a
 * cell in `observations` (its `upload_id`), every value that was later replaced or
 * removed in `observation_history`, one row per such write, with the value before and
 * after and the uploads behind both. A first write into an empty cell leaves no history
 * row (the row in observations says it all until something replaces it), so a first load
 * of a million values writes a million rows, not two million.
 *
 * `observations_as_of(v)` rebuilds the observation set of data version v: per cell, the
 * first history row after v holds the value at v (unless its writer came after v, when
 * the cell was still empty); a cell with no history after v is as stored now, if its
 * upload's version is ≤ v.
 *
 * `upload_staging` holds one unlogged table of parsed rows per previewed upload, so a
 * preview can be committed later without sending the file again.
 *
 * Rows already in `observations` when this runs are given a baseline change set
 * (version 1), so every row has an upload.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('uploads', (t) => {
    t.increments('id').primary();
    t.text('kind').notNullable().defaultTo('file');
    t.text('status').notNullable();
    t.text('file_name').nullable();
    t.text('checksum').nullable();
    t.bigInteger('byte_size').nullable();
    t.text('format').nullable();
    t.jsonb('options').notNullable().defaultTo('{}');
    t.integer('user_id').nullable().references('users.id').onDelete('SET NULL');
    t.text('user_email').nullable();
    t.text('note').nullable();
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('committed_at', { useTz: true }).nullable();
    t.integer('version').nullable().unique();
    t.integer('reverts_upload_id').nullable().references('uploads.id');
    t.integer('reverted_by_upload_id').nullable().references('uploads.id');
    t.timestamp('reverted_at', { useTz: true }).nullable();
    t.integer('rows_read').notNullable().defaultTo(0);
    t.integer('value_count').notNullable().defaultTo(0);
    t.integer('insert_count').notNullable().defaultTo(0);
    t.integer('change_count').notNullable().defaultTo(0);
    t.integer('unchanged_count').notNullable().defaultTo(0);
    t.integer('remove_count').notNullable().defaultTo(0);
    t.integer('derived_count').notNullable().defaultTo(0);
    t.integer('error_count').notNullable().defaultTo(0);
    t.integer('warning_count').notNullable().defaultTo(0);
    t.jsonb('preview').nullable();
    t.jsonb('problems').nullable();
    t.text('staging_table').nullable();
  });
  await knex.raw(`
    ALTER TABLE uploads
      ADD CONSTRAINT uploads_kind_known CHECK (kind IN ('file', 'seed', 'revert', 'derivation')),
      ADD CONSTRAINT uploads_status_known CHECK (status IN ('previewed', 'committed', 'reverted', 'failed')),
      ADD CONSTRAINT uploads_format_known CHECK (format IS NULL OR format IN ('long', 'wide')),
      ADD CONSTRAINT uploads_file_has_checksum CHECK (kind <> 'file' OR checksum ~ '^[0-9a-f]{64}$'),
      ADD CONSTRAINT uploads_applied_has_version CHECK ((status IN ('committed', 'reverted')) = (version IS NOT NULL)),
      ADD CONSTRAINT uploads_revert_names_target CHECK ((kind = 'revert') = (reverts_upload_id IS NOT NULL))`);
  // A file is committed at most once at a time: the same bytes again are a no-op.
  await knex.raw(
    `CREATE UNIQUE INDEX uploads_committed_checksum ON uploads (checksum) WHERE kind = 'file' AND status = 'committed'`,
  );
  await knex.raw(`CREATE INDEX uploads_created_at ON uploads (created_at DESC, id DESC)`);

  await knex.schema.alterTable('observations', (t) => {
    t.integer('upload_id').nullable().references('uploads.id');
  });

  // Append-only, written in bulk: no row-by-row foreign-key checks (the ids come from
  // observations, which checks them) and only a BRIN index (the version grows with every
  // write). (version, district_id, indicator_id, year) is unique by construction.
  await knex.schema.createTable('observation_history', (t) => {
    t.integer('upload_id').notNullable();
    t.integer('version').notNullable();
    t.integer('district_id').notNullable();
    t.integer('indicator_id').notNullable();
    t.integer('year').notNullable();
    t.double('value').nullable();
    t.integer('value_upload_id').nullable();
    t.double('previous_value').nullable();
    t.integer('previous_upload_id').nullable();
    t.timestamp('written_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
  await knex.raw(`CREATE INDEX observation_history_version ON observation_history USING brin (version)`);

  await knex.raw(`
    CREATE FUNCTION observations_as_of(v integer)
    RETURNS TABLE (district_id integer, indicator_id integer, year integer, value double precision, upload_id integer)
    LANGUAGE sql STABLE AS $$
      WITH later AS (
        SELECT DISTINCT ON (h.district_id, h.indicator_id, h.year)
               h.district_id, h.indicator_id, h.year, h.previous_value, h.previous_upload_id
          FROM observation_history h WHERE h.version > v
         ORDER BY h.district_id, h.indicator_id, h.year, h.version
      )
      SELECT l.district_id, l.indicator_id, l.year, l.previous_value, l.previous_upload_id
        FROM later l JOIN uploads u ON u.id = l.previous_upload_id
       WHERE l.previous_value IS NOT NULL AND u.version <= v
      UNION ALL
      SELECT o.district_id, o.indicator_id, o.year, o.value, o.upload_id
        FROM observations o LEFT JOIN uploads u ON u.id = o.upload_id
       WHERE coalesce(u.version, 0) <= v
         AND NOT EXISTS (SELECT 1 FROM later l
                          WHERE l.district_id = o.district_id AND l.indicator_id = o.indicator_id AND l.year = o.year)
    $$`);

  await knex.raw(`CREATE SCHEMA upload_staging`);

  // Baseline for rows loaded before uploads were recorded.
  await knex.raw(`
    WITH baseline AS (
      INSERT INTO uploads (kind, status, note, committed_at, version, value_count, insert_count)
      SELECT 'seed', 'committed', 'observations present before uploads were recorded', now(),
             1, count(*), count(*)
        FROM observations HAVING count(*) > 0
      RETURNING id
    )
    UPDATE observations o SET upload_id = b.id FROM baseline b`);
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw(`DROP SCHEMA IF EXISTS upload_staging CASCADE`);
  await knex.raw(`DROP FUNCTION IF EXISTS observations_as_of(integer)`);
  await knex.schema.dropTableIfExists('observation_history');
  await knex.schema.alterTable('observations', (t) => {
    t.dropColumn('upload_id');
  });
  await knex.schema.dropTableIfExists('uploads');
}
