// The region map as a vector scene: one path per standing (every district of that standing
// in one `d`), one path for the borders, a mark point per district, and the projected
// rings kept for finding the district under a tap (point in polygon). Pure: the screen
// draws it with react-native-svg, and the brief draws the same scene.
//
// Projection: the region is small, so a planar equirectangular projection centred on it
// (x = longitude × cos(mid-latitude), y = −latitude) fitted to the box is enough; being
// planar, it does not care about ring winding (RFC 7946 outer rings are counter-clockwise,
// which spherical projections would read as the whole globe minus the district).
import type { Standing } from '../contracts/estimates';

export type BoundaryFeature = {
  type: 'Feature';
  properties: { code: string; name: string; areaKm2: number; point: [number, number] };
  geometry: { type: 'MultiPolygon'; coordinates: number[][][][] };
};

export type BoundaryCollection = {
  type: 'FeatureCollection';
  version: number | null;
  detail: 'phone' | 'print';
  bbox?: [number, number, number, number];
  features: BoundaryFeature[];
};

export type MapDistrict = {
  code: string;
  name: string;
  standing: Standing;
  /** the district's mark, in scene units */
  x: number;
  y: number;
  /** its box, in scene units (for whether a mark fits, and a quick hit test) */
  box: [number, number, number, number];
  rings: number[][][];
};

export type MapScene = {
  width: number;
  height: number;
  /** one path per standing present */
  fills: { standing: Standing; d: string; count: number }[];
  borders: string;
  /** the highlighted district's outline (locator) */
  highlight: string | null;
  districts: MapDistrict[];
};

const round1 = (v: number) => Math.round(v * 10) / 10;

/** A projection of longitude/latitude into a width × height box with padding. */
export function fitProjection(bbox: [number, number, number, number], width: number, height: number, pad: number) {
  const [x0, y0, x1, y1] = bbox;
  const k0 = Math.cos((((y0 + y1) / 2) * Math.PI) / 180);
  const w = Math.max(1e-9, (x1 - x0) * k0);
  const h = Math.max(1e-9, y1 - y0);
  const s = Math.min((width - 2 * pad) / w, (height - 2 * pad) / h);
  const ox = (width - w * s) / 2;
  const oy = (height - h * s) / 2;
  return (lon: number, lat: number): [number, number] => [ox + (lon - x0) * k0 * s, oy + (y1 - lat) * s];
}

/** The box of a collection's outer rings. */
export function collectionBox(fc: BoundaryCollection): [number, number, number, number] {
  if (fc.bbox) return fc.bbox;
  let b: [number, number, number, number] = [Infinity, Infinity, -Infinity, -Infinity];
  for (const f of fc.features)
    for (const poly of f.geometry.coordinates)
      for (const [x, y] of poly[0]) b = [Math.min(b[0], x), Math.min(b[1], y), Math.max(b[2], x), Math.max(b[3], y)];
  return b;
}

/** The height a map of this collection needs at a given width (bounded to sensible shapes). */
export function mapAspect(fc: BoundaryCollection): number {
  const [x0, y0, x1, y1] = collectionBox(fc);
  const k0 = Math.cos((((y0 + y1) / 2) * Math.PI) / 180);
  const r = (y1 - y0) / Math.max(1e-9, (x1 - x0) * k0);
  return Math.min(1.4, Math.max(0.45, r));
}

function ringPath(ring: number[][]): string {
  let d = '';
  for (let i = 0; i < ring.length - 1; i++) d += `${i === 0 ? 'M' : 'L'}${round1(ring[i][0])},${round1(ring[i][1])}`;
  return `${d}Z`;
}

export type SceneInput = {
  collection: BoundaryCollection;
  standingOf: (code: string) => Standing;
  width: number;
  height: number;
  pad?: number;
  /** a district to outline (the card's locator) */
  highlight?: string | null;
};

export function buildMapScene({
  collection,
  standingOf,
  width,
  height,
  pad = 8,
  highlight = null,
}: SceneInput): MapScene {
  const project = fitProjection(collectionBox(collection), width, height, pad);
  const byStanding = new Map<Standing, { d: string[]; count: number }>();
  const borders: string[] = [];
  const districts: MapDistrict[] = [];
  let highlightPath: string | null = null;
  for (const f of collection.features) {
    const standing = standingOf(f.properties.code);
    const rings: number[][][] = [];
    let box: [number, number, number, number] = [Infinity, Infinity, -Infinity, -Infinity];
    const paths: string[] = [];
    for (const poly of f.geometry.coordinates) {
      for (const ring of poly) {
        const r = ring.map(([lon, lat]) => project(lon, lat));
        for (const [x, y] of r)
          box = [Math.min(box[0], x), Math.min(box[1], y), Math.max(box[2], x), Math.max(box[3], y)];
        rings.push(r);
        paths.push(ringPath(r));
      }
    }
    const d = paths.join('');
    const entry = byStanding.get(standing) ?? { d: [], count: 0 };
    entry.d.push(d);
    entry.count += 1;
    byStanding.set(standing, entry);
    borders.push(d);
    if (highlight && f.properties.code === highlight) highlightPath = d;
    const [x, y] = project(f.properties.point[0], f.properties.point[1]);
    districts.push({
      code: f.properties.code,
      name: f.properties.name,
      standing,
      x: round1(x),
      y: round1(y),
      box,
      rings,
    });
  }
  return {
    width,
    height,
    fills: [...byStanding.entries()].map(([standing, v]) => ({ standing, d: v.d.join(''), count: v.count })),
    borders: borders.join(''),
    highlight: highlightPath,
    districts,
  };
}

/** Even–odd ray casting over every ring (holes included), in scene units. */
export function pointInRings(x: number, y: number, rings: number[][][]): boolean {
  let inside = false;
  for (const ring of rings) {
    for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
      const [xi, yi] = ring[i];
      const [xj, yj] = ring[j];
      if (yi > y !== yj > y && x < ((xj - xi) * (y - yi)) / (yj - yi) + xi) inside = !inside;
    }
  }
  return inside;
}

/** The district under a point of the scene (scene units), or null. */
export function districtAt(scene: MapScene, x: number, y: number): MapDistrict | null {
  for (const d of scene.districts) {
    const [x0, y0, x1, y1] = d.box;
    if (x < x0 || x > x1 || y < y0 || y > y1) continue;
    if (pointInRings(x, y, d.rings)) return d;
  }
  return null;
}
