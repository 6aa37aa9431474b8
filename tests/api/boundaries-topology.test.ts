/**
 * The geometry answer keeps topology after simplification, checked in PostGIS, and stays
 * within the phone budget at 3,000 districts (an invented grid region whose shared edges
 * are wiggly lines drawn once for both neighbours).
 */
import zlib from 'node:zlib';
import { uploadWorld, type UploadWorld } from './upload-helpers';
import { gridRegion, insertDistricts, topologyFigures, uploadGeoJson } from './boundaries-helpers';

let w: UploadWorld;
beforeAll(async () => {
  w = await uploadWorld();
  await w.t.db.raw(
    `DELETE FROM districts WHERE NOT EXISTS (SELECT 1 FROM observations o WHERE o.district_id = districts.id)`,
  );
});
afterAll(async () => {
  await w.close();
});

describe('3,000 districts', () => {
  const grid = gridRegion(60, 50);
  let versionId: number;

  beforeAll(async () => {
    await insertDistricts(w.t.db, grid.districts);
    const r = await uploadGeoJson(w.analyst, grid.geojson, { commit: true });
    expect(r.status).toBe(201);
    // 3,000 grid districts matched; the 24 demo districts are left without a boundary
    expect(r.body.counts).toMatchObject({ matched: 3000, missing: 24 });
    versionId = r.body.versionId;
  }, 180_000);

  it.each(['phone', 'print'] as const)(
    '%s detail: no overlaps, no gaps, no new holes, every part valid',
    async (detail) => {
      const g = await w.official.get('/api/boundaries').query({ detail });
      const body = JSON.parse(g.text);
      expect(body.features).toHaveLength(3000);
      const f = await topologyFigures(w.t.db, body, versionId);
      // Tolerances (common practice for simplified maps, our choice): overlaps below 0.1% of
      // the region's area (shared edges are one arc, so only rounding can make any), the
      // union's area within 0.5% of the original union's (the outer coast is simplified too).
      expect(Math.abs(f.partsKm2 - f.unionKm2) / f.unionKm2).toBeLessThan(0.001);
      expect(Math.abs(f.unionKm2 - f.originalUnionKm2) / f.originalUnionKm2).toBeLessThan(0.005);
      expect(f.holesSimplified).toBe(f.holesOriginal);
      expect(f.allValid).toBe(true);
    },
    120_000,
  );

  it("phone detail answer is at most 250 KB gzipped (the issue's budget)", async () => {
    const g = await w.official.get('/api/boundaries').set('Accept-Encoding', 'gzip');
    expect(g.headers['content-encoding']).toBe('gzip');
    // The client decompresses the body; Content-Length is the size sent, compressed.
    const sent = Number(g.headers['content-length']);
    expect(zlib.gzipSync(g.text, { level: 9 }).length).toBe(sent);
    process.stdout.write(
      `[boundaries] 3,000 districts, phone detail: ${(sent / 1024).toFixed(1)} KB gzipped, ${(Buffer.byteLength(g.text) / 1024).toFixed(0)} KB plain\n`,
    );
    expect(sent).toBeLessThanOrEqual(250 * 1024);
  }, 120_000);
});
