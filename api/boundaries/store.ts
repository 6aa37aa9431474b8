/**
 * Boundary SQL: staging a file's features in a temp table, the PostGIS checks (validity,
 * repair with ST_MakeValid keeping the polygonal parts), writing a version, the current
 * version and its geometry, the version history.
 */
import type { Knex } from 'knex';
import type { Sql } from '../db/connection';
import type { CheckedFeature } from './check-features';

/** Features per INSERT when staging. */
const BATCH = 500;

export async function stageFeatures(conn: Sql, features: CheckedFeature[]): Promise<void> {
  await conn.query(`CREATE TEMP TABLE boundary_stage (
      feature_index integer PRIMARY KEY, code text NOT NULL, gj text NOT NULL,
      geom geometry, valid boolean, reason text, fixed geometry) ON COMMIT DROP`);
  for (let i = 0; i < features.length; i += BATCH) {
    const part = features.slice(i, i + BATCH);
    await conn.query(
      `INSERT INTO boundary_stage (feature_index, code, gj) SELECT * FROM unnest($1::int[], $2::text[], $3::text[])`,
      [part.map((f) => f.index), part.map((f) => f.code), part.map((f) => JSON.stringify(f.geometry))],
    );
  }
  await conn.query(`UPDATE boundary_stage SET geom = ST_SetSRID(ST_GeomFromGeoJSON(gj), 4326), gj = ''`);
  await conn.query(
    `UPDATE boundary_stage SET valid = ST_IsValid(geom), reason = CASE WHEN ST_IsValid(geom) THEN NULL ELSE ST_IsValidReason(geom) END`,
  );
}

/** Features PostGIS finds invalid (self-intersections and the like), with its reason. */
export async function invalidFeatures(conn: Sql): Promise<{ index: number; code: string; reason: string }[]> {
  const { rows } = await conn.query(
    `SELECT feature_index, code, reason FROM boundary_stage WHERE NOT valid ORDER BY feature_index`,
  );
  return rows.map((r) => ({ index: r.feature_index, code: r.code, reason: r.reason }));
}

/**
 * Repairs the invalid features with ST_MakeValid, keeping only the polygonal parts
 * (ST_MakeValid can answer a collection with lines or points). Returns the features the
 * repair left empty.
 */
export async function repairInvalid(conn: Sql): Promise<{ index: number; code: string }[]> {
  await conn.query(
    `UPDATE boundary_stage SET fixed = ST_Multi(ST_CollectionExtract(ST_MakeValid(geom), 3)) WHERE NOT valid`,
  );
  const { rows } = await conn.query(
    `SELECT feature_index, code FROM boundary_stage WHERE NOT valid AND (fixed IS NULL OR ST_IsEmpty(fixed) OR NOT ST_IsValid(fixed)) ORDER BY feature_index`,
  );
  return rows.map((r) => ({ index: r.feature_index, code: r.code }));
}

export interface StagedSummary {
  index: number;
  code: string;
  areaKm2: number;
}

/** Area on the geography type (km²) of each staged feature, as it would be written. */
export async function stagedAreas(conn: Sql, limit: number): Promise<StagedSummary[]> {
  const { rows } = await conn.query(
    `SELECT feature_index, code, ST_Area(coalesce(fixed, geom)::geography) / 1e6 AS km2 FROM boundary_stage ORDER BY feature_index LIMIT $1`,
    [limit],
  );
  return rows.map((r) => ({ index: r.feature_index, code: r.code, areaKm2: Number(r.km2) }));
}

/** Records on the boundary change set's upload row the cells derived from the new areas. */
export async function addDerivedCount(conn: Sql, uploadId: number, derived: number): Promise<void> {
  await conn.query(`UPDATE uploads SET derived_count = $2, value_count = value_count + $2 WHERE id = $1`, [
    uploadId,
    derived,
  ]);
}

/** How many boundary versions and districts the region has (the demo seeds boundaries only into an empty one). */
export async function boundaryCounts(db: Knex): Promise<{ versions: number; districts: number }> {
  const { rows } = await db.raw(
    `SELECT (SELECT count(*)::int FROM boundary_versions) AS versions, (SELECT count(*)::int FROM districts) AS districts`,
  );
  return { versions: rows[0].versions, districts: rows[0].districts };
}

export async function districtCodes(conn: Sql): Promise<Map<string, { id: number; name: string }>> {
  const { rows } = await conn.query(`SELECT id, code, name FROM districts`);
  return new Map(rows.map((r) => [r.code as string, { id: r.id as number, name: r.name as string }]));
}

export async function insertVersion(
  conn: Sql,
  v: { uploadId: number; codeProperty: string; features: number; vertices: number; repaired: number; missing: number },
): Promise<number> {
  const { rows } = await conn.query(
    `INSERT INTO boundary_versions (upload_id, code_property, feature_count, vertex_count, repaired_count, missing_count)
     VALUES ($1, $2, $3, $4, $5, $6) RETURNING id`,
    [v.uploadId, v.codeProperty, v.features, v.vertices, v.repaired, v.missing],
  );
  return rows[0].id;
}

