/**
 * The demo region's invented geography: an irregular coastline-like outline placed in the
 * open South Pacific, far from any land (no real place), split into the 24 demo districts
 * as Voronoi cells (d3-delaunay) of seeded sites, each cell clipped to the outline. A
 * river winds across the region from west to east; the districts whose curves are past
 * their turn have their sites on it, so they form a band of lower valley districts, and
 * the ones still approaching sit in the uplands away from it.
 *
 * The result is written once to assets/demo-data/ (run this file with tsx) and read from
 * there at start: d3-delaunay is an ES module the API's test runner does not load.
 *   node --import tsx api/demo/geography.ts          writes both files
 *   node --import tsx api/demo/geography.ts --check  fails when they differ from a fresh build
 */
import fs from 'node:fs';
import path from 'node:path';
import type { Feature, FeatureCollection, Polygon, Position } from 'geojson';
import { DEMO_DISTRICTS } from './generate';
import { seededRandom } from './random';

export const GEOGRAPHY_SEED = 16_2026;
/** The region's centre, longitude/latitude (open ocean, 3,000 km from the nearest coast). */
const CENTRE: [number, number] = [-131.5, -45.5];
/** Half-extent in degrees (longitude, latitude): about 200 × 180 km. */
const HALF: [number, number] = [1.3, 0.8];
/** Valley districts (on the river), then upland districts (farthest from it). */
const VALLEY = ['D01', 'D03', 'D09', 'D19', 'D24', 'D06', 'D12', 'D18', 'D17'];
const UPLAND = ['D05', 'D10', 'D16', 'D23', 'D13', 'D02', 'D22', 'D08'];
const DIGITS = 1e6;

const round = (v: number) => Math.round(v * DIGITS) / DIGITS;

/** The river's latitude at longitude offset u ∈ [−1, 1] (in half-extents). */
function river(u: number): number {
  return 0.35 * Math.sin(2.4 * u + 0.6) - 0.1 * u;
}

function outline(rnd: ReturnType<typeof seededRandom>): Position[] {
  const ring: Position[] = [];
  const n = 56;
  for (let i = 0; i < n; i++) {
    const a = (2 * Math.PI * i) / n;
    const wobble = 0.86 + 0.1 * Math.sin(3 * a + 1.1) + 0.06 * Math.sin(7 * a) + rnd.between(-0.03, 0.03);
    ring.push([wobble * Math.cos(a), wobble * Math.sin(a)]);
  }
  return ring;
}

function sites(rnd: ReturnType<typeof seededRandom>): Map<string, [number, number]> {
  const out = new Map<string, [number, number]>();
  VALLEY.forEach((code, i) => {
    const u = -0.68 + (1.36 * i) / (VALLEY.length - 1) + rnd.between(-0.04, 0.04);
    out.set(code, [u, river(u) + rnd.between(-0.05, 0.05)]);
  });
  UPLAND.forEach((code, i) => {
    const u = -0.75 + (1.5 * Math.floor(i / 2)) / 3 + rnd.between(-0.06, 0.06);
    const side = i % 2 === 0 ? 1 : -1;
    out.set(code, [u, river(u) + side * rnd.between(0.42, 0.5)]);
  });
  const rest = DEMO_DISTRICTS.map((d) => d.code).filter((c) => !out.has(c));
  rest.forEach((code, i) => {
    const u =
      -0.65 + (1.3 * Math.floor(i / 2)) / Math.max(1, Math.ceil(rest.length / 2) - 1) + rnd.between(-0.05, 0.05);
    const side = i % 2 === 0 ? 1 : -1;
    out.set(code, [u, river(u) + side * rnd.between(0.2, 0.26)]);
  });
  // Keep every site well inside the outline (radius ≥ 0.76 everywhere).
  for (const [code, [x, y]] of out) {
    const r = Math.hypot(x, y);
    if (r > 0.7) out.set(code, [(x * 0.7) / r, (y * 0.7) / r]);
  }
  return out;
}

/** Intersection of segment p→q with the infinite line through a and b (a, b in a canonical order). */
function cross(p: Position, q: Position, a: Position, b: Position): Position {
  const [A, B] = a[0] < b[0] || (a[0] === b[0] && a[1] <= b[1]) ? [a, b] : [b, a];
  const dx = B[0] - A[0];
  const dy = B[1] - A[1];
  const side = (r: Position) => dx * (r[1] - A[1]) - dy * (r[0] - A[0]);
  const sp = side(p);
  const sq = side(q);
  const t = sp / (sp - sq);
  return [p[0] + t * (q[0] - p[0]), p[1] + t * (q[1] - p[1])];
}

