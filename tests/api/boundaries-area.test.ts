/**
 * Land area from the boundaries as an indicator (`from_boundaries`) and population
 * density through a `ratio` derivation: written by the boundary change set for every
 * year a district has data, in history, undone by the boundary revert; the data version
 * names the boundary version in force.
 */
import fs from 'node:fs';
import path from 'node:path';
import { uploadWorld, type UploadWorld } from './upload-helpers';
import { uploadGeoJson } from './boundaries-helpers';

const demo = fs.readFileSync(path.resolve(__dirname, '..', '..', 'assets', 'demo-data', 'boundaries.geojson'));

let w: UploadWorld;
beforeAll(async () => {
  w = await uploadWorld();
});
afterAll(async () => w.close());

async function cells(code: string) {
  const { rows } = await w.t.db.raw(
    `SELECT d.code, o.year, o.value FROM observations o JOIN districts d ON d.id = o.district_id JOIN indicators i ON i.id = o.indicator_id
      WHERE i.code = ? ORDER BY d.code, o.year`,
    [code],
  );
  return rows as { code: string; year: number; value: number }[];
}

it('defines land area and density, fills them from the boundaries, and reverts with them', async () => {
  const area = await w.analyst.post('/api/indicators').send({
    code: 'land_area',
    name: 'Land area',
    unit: 'km²',
    mustBePositive: true,
    derivation: { kind: 'from_boundaries' },
  });
  expect(area.status).toBe(201);
  expect(area.body.indicator.derivation).toMatchObject({ kind: 'from_boundaries', measure: 'area_km2' });
  expect(area.body.recomputed).toBeNull(); // no boundaries yet: nothing to derive
  const density = await w.analyst.post('/api/indicators').send({
    code: 'density_from_area',
    name: 'Density',
    unit: 'people per km²',
    derivation: { kind: 'ratio', source: 'population', divisor: 'land_area' },
  });
  expect(density.status).toBe(201);
  expect(density.body.indicator.derivation).toMatchObject({ kind: 'ratio', formula: 'population ÷ land_area' });

  const up = await uploadGeoJson(w.analyst, demo, { commit: true });
  expect(up.status).toBe(201);
  // the same area, every year the district has data: one value per (district, year) of its population series
  const areas = await cells('land_area');
  const pops = await cells('population');
  expect(areas.map((a) => `${a.code}|${a.year}`)).toEqual(pops.map((p) => `${p.code}|${p.year}`));
  // reference: PostGIS ST_Area on the geography type of the stored boundary, in km²
  const { rows: ref } = await w.t.db.raw(
    `SELECT d.code, ST_Area(b.geom::geography) / 1e6 AS km2 FROM district_boundaries b JOIN districts d ON d.id = b.district_id WHERE b.version_id = ?`,
    [up.body.versionId],
  );
  const km2 = new Map<string, number>(ref.map((r: { code: string; km2: number }) => [r.code, Number(r.km2)]));
  for (const a of areas) expect(a.value).toBeCloseTo(km2.get(a.code)!, 9);
  // density = population ÷ land area (the ratio's own definition), cell by cell
  const dens = new Map((await cells('density_from_area')).map((c) => [`${c.code}|${c.year}`, c.value]));
  expect(dens.size).toBe(pops.length);
  for (const p of pops) expect(dens.get(`${p.code}|${p.year}`)).toBeCloseTo(p.value / km2.get(p.code)!, 9);

  const dv = await w.analyst.get('/api/data-version');
  expect(dv.body).toMatchObject({ version: up.body.dataVersion, boundaryVersion: up.body.versionId });

  const rev = await w.analyst.post(`/api/boundaries/versions/${up.body.versionId}/revert`);
  expect(rev.status).toBe(200);
  expect(rev.body.currentVersionId).toBeNull();
  expect(await cells('land_area')).toEqual([]);
  expect(await cells('density_from_area')).toEqual([]);
  expect((await w.analyst.get('/api/data-version')).body.boundaryVersion).toBeNull();
  // the data version of the boundary commit still names it
  expect((await w.analyst.get('/api/data-version').query({ version: up.body.dataVersion })).body.boundaryVersion).toBe(
    up.body.versionId,
  );
});
