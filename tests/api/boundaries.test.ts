/**
 * Boundary uploads: the demo file dry run and commit, the GeoJSON bad-input corpus with
 * its reasons, repair on request, versions and revert, the geometry answer's caching.
 */
import fs from 'node:fs';
import path from 'node:path';
import { uploadWorld, type UploadWorld } from './upload-helpers';
import { uploadGeoJson } from './boundaries-helpers';
import { BoundaryVersionsSchema } from '../../contracts/boundaries';
import { UploadDetailResponseSchema } from '../../contracts/uploads';
import { parseAnswer } from '../support/contract';

const root = path.resolve(__dirname, '..', '..');
const demo = JSON.parse(fs.readFileSync(path.join(root, 'assets', 'demo-data', 'boundaries.geojson'), 'utf8'));
const demoBad = fs.readFileSync(path.join(root, 'assets', 'demo-data', 'boundaries-with-problems.geojson'));

let w: UploadWorld;
beforeAll(async () => {
  w = await uploadWorld();
});
afterAll(async () => {
  await w.close();
});

const count = async (table: string) => Number((await w.t.db(table).count<{ n: string }[]>({ n: '*' }))[0].n);
const clone = () => JSON.parse(JSON.stringify(demo));
const problemsOf = (body: {
  problems: { problem: string; feature: number | null; code: string | null; severity: string; reason: string }[];
}) => body.problems;