/** Writes the staged features as the version's boundaries: area and inside point computed here. */
export async function writeBoundaries(conn: Sql, versionId: number): Promise<number> {
  const { rowCount } = await conn.query(
    `INSERT INTO district_boundaries (version_id, district_id, feature_index, geom, inside_point, area_km2)
     SELECT $1, d.id, s.feature_index, g.geom, ST_PointOnSurface(g.geom), ST_Area(g.geom::geography) / 1e6
       FROM boundary_stage s JOIN districts d ON d.code = s.code
       CROSS JOIN LATERAL (SELECT ST_Multi(coalesce(s.fixed, s.geom))::geometry(MultiPolygon, 4326) AS geom) g`,
    [versionId],
  );
  return rowCount ?? 0;
}

export interface BoundaryVersionRecord {
  id: number;
  uploadId: number;
  dataVersion: number | null;
  status: string;
  fileName: string | null;
  userEmail: string | null;
  createdAt: Date;
  codeProperty: string;
  features: number;
  vertices: number;
  repaired: number;
  missing: number;
  current: boolean;
}

const VERSION_SQL = `
  SELECT b.id, b.upload_id, u.version AS data_version, u.status, u.file_name, u.user_email, b.created_at, b.code_property,
         b.feature_count, b.vertex_count, b.repaired_count, b.missing_count
    FROM boundary_versions b JOIN uploads u ON u.id = b.upload_id`;

/** A row of VERSION_SQL as pg returns it. */
interface VersionRow {
  id: number;
  upload_id: number;
  data_version: number | null;
  status: string;
  file_name: string | null;
  user_email: string | null;
  created_at: Date;
  code_property: string;
  feature_count: number;
  vertex_count: number;
  repaired_count: number;
  missing_count: number;
}

function toVersion(r: VersionRow, currentId: number | null): BoundaryVersionRecord {
  return {
    id: r.id,
    uploadId: r.upload_id,
    dataVersion: r.data_version,
    status: r.status,
    fileName: r.file_name,
    userEmail: r.user_email,
    createdAt: r.created_at,
    codeProperty: r.code_property,
    features: r.feature_count,
    vertices: r.vertex_count,
    repaired: r.repaired_count,
    missing: r.missing_count,
    current: r.id === currentId,
  };
}

/** The current boundary version: the latest whose upload is still committed (null: none). */
export async function currentVersionId(db: Knex | Sql): Promise<number | null> {
  const sql = `SELECT b.id FROM boundary_versions b JOIN uploads u ON u.id = b.upload_id WHERE u.status = 'committed' ORDER BY u.version DESC LIMIT 1`;
  const rows = 'query' in db ? (await db.query(sql)).rows : (await (db as Knex).raw(sql)).rows;
  return rows[0]?.id ?? null;
}

export async function listVersions(db: Knex): Promise<BoundaryVersionRecord[]> {
  const current = await currentVersionId(db);
  const { rows } = await db.raw(`${VERSION_SQL} ORDER BY b.id DESC`);
  return rows.map((r: VersionRow) => toVersion(r, current));
}

export async function findVersion(db: Knex | Sql, id: number): Promise<BoundaryVersionRecord | null> {
  const sql = `${VERSION_SQL} WHERE b.id = $1`;
  const rows =
    'query' in db ? (await db.query(sql, [id])).rows : (await (db as Knex).raw(sql.replace('$1', '?'), [id])).rows;
  return rows[0] ? toVersion(rows[0], await currentVersionId(db)) : null;
}

export interface BoundaryRow {
  code: string;
  name: string;
  areaKm2: number;
  point: [number, number];
  geometry: string;
}

/** One version's boundaries as GeoJSON text per district (full detail), in code order. */
export async function versionGeometry(db: Knex, versionId: number): Promise<BoundaryRow[]> {
  const { rows } = await db.raw(
    `SELECT d.code, d.name, b.area_km2, ST_X(b.inside_point) AS px, ST_Y(b.inside_point) AS py, ST_AsGeoJSON(b.geom, 9) AS gj
       FROM district_boundaries b JOIN districts d ON d.id = b.district_id
      WHERE b.version_id = ? ORDER BY d.code COLLATE "C"`,
    [versionId],
  );
  return rows.map(
    (r: {
      code: string;
      name: string;
      area_km2: string | number;
      px: string | number;
      py: string | number;
      gj: string;
    }) => ({
      code: r.code,
      name: r.name,
      areaKm2: Number(r.area_km2),
      point: [Number(r.px), Number(r.py)],
      geometry: r.gj,
    }),
  );
}

/** Districts with no boundary in a version, in code order. */
export async function districtsWithout(db: Knex, versionId: number | null): Promise<{ code: string; name: string }[]> {
  const { rows } = await db.raw(
    `SELECT d.code, d.name FROM districts d
      WHERE NOT EXISTS (SELECT 1 FROM district_boundaries b WHERE b.district_id = d.id AND b.version_id = ?)
      ORDER BY d.code COLLATE "C"`,
    [versionId ?? 0],
  );
  return rows;
}
