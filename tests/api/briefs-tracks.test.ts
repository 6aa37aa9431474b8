/**
 * Briefs per track over the demo region with its three tracks published: the district brief
 * and the region brief of a named track (default the headline) speak of that track's
 * indicator in the catalogue's words and units, print every indicator's source and
 * licence, and never the CO2 words on another track; the district summary brief's first
 * page shows every track's standing side by side, followed by one page per track. PDFs are
 * read back with pdftotext (poppler) and kept in tests/artifacts/briefs/.
 */
import type { Server } from 'node:http';
import type TestAgent from 'supertest/lib/agent';
import type { CrestwatchApp } from '../../api/app';
import { publishInitialDemoRuns } from '../../api/demo/initial-run';
import { seedDemoIfEmpty } from '../../api/demo/seed';
import type { Jobs } from '../../api/jobs/boss';
import { ensureDemoAccounts } from '../../api/people/service';
import { DistrictBriefContentSchema, RegionBriefContentSchema } from '../../contracts/briefs';
import { closeServer, DEMO, listen, signInAs } from '../support/auth';
import { parseAnswer } from '../support/contract';
import { testJobs, workIn } from '../support/jobs';
import { flat, pdfInfo, pdfText, savePdf } from '../support/poppler';
import { testApp } from '../support/test-app';
import { freshDatabase, type TestDatabase } from '../support/test-db';

jest.setTimeout(240_000);

let t: TestDatabase;
let app: CrestwatchApp;
let server: Server;
let jobs: Jobs;
let official: TestAgent;
let runIds: number[];

/** The demo catalogue's words (api/demo/catalogue.ts). */
const SOURCE = 'Demo region statistics office (invented)';
const LICENCE = 'Invented demonstration data: free to copy and change, describes no real place';

const binary = (res: import('superagent').Response, cb: (err: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => cb(null, Buffer.concat(chunks)));
};

async function pdf(path: string, name: string): Promise<{ file: string; status: number }> {
  const res = await official.get(path).buffer(true).parse(binary);
  if (res.status !== 200) return { file: '', status: res.status };
  expect(res.headers['content-type']).toMatch(/^application\/pdf/);
  return { file: savePdf(name, res.body as Buffer), status: 200 };
}

beforeAll(async () => {
  t = await freshDatabase();
  await seedDemoIfEmpty(t.db);
  await ensureDemoAccounts(t.db);
  jobs = await testJobs(t.url);
  app = testApp(t.db);
  app.locals.ctx.jobs = jobs;
  await workIn(app.locals.ctx, jobs);
  runIds = (await publishInitialDemoRuns(app.locals.ctx, DEMO.admin))!;
  server = await listen(app);
  official = (await signInAs(server, DEMO.official)).agent;
});
afterAll(async () => {
  await jobs?.stop();
  if (server) await closeServer(server, app);
  await t.drop();
});

it('prints the PM2.5 district brief in the catalogue’s words, with sources and licences, no CO2 words', async () => {
  const { file, status } = await pdf('/api/briefs/district/D13.pdf?track=pm25', 'track-d13-pm25');
  expect(status).toBe(200);
  expect(pdfInfo(file).pages).toBe(1);
  const text = flat(pdfText(file));
  expect(text).toContain('District brief · D13 · PM2.5 · published run');
  // D13 is past the turn on PM2.5 (the demo's design, api/demo/pressures.ts).
  expect(text).toContain('Past the turn');
  expect(text).toContain('is above the band where PM2.5 annual mean concentration has tended to turn down');
  expect(text).toContain('PM2.5 annual mean concentration (µg/m³) (log scale)');
  expect(text).toContain('PM2.5 annual mean concentration in µg/m³');
  expect(text).toContain(
    `Sources. PM2.5 annual mean concentration (µg/m³), real income per person (constant 2020 currency units per person), population density (persons per km²): ${SOURCE}; licence: ${LICENCE}`,
  );
  expect(text).not.toMatch(/CO2|CO₂/);
});

it('reads the headline track without ?track= (CO2 per person: D13 approaching)', async () => {
  const { file } = await pdf('/api/briefs/district/D13.pdf', 'track-d13-headline');
  const text = flat(pdfText(file));
  expect(text).toContain('District brief · D13 · CO2 per person · published run');
  expect(text).toContain('Approaching');
  expect(text).toContain('t CO2 per person');
});

it('answers the print view’s content with the track and the sources', async () => {
  const res = await official.get('/api/briefs/district/D07?track=so2');
  const c = parseAnswer(DistrictBriefContentSchema, res);
  expect(c.track).toEqual({ code: 'so2', name: 'SO2 per person' });
  expect(c.pdfPath).toBe('/api/briefs/district/D07.pdf?track=so2');
  expect(c.sources?.map((s) => s.code)).toEqual(['so2_pc', 'income_pc', 'pop_density']);
  expect(c.sources?.every((s) => s.source === SOURCE && s.licence === LICENCE)).toBe(true);
  // D07's SO2 series starts in 2022: the regional curve stands in (api/demo/pressures.ts).
  expect(c.substitute).toMatch(/Series too short/);
});

it('makes the region brief per track', async () => {
  const { file } = await pdf('/api/briefs/region.pdf?track=so2', 'track-region-so2');
  const text = flat(pdfText(file));
  expect(text).toContain('Region brief · SO2 per person');
  expect(text).toContain(`Sources. SO2 emissions per person (kg per person), real income per person`);
  expect(text).not.toMatch(/CO2 emissions|t CO2/);
  const json = parseAnswer(RegionBriefContentSchema, await official.get('/api/briefs/region?track=pm25'));
  expect(json.track?.code).toBe('pm25');
  expect(json.pdfPath).toBe('/api/briefs/region.pdf?track=pm25');
});

it('puts every track’s standing side by side on the summary’s first page, then one page per track', async () => {
  const { file, status } = await pdf('/api/briefs/district/D13/summary.pdf', 'track-d13-summary');
  expect(status).toBe(200);
  // 1 summary page + 3 track pages (three tracks, each with a published run).
  expect(pdfInfo(file).pages).toBe(4);
  const first = flat(pdfText(file, { first: 1, last: 1 }));
  expect(first).toContain('The tracks disagree for Mirefield Uplands');
  for (const words of ['CO2 per person', 'PM2.5', 'SO2 per person', 'Approaching', 'Past the turn', 'µg/m³'])
    expect(first).toContain(words);
  for (const id of runIds) expect(first).toContain(`run #${id}`);
  expect(flat(pdfText(file, { first: 3, last: 3 }))).toContain('District brief · D13 · PM2.5');
});

it('refuses an unknown track and a run of another track', async () => {
  expect((await official.get('/api/briefs/district/D13.pdf?track=nox')).status).toBe(404);
  expect((await official.get('/api/briefs/district/D13.pdf?track=Bad!')).status).toBe(400);
  // runIds[0] is the CO2 track's run.
  expect((await official.get(`/api/briefs/district/D13.pdf?track=pm25&run=${runIds[0]}`)).status).toBe(404);
  expect((await official.get('/api/briefs/district/D99/summary.pdf')).status).toBe(404);
});