describe('the demo boundaries', () => {
  it('dry run: every district matched, nothing written', async () => {
    const uploads = await count('uploads');
    const r = await uploadGeoJson(w.analyst, demo);
    expect(r.status).toBe(200);
    expect(r.body.accepted).toBe(true);
    expect(r.body.committed).toBe(false);
    // 24 demo districts (api/demo/generate.ts), one feature each in the demo file
    expect(r.body.counts).toMatchObject({ features: 24, matched: 24, missing: 0, errors: 0 });
    expect(r.body.preview[0]).toMatchObject({ feature: 0, code: 'D01' });
    expect(r.body.preview[0].areaKm2).toBeGreaterThan(0);
    expect(await count('boundary_versions')).toBe(0);
    expect(await count('uploads')).toBe(uploads);
  });

  it('officials may not upload boundaries', async () => {
    const r = await uploadGeoJson(w.official, demo);
    expect(r.status).toBe(403);
  });

  it('commit: a boundary version, an entry of the upload history with the next data version, the geometry answer', async () => {
    const before = (await w.analyst.get('/api/data-version')).body.version;
    const r = await uploadGeoJson(w.analyst, demo, { commit: true });
    expect(r.status).toBe(201);
    expect(r.body.committed).toBe(true);
    expect(r.body.dataVersion).toBe(before + 1);
    const history = await w.analyst.get('/api/uploads');
    expect(history.body.uploads[0]).toMatchObject({ id: r.body.uploadId, kind: 'boundaries', status: 'committed' });
    const versions = await w.official.get('/api/boundaries/versions');
    expect(versions.body.versions[0]).toMatchObject({
      id: r.body.versionId,
      features: 24,
      current: true,
      fileName: 'boundaries.geojson',
    });

    const g = await w.official.get('/api/boundaries');
    expect(g.status).toBe(200);
    expect(g.headers['content-type']).toMatch(/application\/geo\+json/);
    expect(g.headers['cache-control']).toBe('private, no-cache');
    const body = JSON.parse(g.text);
    expect(body.type).toBe('FeatureCollection');
    expect(body.version).toBe(r.body.versionId);
    expect(body.features).toHaveLength(24);
    expect(body.features[0].properties).toMatchObject({ code: 'D01', name: 'Amberlyn Reach' });
    expect(body.features[0].geometry.type).toBe('MultiPolygon');
    // the inside point lies within the region's box
    const [x0, y0, x1, y1] = body.bbox;
    for (const f of body.features) {
      const [x, y] = f.properties.point;
      expect(x >= x0 && x <= x1 && y >= y0 && y <= y1).toBe(true);
    }
    const again = await w.official.get('/api/boundaries').set('If-None-Match', g.headers.etag);
    expect(again.status).toBe(304);
    const pinned = await w.official.get('/api/boundaries').query({ version: r.body.versionId, detail: 'print' });
    expect(pinned.status).toBe(200);
    expect(pinned.headers['cache-control']).toBe('private, max-age=31536000, immutable');
    expect(JSON.parse(pinned.text).detail).toBe('print');
    expect((await w.official.get('/api/boundaries').query({ version: 999 })).status).toBe(404);
  });

  it('the demo file with two deliberate problems is refused with both reasons, and nothing is written', async () => {
    const versions = await count('boundary_versions');
    const dry = await uploadGeoJson(w.analyst, demoBad);
    expect(dry.status).toBe(200);
    expect(dry.body.accepted).toBe(false);
    const p = problemsOf(dry.body).filter((x) => x.severity === 'error');
    // D07 is the 7th feature (index 6) and its ring crosses itself (api/demo/geography.ts withProblems)
    expect(p).toEqual(
      expect.arrayContaining([
        expect.objectContaining({ feature: 6, code: 'D07', problem: 'self_intersection' }),
        expect.objectContaining({ feature: 24, code: 'D31', problem: 'unknown_code' }),
      ]),
    );
    expect(p).toHaveLength(2);
    expect(p.find((x) => x.code === 'D07')!.reason).toMatch(/Self-intersection/);
    const commit = await uploadGeoJson(w.analyst, demoBad, { commit: true });
    expect(commit.status).toBe(422);
    expect(commit.body.error.code).toBe('boundaries_rejected');
    expect(commit.body.error.details.problems.length).toBeGreaterThanOrEqual(2);
    expect(await count('boundary_versions')).toBe(versions);
  });

  it('repair=true repairs the crossing ring with ST_MakeValid (a warning) but not an unknown code', async () => {
    const r = await uploadGeoJson(w.analyst, demoBad, { repair: true });
    const p = problemsOf(r.body);
    expect(p.find((x) => x.code === 'D07')).toMatchObject({ problem: 'repaired', severity: 'warning' });
    expect(p.find((x) => x.code === 'D31')).toMatchObject({ problem: 'unknown_code', severity: 'error' });
  });

  it('revert: the version before becomes current again, as a change set of the history', async () => {
    const fc = clone();
    fc.features = fc.features.filter((f: { properties: { code: string } }) => f.properties.code !== 'D24');
    const second = await uploadGeoJson(w.analyst, fc, { commit: true });
    expect(second.status).toBe(201);
    expect(second.body.missingDistricts).toEqual(['D24']);
    // Its entry in the upload history reads through the uploads' own contract, problems included.
    const entry = parseAnswer(UploadDetailResponseSchema, await w.analyst.get(`/api/uploads/${second.body.uploadId}`));
    expect(entry.upload.kind).toBe('boundaries');
    expect(entry.problems).toEqual([
      expect.objectContaining({ severity: 'warning', reason: expect.stringMatching(/D24/) }),
    ]);
    const versions = parseAnswer(BoundaryVersionsSchema, await w.official.get('/api/boundaries/versions'));
    expect(versions.versions[0]).toMatchObject({ id: second.body.versionId, current: true, missing: 1 });
    const now = JSON.parse((await w.official.get('/api/boundaries')).text);
    expect(now.version).toBe(second.body.versionId);
    expect(now.features).toHaveLength(23);
    expect((await w.official.post(`/api/boundaries/versions/${second.body.versionId}/revert`)).status).toBe(403);
    const rev = await w.analyst.post(`/api/boundaries/versions/${second.body.versionId}/revert`);
    expect(rev.status).toBe(200);
    expect(rev.body.currentVersionId).toBe(second.body.versionId - 1);
    const back = JSON.parse((await w.official.get('/api/boundaries')).text);
    expect(back.version).toBe(second.body.versionId - 1);
    expect(back.features).toHaveLength(24);
    const again = await w.analyst.post(`/api/boundaries/versions/${second.body.versionId}/revert`);
    expect(again.status).toBe(409);
  });
});

