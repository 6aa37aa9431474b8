import type { Knex } from 'knex';

/**
 * District boundaries in PostGIS.
 *
 * `CREATE EXTENSION postgis` needs a superuser and Debian's `postgresql-15-postgis-3`
 * package on the database server. When either is missing the migration stops with the
 * exact statement or command that is needed, rather than a bare permission error.
 *
 * A boundary upload is a change set in `uploads` (kind 'boundaries', so it takes the next
 * data version and shows in the upload history) with one row in `boundary_versions` and
 * one polygonal geometry per district in `district_boundaries`. The current boundaries are
 * those of the latest boundary version whose upload is still committed: reverting the
 * upload brings back the version before it.
 *
 * Area (km², on the geography type) and a point inside each district (ST_PointOnSurface,
 * for its mark on the map) are computed by the database when the version is written.
 */
export async function up(knex: Knex): Promise<void> {
  await ensurePostgis(knex);

  await knex.raw(`
    ALTER TABLE uploads DROP CONSTRAINT uploads_kind_known,
      ADD CONSTRAINT uploads_kind_known CHECK (kind IN ('file', 'seed', 'revert', 'derivation', 'boundaries'))`);

  await knex.schema.createTable('boundary_versions', (t) => {
    t.increments('id').primary();
    t.integer('upload_id').notNullable().unique().references('uploads.id').onDelete('CASCADE');
    t.text('code_property').notNullable();
    t.integer('feature_count').notNullable();
    t.integer('vertex_count').notNullable();
    t.integer('repaired_count').notNullable().defaultTo(0);
    t.integer('missing_count').notNullable().defaultTo(0);
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });

  await knex.raw(`
    CREATE TABLE district_boundaries (
      version_id integer NOT NULL REFERENCES boundary_versions(id) ON DELETE CASCADE,
      district_id integer NOT NULL REFERENCES districts(id) ON DELETE CASCADE,
      feature_index integer NOT NULL,
      geom geometry(MultiPolygon, 4326) NOT NULL,
      inside_point geometry(Point, 4326) NOT NULL,
      area_km2 double precision NOT NULL,
      PRIMARY KEY (version_id, district_id),
      CONSTRAINT district_boundaries_valid CHECK (ST_IsValid(geom)),
      CONSTRAINT district_boundaries_area_positive CHECK (area_km2 > 0)
    )`);
  await knex.raw(`CREATE INDEX district_boundaries_geom ON district_boundaries USING gist (geom)`);
}

async function ensurePostgis(knex: Knex): Promise<void> {
  const installed = await knex.raw(`SELECT 1 FROM pg_extension WHERE extname = 'postgis'`);
  if (installed.rows.length) return;
  const available = await knex.raw(`SELECT 1 FROM pg_available_extensions WHERE name = 'postgis'`);
  if (!available.rows.length) {
    throw new Error(
      'The PostGIS extension is not installed on the database server. On Debian run `sudo apt-get install -y postgresql-15-postgis-3` on the server, then migrate again.',
    );
  }
  const who = await knex.raw(`SELECT current_database() AS db, rolsuper FROM pg_roles WHERE rolname = current_user`);
  const { db, rolsuper } = who.rows[0] ?? { db: 'this database', rolsuper: false };
  if (!rolsuper) {
    throw new Error(
      `Creating the PostGIS extension needs a superuser. Ask the database administrator to run, in database "${db}": CREATE EXTENSION IF NOT EXISTS postgis; then migrate again.`,
    );
  }
  await knex.raw(`CREATE EXTENSION IF NOT EXISTS postgis`);
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw(`DROP TABLE IF EXISTS district_boundaries`);
  await knex.schema.dropTableIfExists('boundary_versions');
  await knex.raw(`DELETE FROM uploads WHERE kind = 'boundaries'`);
  await knex.raw(`
    ALTER TABLE uploads DROP CONSTRAINT uploads_kind_known,
      ADD CONSTRAINT uploads_kind_known CHECK (kind IN ('file', 'seed', 'revert', 'derivation'))`);
  // The extension stays: other objects may use it, and dropping it needs a superuser too.
}
