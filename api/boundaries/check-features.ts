/**
 * The checks on a boundary file that need no database: the file is a GeoJSON (RFC 7946)
 * FeatureCollection of Polygon or MultiPolygon features in WGS 84 longitude/latitude, each
 * with a district code in the chosen property. Reported per feature (its index in
 * `features`, from 0, and its code when it has one) with a reason:
 * - not a FeatureCollection, a `crs` member naming another reference system;
 * - a feature that is not a Feature, has no code, or repeats a code;
 * - a geometry that is not a Polygon or MultiPolygon, badly formed coordinates, a ring
 *   with fewer than 4 positions or not closed (last position ≠ first), a longitude
 *   outside −180…180 or a latitude outside −90…90, more vertices than allowed;
 * - 3-D positions: the third value is dropped, with a note (a warning).
 * Codes unknown to the region and districts left without a boundary need the district
 * list, and self-intersections need PostGIS: see service.ts.
 */
import type { MultiPolygon, Position } from 'geojson';

export type BoundaryProblemCode =
  | 'not_feature_collection'
  | 'foreign_crs'
  | 'not_feature'
  | 'no_code'
  | 'duplicate_code'
  | 'unknown_code'
  | 'not_polygon'
  | 'bad_coordinates'
  | 'short_ring'
  | 'unclosed_ring'
  | 'out_of_range'
  | 'too_many_vertices'
  | 'self_intersection'
  | 'repaired'
  | 'dropped_z'
  | 'no_boundary'
  | 'crs84_member';

export interface BoundaryProblem {
  /** index in `features` (from 0); null for the file as a whole or a district */
  feature: number | null;
  code: string | null;
  problem: BoundaryProblemCode;
  severity: 'error' | 'warning';
  reason: string;
}

export interface CheckedFeature {
  index: number;
  code: string;
  name: string | null;
  geometry: MultiPolygon;
  vertices: number;
}

export interface FeatureCheck {
  features: CheckedFeature[];
  problems: BoundaryProblem[];
  /** features in the file */
  total: number;
  vertices: number;
}

const CRS84 = /^(urn:ogc:def:crs:OGC:(1\.3:)?CRS84|EPSG:4326|urn:ogc:def:crs:EPSG::4326)$/i;