describe('the GeoJSON bad-input corpus: each problem reported by feature and reason', () => {
  type Case = { name: string; make: () => unknown; problem: string; feature: number | null; reason: RegExp };
  /** A demo feature as the mutations below see it (the demo file's features are Polygons). */
  type DemoFeature = { properties: Record<string, unknown>; geometry: { type: string; coordinates: number[][][] } };
  const first = (mutate: (f: DemoFeature) => void) => () => {
    const fc = clone();
    mutate(fc.features[0]);
    return fc;
  };
  const cases: Case[] = [
    {
      name: 'not a FeatureCollection',
      make: () => demo.features[0],
      problem: 'not_feature_collection',
      feature: null,
      reason: /GeoJSON Feature, not a GeoJSON FeatureCollection/,
    },
    {
      name: 'not JSON at all',
      make: () => 'code,name\nD01,x\n',
      problem: 'not_feature_collection',
      feature: null,
      reason: /not readable JSON: line 1, column 1/,
    },
    {
      name: 'a foreign crs member',
      make: () => ({ ...clone(), crs: { type: 'name', properties: { name: 'urn:ogc:def:crs:EPSG::3857' } } }),
      problem: 'foreign_crs',
      feature: null,
      reason: /EPSG::3857/,
    },
    {
      name: 'a geometry that is not a polygon',
      make: first((f) => Object.assign(f, { geometry: { type: 'Point', coordinates: [-131, -45] } })),
      problem: 'not_polygon',
      feature: 0,
      reason: /Point geometry/,
    },
    {
      name: 'an unclosed ring',
      make: first((f) => f.geometry.coordinates[0].pop()),
      problem: 'unclosed_ring',
      feature: 0,
      reason: /not closed/,
    },
    {
      name: 'a ring too short',
      make: first(
        (f) =>
          (f.geometry.coordinates[0] = f.geometry.coordinates[0].slice(0, 2).concat([f.geometry.coordinates[0][0]])),
      ),
      problem: 'short_ring',
      feature: 0,
      reason: /3 positions/,
    },
    {
      name: 'coordinates out of range',
      make: first((f) => (f.geometry.coordinates[0][1] = [-231.5, -45.5])),
      problem: 'out_of_range',
      feature: 0,
      reason: /position 1 is \[-231.5, -45.5\]/,
    },
    {
      name: 'a self-intersection',
      make: first((f) => {
        const r = f.geometry.coordinates[0];
        f.geometry.coordinates[0] = [r[0], r[2], r[1], ...r.slice(3)];
      }),
      problem: 'self_intersection',
      feature: 0,
      reason: /Self-intersection/,
    },
    {
      name: 'a duplicate code',
      make: () => {
        const fc = clone();
        fc.features[1].properties.code = 'D01';
        return fc;
      },
      problem: 'duplicate_code',
      feature: 1,
      reason: /repeats the code D01 of feature 0/,
    },
    {
      name: 'an unknown code',
      make: first((f) => (f.properties.code = 'Z99')),
      problem: 'unknown_code',
      feature: 0,
      reason: /Z99, which is not a district/,
    },
    {
      name: 'no code in the property',
      make: first((f) => delete f.properties.code),
      problem: 'no_code',
      feature: 0,
      reason: /"code" property/,
    },
    {
      // two polygons of 60,000 positions: each array is within the reader's limit, the feature is not
      name: 'too many vertices',
      make: first((f) => {
        const r = f.geometry.coordinates[0];
        const many = Array.from({ length: 60_000 }, () => r[0]);
        Object.assign(f, { geometry: { type: 'MultiPolygon', coordinates: [[many], [many]] } });
      }),
      problem: 'too_many_vertices',
      feature: 0,
      reason: /more than 100,000 vertices/,
    },
    {
      name: 'deep nesting',
      make: () => `{"type":"FeatureCollection","features":${'['.repeat(5000)}${']'.repeat(5000)}}`,
      problem: 'not_feature_collection',
      feature: null,
      reason: /nesting deeper than 12 levels/,
    },
  ];
  it.each(cases)('$name', async (c) => {
    const r = await uploadGeoJson(w.analyst, c.make());
    expect(r.status).toBe(200);
    expect(r.body.accepted).toBe(false);
    const hit = problemsOf(r.body).find((p) => p.problem === c.problem);
    expect(hit).toBeDefined();
    expect(hit!.feature).toBe(c.feature);
    expect(hit!.severity).toBe('error');
    expect(hit!.reason).toMatch(c.reason);
  });

  it('3-D positions are dropped with a note; districts without a feature are listed; the file is still accepted', async () => {
    const fc = clone();
    fc.features[0].geometry.coordinates[0] = fc.features[0].geometry.coordinates[0].map((p: number[]) => [...p, 12.5]);
    fc.features.pop();
    const r = await uploadGeoJson(w.analyst, fc);
    expect(r.body.accepted).toBe(true);
    const p = problemsOf(r.body);
    expect(p.find((x) => x.problem === 'dropped_z')).toMatchObject({ feature: 0, code: 'D01', severity: 'warning' });
    expect(p.find((x) => x.problem === 'no_boundary')).toMatchObject({ code: 'D24', severity: 'warning' });
  });

  it('another code property can be chosen', async () => {
    const fc = clone();
    for (const f of fc.features) f.properties = { district_id: f.properties.code };
    const r = await uploadGeoJson(w.analyst, fc, { codeProperty: 'district_id' });
    expect(r.body.counts).toMatchObject({ matched: 24, errors: 0 });
  });

  it("a giant coordinate array in one feature stops at the reader's array limit", async () => {
    // one ring of 400,000 positions (~8 MB)
    const ring = Array.from({ length: 400_000 }, (_, i) => [
      -131 + (i % 1000) * 1e-4,
      -45 + Math.floor(i / 1000) * 1e-4,
    ]);
    const text = JSON.stringify({
      type: 'FeatureCollection',
      features: [{ type: 'Feature', properties: { code: 'D01' }, geometry: { type: 'Polygon', coordinates: [ring] } }],
    });
    const r = await uploadGeoJson(w.analyst, text);
    expect(r.body.problems[0].reason).toMatch(/an array has more than 100,000 items/);
  });

  it('a large file is read in slices: a request made meanwhile is answered before the upload', async () => {
    // ~18 MB: 8,000 features of 120 positions each (all with one code, refused after reading)
    const ring = Array.from({ length: 120 }, (_, i) => [
      +(-131 + Math.cos(i / 19) * 0.01).toFixed(5),
      +(-45 + Math.sin(i / 19) * 0.01).toFixed(5),
    ]);
    ring.push(ring[0]);
    const feature = JSON.stringify({
      type: 'Feature',
      properties: { code: 'D01' },
      geometry: { type: 'Polygon', coordinates: [ring] },
    });
    const text = `{"type":"FeatureCollection","features":[${Array.from({ length: 8_000 }, () => feature).join(',')}]}`;
    let uploadDone = 0;
    let healthDone = 0;
    const up = uploadGeoJson(w.analyst, text).then((r) => {
      uploadDone = performance.now();
      return r;
    });
    await new Promise((r) => setTimeout(r, 300));
    const health = w.official.get('/api/health').then((r) => {
      healthDone = performance.now();
      return r;
    });
    const [u, h] = await Promise.all([up, health]);
    expect(h.status).toBe(200);
    expect(u.status).toBe(200);
    expect(u.body.problems[0]).toMatchObject({ problem: 'duplicate_code', feature: 1 });
    expect(healthDone).toBeLessThan(uploadDone);
  });
});
