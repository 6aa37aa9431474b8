/** Shared by the boundary tests: uploading GeoJSON, and an invented grid region of many districts. */
import type { Knex } from 'knex';
import type TestAgent from 'supertest/lib/agent';

export function uploadGeoJson(
  agent: TestAgent,
  content: unknown,
  query: { commit?: boolean; repair?: boolean; codeProperty?: string } = {},
  fileName = 'boundaries.geojson',
) {
  const body = Buffer.isBuffer(content)
    ? content
    : Buffer.from(typeof content === 'string' ? content : JSON.stringify(content), 'utf8');
  return agent
    .post('/api/boundaries')
    .query(query)
    .attach('file', body, { filename: fileName, contentType: 'application/geo+json' });
}

/** A small deterministic generator (an LCG) so the grid is the same every run. */
function lcg(seed: number) {
  let s = seed >>> 0;
  return () => {
    s = (Math.imul(s, 1664525) + 1013904223) >>> 0;
    return s / 4294967296;
  };
}

/**
 * An invented region of cols × rows districts on a grid whose edges are wiggly lines of
 * `perEdge` points, each edge drawn once and used by both neighbours (so shared edges are
 * exactly shared, as in a real boundary file). Centred in open ocean like the demo.
 * Outer rings counter-clockwise (RFC 7946). `codes` names the cells in row order (default G0001…).
 */
export function gridRegion(cols: number, rows: number, perEdge = 24, cell = 0.05, codes?: string[]) {
  const rnd = lcg(20261204);
  const x0 = -150;
  const y0 = -50;
  const node = (i: number, j: number): [number, number] => [x0 + i * cell, y0 + j * cell];
  const edge = new Map<string, [number, number][]>();
  const wiggly = (a: [number, number], b: [number, number]): [number, number][] => {
    const pts: [number, number][] = [a];
    const nx = -(b[1] - a[1]);
    const ny = b[0] - a[0];
    for (let k = 1; k < perEdge - 1; k++) {
      const t = k / (perEdge - 1);
      const off = (rnd() - 0.5) * 0.12 * Math.sin(Math.PI * t);
      pts.push([a[0] + t * (b[0] - a[0]) + off * nx, a[1] + t * (b[1] - a[1]) + off * ny]);
    }
    pts.push(b);
    return pts;
  };
  // horizontal edge (i,j)→(i+1,j) and vertical edge (i,j)→(i,j+1)
  const h = (i: number, j: number) => {
    const k = `h${i},${j}`;
    if (!edge.has(k)) edge.set(k, wiggly(node(i, j), node(i + 1, j)));
    return edge.get(k)!;
  };
  const v = (i: number, j: number) => {
    const k = `v${i},${j}`;
    if (!edge.has(k)) edge.set(k, wiggly(node(i, j), node(i, j + 1)));
    return edge.get(k)!;
  };
  const round = (p: [number, number]): [number, number] => [Math.round(p[0] * 1e7) / 1e7, Math.round(p[1] * 1e7) / 1e7];
  const features = [];
  const districts: { code: string; name: string }[] = [];
  for (let j = 0; j < rows; j++) {
    for (let i = 0; i < cols; i++) {
      // counter-clockwise: bottom left→right, right up, top right→left, left down
      const ring = [
        ...h(i, j),
        ...v(i + 1, j).slice(1),
        ...[...h(i, j + 1)].reverse().slice(1),
        ...[...v(i, j)].reverse().slice(1),
      ].map(round);
      const code = codes?.[j * cols + i] ?? `G${String(j * cols + i + 1).padStart(4, '0')}`;
      districts.push({ code, name: `Grid district ${j * cols + i + 1}` });
      features.push({
        type: 'Feature',
        properties: { code, name: `Grid district ${j * cols + i + 1}` },
        geometry: { type: 'Polygon', coordinates: [ring] },
      });
    }
  }
  return { geojson: { type: 'FeatureCollection', features }, districts };
}

export async function insertDistricts(db: Knex, districts: { code: string; name: string }[]): Promise<void> {
  await db.batchInsert('districts', districts, 1000);
}

/**
 * Topology checks in PostGIS on an answer of GET /api/boundaries against the stored
 * boundaries of its version: overlaps (sum of the parts' areas minus the area of their
 * union), gaps (the union's area against the stored union's), and interior rings in the
 * union that the stored union does not have. Areas in km² on the geography type.
 */
export async function topologyFigures(db: Knex, answer: { features: { geometry: unknown }[] }, versionId: number) {
  const gj = JSON.stringify(answer.features.map((f) => f.geometry));
  const { rows } = await db.raw(
    `WITH s AS (SELECT ST_SetSRID(ST_GeomFromGeoJSON(g::text), 4326) AS geom FROM jsonb_array_elements(?::jsonb) g),
          su AS (SELECT ST_Union(geom) AS u, sum(ST_Area(geom::geography)) AS parts FROM s),
          o AS (SELECT ST_Union(geom) AS u FROM district_boundaries WHERE version_id = ?),
          holes AS (SELECT (SELECT coalesce(sum(ST_NumInteriorRings(d.geom)), 0) FROM ST_Dump(su.u) d) AS simplified,
                           (SELECT coalesce(sum(ST_NumInteriorRings(d.geom)), 0) FROM ST_Dump(o.u) d) AS original FROM su, o)
     SELECT su.parts, ST_Area(su.u::geography) AS union_area, ST_Area(o.u::geography) AS original_union,
            holes.simplified AS holes_simplified, holes.original AS holes_original,
            (SELECT bool_and(ST_IsValid(geom)) FROM s) AS all_valid
       FROM su, o, holes`,
    [gj, versionId],
  );
  const r = rows[0];
  const km2 = (x: unknown) => Number(x) / 1e6;
  return {
    partsKm2: km2(r.parts),
    unionKm2: km2(r.union_area),
    originalUnionKm2: km2(r.original_union),
    holesSimplified: Number(r.holes_simplified),
    holesOriginal: Number(r.holes_original),
    allValid: r.all_valid as boolean,
  };
}