function isObject(v: unknown): v is Record<string, unknown> {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

function crsName(crs: unknown): string | null {
  if (!isObject(crs) || !isObject(crs.properties)) return null;
  const name = crs.properties.name;
  return typeof name === 'string' ? name : null;
}

/** A short text for a value in a reason ("a string", "null", …). */
function kindOf(v: unknown): string {
  if (v === null) return 'null';
  if (Array.isArray(v)) return 'an array';
  return `a ${typeof v}`;
}

/** Checks one polygon's rings, in place: drops 3-D values; returns a reason or the vertex count. */
function checkPolygon(poly: unknown, where: string, z: { dropped: number }): string | number {
  if (!Array.isArray(poly) || poly.length === 0) return `${where} is not a list of rings`;
  let count = 0;
  for (let r = 0; r < poly.length; r++) {
    const ring = poly[r];
    const at = `${where}, ring ${r}${r === 0 ? ' (outer)' : ''}`;
    if (!Array.isArray(ring)) return `${at} is not a list of positions`;
    if (ring.length < 4) return `short:${at} has ${ring.length} positions; a closed ring needs at least 4`;
    for (let p = 0; p < ring.length; p++) {
      const pos = ring[p];
      if (!Array.isArray(pos) || pos.length < 2 || !pos.every((v) => typeof v === 'number' && Number.isFinite(v))) {
        return `${at}, position ${p} is not [longitude, latitude] numbers`;
      }
      const [lon, lat] = pos as number[];
      if (lon < -180 || lon > 180 || lat < -90 || lat > 90) {
        return `range:${at}, position ${p} is [${lon}, ${lat}]: longitude must lie within −180…180 and latitude within −90…90 (WGS 84 degrees)`;
      }
      if (pos.length > 2) {
        z.dropped += 1;
        ring[p] = [lon, lat];
      }
    }
    const a = ring[0] as Position;
    const b = ring[ring.length - 1] as Position;
    if (a[0] !== b[0] || a[1] !== b[1])
      return `unclosed:${at} is not closed: its last position [${b[0]}, ${b[1]}] differs from its first [${a[0]}, ${a[1]}]`;
    count += ring.length;
  }
  return count;
}

/** The database-free checks; see the module comment. */
export function checkFeatures(root: unknown, codeProperty: string, maxVertices: number): FeatureCheck {
  const problems: BoundaryProblem[] = [];
  const out: CheckedFeature[] = [];
  const fileError = (problem: BoundaryProblemCode, reason: string) =>
    problems.push({ feature: null, code: null, problem, severity: 'error', reason });
  if (!isObject(root) || root.type !== 'FeatureCollection' || !Array.isArray(root.features)) {
    const what = isObject(root)
      ? typeof root.type === 'string'
        ? `a GeoJSON ${root.type}`
        : 'an object without a GeoJSON "type"'
      : kindOf(root);
    fileError('not_feature_collection', `the file is ${what}, not a GeoJSON FeatureCollection with a "features" list`);
    return { features: [], problems, total: 0, vertices: 0 };
  }
  if (root.crs !== undefined) {
    const name = crsName(root.crs);
    if (name && CRS84.test(name)) {
      problems.push({
        feature: null,
        code: null,
        problem: 'crs84_member',
        severity: 'warning',
        reason: `the "crs" member names ${name}, which is WGS 84 longitude/latitude as RFC 7946 requires; it is ignored`,
      });
    } else {
      fileError(
        'foreign_crs',
        `the "crs" member names ${name ?? 'an unreadable reference system'}; RFC 7946 GeoJSON is WGS 84 longitude/latitude only: reproject the file to WGS 84 (EPSG:4326) and drop "crs"`,
      );
    }
  }
  const seen = new Map<string, number>();
  let vertices = 0;
  root.features.forEach((f: unknown, index: number) => {
    const err = (problem: BoundaryProblemCode, code: string | null, reason: string) =>
      problems.push({ feature: index, code, problem, severity: 'error', reason });
    if (!isObject(f) || f.type !== 'Feature')
      return err(
        'not_feature',
        null,
        `feature ${index} is ${isObject(f) ? `of type ${JSON.stringify(f.type)}` : kindOf(f)}, not a GeoJSON Feature`,
      );
    const props = isObject(f.properties) ? f.properties : {};
    const raw = props[codeProperty];
    const code = typeof raw === 'string' ? raw.trim() : typeof raw === 'number' ? String(raw) : '';
    if (!code)
      return err(
        'no_code',
        null,
        `feature ${index} has no district code in its "${codeProperty}" property (choose the property with codeProperty)`,
      );
    const first = seen.get(code);
    if (first !== undefined)
      return err(
        'duplicate_code',
        code,
        `feature ${index} repeats the code ${code} of feature ${first}; each district needs exactly one feature (merge its parts into one MultiPolygon)`,
      );
    seen.set(code, index);
    const g = f.geometry;
    if (!isObject(g) || (g.type !== 'Polygon' && g.type !== 'MultiPolygon')) {
      return err(
        'not_polygon',
        code,
        `feature ${index} (${code}) has ${isObject(g) ? `a ${String(g.type)} geometry` : 'no geometry'}; a district boundary must be a Polygon or MultiPolygon`,
      );
    }
    const polys = g.type === 'Polygon' ? [g.coordinates] : g.coordinates;
    if (!Array.isArray(polys) || polys.length === 0)
      return err('bad_coordinates', code, `feature ${index} (${code}): "coordinates" is not a list of polygons`);
    const z = { dropped: 0 };
    let count = 0;
    for (let p = 0; p < polys.length; p++) {
      const r = checkPolygon(polys[p], g.type === 'Polygon' ? 'the polygon' : `polygon ${p}`, z);
      if (typeof r === 'string') {
        const [kind, text] = r.startsWith('short:')
          ? ['short_ring', r.slice(6)]
          : r.startsWith('range:')
            ? ['out_of_range', r.slice(6)]
            : r.startsWith('unclosed:')
              ? ['unclosed_ring', r.slice(9)]
              : ['bad_coordinates', r];
        return err(kind as BoundaryProblemCode, code, `feature ${index} (${code}): ${text}`);
      }
      count += r;
      if (count > maxVertices) {
        return err(
          'too_many_vertices',
          code,
          `feature ${index} (${code}) has more than ${maxVertices.toLocaleString('en')} vertices (BOUNDARY_MAX_VERTICES); simplify it before uploading`,
        );
      }
    }
    if (z.dropped > 0) {
      problems.push({
        feature: index,
        code,
        problem: 'dropped_z',
        severity: 'warning',
        reason: `feature ${index} (${code}): ${z.dropped} positions had a third (height) value, which was dropped`,
      });
    }
    vertices += count;
    const name = typeof props.name === 'string' ? props.name : null;
    out.push({
      index,
      code,
      name,
      geometry: { type: 'MultiPolygon', coordinates: polys as Position[][][] },
      vertices: count,
    });
  });
  return { features: out, problems, total: root.features.length, vertices };
}
