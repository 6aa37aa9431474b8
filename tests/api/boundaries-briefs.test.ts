/**
 * The briefs carry the maps once boundaries are loaded: the region brief's standings map
 * (one fill per standing present, the borders, a mark per district with room) and the
 * district brief's locator; both PDFs still render. Without boundaries, neither map.
 */
import { seedDemoBoundariesIfEmpty } from '../../api/demo/boundaries';
import { publishDefaultRun } from '../support/published-run';
import { signedInApp, type SignedInApp } from '../support/signed-in-app';

jest.setTimeout(180_000);

let s: SignedInApp;
beforeAll(async () => {
  s = await signedInApp();
  await publishDefaultRun(s.app, s.t.url);
});
afterAll(async () => s.close());

it('no boundaries: the briefs have no maps', async () => {
  const region = await s.agent.get('/api/briefs/region');
  expect(region.status).toBe(200);
  expect(region.body.map).toBeNull();
  const district = await s.agent.get('/api/briefs/district/D02');
  expect(district.body.locator).toBeNull();
});

it('with the demo boundaries: the standings map and the locator, drawn into the PDFs', async () => {
  await seedDemoBoundariesIfEmpty(s.t.db);
  const region = await s.agent.get('/api/briefs/region');
  const map = region.body.map;
  const standings = new Set(
    (await s.agent.get('/api/region')).body.districts.map(
      (d: { estimate: { standing: string } | null }) => d.estimate?.standing ?? 'not_estimable',
    ),
  );
  const fills = map.items.filter(
    (i: { kind: string; fill?: string }) => i.kind === 'path' && i.fill?.endsWith('_fill'),
  );
  expect(fills).toHaveLength(standings.size);
  expect(map.items.some((i: { stroke?: string; fill?: string }) => i.stroke === 'sea' && !i.fill)).toBe(true);
  // a mark per district with room for it: at most the 24 demo districts, and most of them
  const marks = map.items.filter(
    (i: { fill?: string; stroke?: string }) =>
      (i.fill && !i.fill.endsWith('_fill') && i.fill !== 'land') ||
      (i.stroke && i.stroke !== 'sea' && i.stroke !== 'ink'),
  );
  expect(marks.length).toBeGreaterThan(12);
  expect(marks.length).toBeLessThanOrEqual(24);
  expect(map.description).toMatch(/^Map of 24 districts/);

  const district = await s.agent.get('/api/briefs/district/D02');
  expect(district.body.locator.description).toMatch(/Brackenmoor outlined among its 23 neighbours/);
  for (const path of ['/api/briefs/region.pdf', '/api/briefs/district/D02.pdf']) {
    const pdf = await s.agent.get(path).buffer(true);
    expect(pdf.status).toBe(200);
    expect(pdf.headers['content-type']).toMatch(/application\/pdf/);
  }
});