/** Sutherland–Hodgman: the subject ring clipped to a convex ring (counter-clockwise). */
function clip(subject: Position[], convex: Position[]): Position[] {
  let out = subject;
  for (let i = 0; i < convex.length - 1; i++) {
    const a = convex[i];
    const b = convex[i + 1];
    const inside = (r: Position) => (b[0] - a[0]) * (r[1] - a[1]) - (b[1] - a[1]) * (r[0] - a[0]) >= 0;
    const input = out;
    out = [];
    for (let j = 0; j < input.length; j++) {
      const p = input[j];
      const q = input[(j + 1) % input.length];
      if (inside(p)) {
        out.push(p);
        if (!inside(q)) out.push(cross(p, q, a, b));
      } else if (inside(q)) {
        out.push(cross(p, q, a, b));
      }
    }
  }
  return out;
}

function signedArea(ring: Position[]): number {
  let s = 0;
  for (let i = 0; i < ring.length - 1; i++) s += ring[i][0] * ring[i + 1][1] - ring[i + 1][0] * ring[i][1];
  return s / 2;
}

/** The demo boundaries as an RFC 7946 FeatureCollection (outer rings counter-clockwise). */
export async function demoGeography(): Promise<FeatureCollection<Polygon, { code: string; name: string }>> {
  const { Delaunay } = await import('d3-delaunay');
  const rnd = seededRandom(GEOGRAPHY_SEED);
  const shape = outline(rnd);
  const placed = sites(rnd);
  const codes = DEMO_DISTRICTS.map((d) => d.code);
  const delaunay = Delaunay.from(codes.map((c) => placed.get(c)!));
  const voronoi = delaunay.voronoi([-1.2, -1.2, 1.2, 1.2]);
  const toLonLat = ([x, y]: Position): Position => [round(CENTRE[0] + x * HALF[0]), round(CENTRE[1] + y * HALF[1])];
  const features: Feature<Polygon, { code: string; name: string }>[] = DEMO_DISTRICTS.map((d, i) => {
    let cell = voronoi.cellPolygon(i) as Position[];
    if (signedArea(cell) < 0) cell = [...cell].reverse();
    const part = clip(shape, cell).map(toLonLat);
    const ring = part.filter((p, k) => k === 0 || p[0] !== part[k - 1][0] || p[1] !== part[k - 1][1]);
    if (ring[0][0] !== ring[ring.length - 1][0] || ring[0][1] !== ring[ring.length - 1][1]) ring.push(ring[0]);
    if (signedArea(ring) < 0) ring.reverse();
    return {
      type: 'Feature',
      properties: { code: d.code, name: d.name },
      geometry: { type: 'Polygon', coordinates: [ring] },
    };
  });
  return { type: 'FeatureCollection', features };
}

/**
 * The same file with two deliberate problems, for the upload screen's refusal path:
 * district D07's ring crosses itself (a bow tie) and one feature carries the code D31,
 * which is not a district of the region.
 */
export function withProblems(
  fc: FeatureCollection<Polygon, { code: string; name: string }>,
): FeatureCollection<Polygon, { code: string; name: string }> {
  const features = fc.features.map((f) => {
    if (f.properties.code !== 'D07') return f;
    const ring = f.geometry.coordinates[0];
    const bow = [ring[0], ring[2], ring[1], ...ring.slice(3)];
    return { ...f, geometry: { type: 'Polygon' as const, coordinates: [bow] } };
  });
  const stray = fc.features.find((f) => f.properties.code === 'D14')!;
  features.push({ ...stray, properties: { code: 'D31', name: 'Stray feature' } });
  return { type: 'FeatureCollection', features };
}

export const DEMO_BOUNDARY_FILE = path.resolve(__dirname, '..', '..', 'assets', 'demo-data', 'boundaries.geojson');
export const DEMO_BAD_BOUNDARY_FILE = path.resolve(
  __dirname,
  '..',
  '..',
  'assets',
  'demo-data',
  'boundaries-with-problems.geojson',
);

async function main(check: boolean): Promise<void> {
  const good = await demoGeography();
  const files: [string, unknown][] = [
    [DEMO_BOUNDARY_FILE, good],
    [DEMO_BAD_BOUNDARY_FILE, withProblems(good)],
  ];
  for (const [file, value] of files) {
    const text = `${JSON.stringify(value)}\n`;
    if (check) {
      if (fs.readFileSync(file, 'utf8') !== text)
        throw new Error(`${path.basename(file)} differs from a fresh build: regenerate it`);
    } else {
      fs.writeFileSync(file, text);
    }
  }
  console.log(check ? 'demo geography files are up to date' : 'wrote the demo geography files');
}

if (require.main === module) {
  main(process.argv.includes('--check')).catch((err: Error) => {
    console.error(err.message);
    process.exit(1);
  });
}
