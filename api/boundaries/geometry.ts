/**
 * The boundaries for screens: one version's district polygons as an RFC 7946
 * FeatureCollection, simplified with their topology kept, coordinates rounded to the
 * detail asked for.
 *
 * Why topology: simplifying each polygon on its own (PostGIS 3.3's
 * ST_SimplifyPreserveTopology keeps each polygon valid but not the edges it shares) moves
 * the two copies of a shared edge differently and opens gaps and slivers between
 * neighbours. Here the polygons become a TopoJSON topology (topojson-server: every shared
 * edge is one arc), the arcs are simplified once (topojson-simplify: Visvalingam's
 * effective area, planar on longitude/latitude), and the polygons are rebuilt from the
 * arcs (topojson-client), so neighbours keep one common edge. Rounding a shared point
 * gives the same result on both sides, so rounding keeps that too.
 *
 * Detail: `phone` keeps about 8 arc points per district on average, `print` about 300
 * (never more than the source), and rounds coordinates to 1/2,000 and 1/40,000 of the
 * region's extent.
 */
import type { Feature, FeatureCollection, MultiPolygon, Polygon, Position } from 'geojson';
import { feature } from 'topojson-client';
import { topology } from 'topojson-server';
import { presimplify, quantile, simplify } from 'topojson-simplify';
import type { GeometryCollection, Topology } from 'topojson-specification';
import type { BoundaryRow } from './store';

export type Detail = 'phone' | 'print';

export const DETAIL: Record<Detail, { pointsPerDistrict: number; resolution: number }> = {
  phone: { pointsPerDistrict: 8, resolution: 2_000 },
  print: { pointsPerDistrict: 300, resolution: 40_000 },
};

export interface DistrictProps {
  code: string;
  name: string;
  /** land area, km² (on the ellipsoid) */
  areaKm2: number;
  /** a point inside the district (ST_PointOnSurface), [longitude, latitude] */
  point: [number, number];
}

export type BoundaryCollection = FeatureCollection<MultiPolygon, DistrictProps> & {
  bbox?: [number, number, number, number];
  /** the boundary version (null: no boundaries loaded yet) */
  version: number | null;
  detail: Detail;
};

function bboxOf(features: Feature<MultiPolygon>[]): [number, number, number, number] {
  let [x0, y0, x1, y1] = [Infinity, Infinity, -Infinity, -Infinity];
  for (const f of features) {
    for (const poly of f.geometry.coordinates) {
      for (const [x, y] of poly[0]) {
        if (x < x0) x0 = x;
        if (x > x1) x1 = x;
        if (y < y0) y0 = y;
        if (y > y1) y1 = y;
      }
    }
  }
  return [x0, y0, x1, y1];
}

/** Rounds a ring and drops repeated positions; null when fewer than 4 positions remain. */
function roundRing(ring: Position[], k: number): Position[] | null {
  const out: Position[] = [];
  for (const p of ring) {
    const q = [Math.round(p[0] * k) / k, Math.round(p[1] * k) / k];
    const last = out[out.length - 1];
    if (!last || last[0] !== q[0] || last[1] !== q[1]) out.push(q);
  }
  return out.length >= 4 ? out : null;
}

function toMulti(g: Polygon | MultiPolygon | null): Position[][][] {
  if (!g) return [];
  return g.type === 'Polygon' ? [g.coordinates] : g.coordinates;
}

/** The simplified, rounded collection (see the module comment). */
export function simplifiedCollection(rows: BoundaryRow[], version: number | null, detail: Detail): BoundaryCollection {
  const source: Feature<MultiPolygon, DistrictProps>[] = rows.map((r) => ({
    type: 'Feature',
    properties: { code: r.code, name: r.name, areaKm2: r.areaKm2, point: r.point },
    geometry: JSON.parse(r.geometry) as MultiPolygon,
  }));
  if (!source.length) return { type: 'FeatureCollection', features: [], version, detail };
  const bbox = bboxOf(source);
  const span = Math.max(bbox[2] - bbox[0], bbox[3] - bbox[1]) || 1;
  const { pointsPerDistrict, resolution } = DETAIL[detail];
  const digits = Math.max(0, Math.ceil(-Math.log10(span / resolution)));
  const k = 10 ** digits;

  const topo = presimplify(
    topology({ districts: { type: 'FeatureCollection', features: source } as FeatureCollection }) as never,
  ) as Topology;
  let points = 0;
  for (const arc of topo.arcs) points += arc.length;
  const keep = pointsPerDistrict * source.length;
  // quantile sorts the weights largest first: the keep/points quantile keeps that share.
  const simplified: Topology = points > keep ? simplify(topo as never, quantile(topo as never, keep / points)) : topo;
  const rebuilt = feature(
    simplified as Topology,
    simplified.objects.districts as GeometryCollection<DistrictProps>,
  ) as FeatureCollection<Polygon | MultiPolygon, DistrictProps>;

  const features: Feature<MultiPolygon, DistrictProps>[] = [];
  for (const f of rebuilt.features) {
    const polys: Position[][][] = [];
    for (const poly of toMulti(f.geometry)) {
      const outer = roundRing(poly[0], k);
      if (!outer) continue;
      polys.push(
        [outer, ...poly.slice(1).flatMap((h) => roundRing(h, k) ?? [])].filter((r): r is Position[] =>
          Array.isArray(r[0]),
        ),
      );
    }
    if (!polys.length) continue;
    const p = f.properties;
    features.push({
      type: 'Feature',
      properties: {
        code: p.code,
        name: p.name,
        areaKm2: Math.round(p.areaKm2 * 100) / 100,
        point: [Math.round(p.point[0] * k) / k, Math.round(p.point[1] * k) / k],
      },
      geometry: { type: 'MultiPolygon', coordinates: polys },
    });
  }
  return { type: 'FeatureCollection', bbox, version, detail, features };
}
