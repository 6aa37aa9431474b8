/**
 * Briefs an official reads (issue 17): plain words for a flat curve at the run's test level,
 * the region brief's threshold shifts limited to those over the alert setting (or a sentence
 * saying none moved that far), the region locale setting writing numbers and dates through
 * Intl, and tagged PDFs (PDF/UA, ISO 14289-1, tagging per PDF 1.7 §14.8): pdfinfo reports
 * "Tagged: yes" and the title, and the structure tree holds H1, H2 and a Table of TR/TH/TD.
 * PDFs are read back with poppler (pdfinfo, pdftotext) and kept in tests/artifacts/briefs/.
 */
import { execFileSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
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
import { startRunAndWait, testJobs, workIn } from '../support/jobs';
import { flat, pdfInfo, pdfText, savePdf } from '../support/poppler';
import { testApp } from '../support/test-app';
import { freshDatabase, type TestDatabase } from '../support/test-db';

jest.setTimeout(300_000);

let t: TestDatabase;
let app: CrestwatchApp;
let server: Server;
let jobs: Jobs;
let official: TestAgent;
let analyst: TestAgent;
let admin: TestAgent;

const binary = (res: import('superagent').Response, cb: (err: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => cb(null, Buffer.concat(chunks)));
};

async function pdf(path: string, name: string): Promise<string> {
  const res = await official.get(path).buffer(true).parse(binary);
  expect(res.status).toBe(200);
  expect(res.headers['content-type']).toMatch(/^application\/pdf/);
  return savePdf(name, res.body as Buffer);
}

/** `pdfinfo` as printed (poppler 22: "Tagged: yes" for a document with a marked StructTreeRoot). */
const pdfinfoText = (file: string) => execFileSync('pdfinfo', [file], { encoding: 'utf8' });
/** The logical structure as poppler reads it (`pdfinfo -struct`, for tagged files). */
const structure = (file: string) => execFileSync('pdfinfo', ['-struct', file], { encoding: 'utf8' });
/** Element types of the tree: "TH: /Scope /Column" → "TH", "H1 (block)" → "H1". */
const elements = (tree: string) => new Set(tree.split('\n').map((l) => /^\s*(\w+)/.exec(l)?.[1] ?? ''));

beforeAll(async () => {
  t = await freshDatabase();
  await seedDemoIfEmpty(t.db);
  await ensureDemoAccounts(t.db);
  jobs = await testJobs(t.url);
  app = testApp(t.db, { computeRequestsPerMinute: 1000 });
  app.locals.ctx.jobs = jobs;
  await workIn(app.locals.ctx, jobs);
  await publishInitialDemoRuns(app.locals.ctx, DEMO.admin);
  server = await listen(app);
  official = (await signInAs(server, DEMO.official)).agent;
  analyst = (await signInAs(server, DEMO.analyst)).agent;
  admin = (await signInAs(server, DEMO.admin)).agent;
});
afterAll(async () => {
  await jobs?.stop();
  if (server) await closeServer(server, app);
  await t?.drop();
});

describe('tagged PDFs (PDF/UA, ISO 14289-1; PDF 1.7 §14.8)', () => {
  it.each([
    ['district', '/api/briefs/district/D13.pdf?track=pm25', 'Mirefield Uplands (D13) · district brief', false],
    ['summary', '/api/briefs/district/D13/summary.pdf', 'Mirefield Uplands (D13) · district summary', true],
    ['region', '/api/briefs/region.pdf', 'Region brief · run #', true],
  ])(
    'the %s brief is tagged, titled, with headings and tables in its structure tree',
    async (name, path, title, table) => {
      const file = await pdf(path, `tagged-${name}`);
      const info = pdfinfoText(file);
      expect(info).toMatch(/^Tagged:\s+yes$/m);
      expect(pdfInfo(file).title).toContain(title);
      const tree = structure(file);
      // One Document element at the root, as poppler expects of a tagged PDF.
      expect(tree.split('\n')[0]).toMatch(/^Document\b/);
      const found = elements(tree);
      expect(found.has('H1')).toBe(true);
      expect(found.has('H2')).toBe(true);
      expect(found.has('P')).toBe(true);
      expect(found.has('Figure')).toBe(true);
      if (table) for (const e of ['Table', 'TR', 'TH', 'TD']) expect(found.has(e)).toBe(true);
      // The document's language is the region locale (default en-GB): the catalog's /Lang (PDF 1.7 §14.9.2).
      expect(readFileSync(file).toString('latin1')).toContain('/Lang (en-GB)');
    },
  );
});

describe('plain words', () => {
  it('says what flat means, at the run’s test level, in the district brief (D07 is flat by design)', async () => {
    const c = parseAnswer(DistrictBriefContentSchema, await official.get('/api/briefs/district/D07'));
    const shape = c.figures.find((f) => f.key === 'shape');
    // api/demo/generate.ts draws D07 with no slope; the run's α is the default 0.05.
    expect(shape?.value).toBe('No clear link with income at the 5% level');
    expect(c.headline).toContain('no clear link with real income per person at the 5% level');
    const text = flat(pdfText(await pdf('/api/briefs/district/D07.pdf', 'words-d07')));
    expect(text).toContain('No clear link with income at the 5% level');
    expect(text).not.toMatch(/\bFlat\b/);
    // The shape's test is said in words, not "a turn at α = 0.05" (the model line keeps its α for analysts).
    expect(text).toContain('no turn is confirmed at the 5% level');
    expect(text).not.toMatch(/a turn at α/);
  });
});

describe('threshold shifts list only changes', () => {
  let runId: number;

  beforeAll(async () => {
    // A data revision (D01's latest income doubled) and a second publish of the headline track.
    const csv = 'district_code,indicator,year,value\nD01,income_pc,2025,90000\n';
    expect((await analyst.post('/api/uploads?commit=true').attach('file', Buffer.from(csv), 'w.csv')).status).toBe(201);
    const { run } = await startRunAndWait(analyst);
    runId = run.id;
    expect((await analyst.post(`/api/runs/${runId}/publish`)).status).toBe(200);
  });

  it('lists only districts whose threshold moved more than the alert setting', async () => {
    // At the lowest setting (0.1%) the revision's moves show; every one listed moved more than it.
    for (const limit of [0.1, 10]) {
      expect((await admin.patch('/api/settings').send({ thresholdShiftPercent: limit })).status).toBe(200);
      const c = parseAnswer(RegionBriefContentSchema, await official.get(`/api/briefs/region?run=${runId}`));
      if (limit === 0.1) expect(c.shifts.length).toBeGreaterThan(0);
      for (const s of c.shifts) {
        const percent = Number(/\(([+−-]?[\d,.]+)%\)$/.exec(s.text)?.[1].replace('−', '-').replace(/,/g, ''));
        expect(Math.abs(percent)).toBeGreaterThan(limit);
        expect(s.overLimit).toBe(true);
      }
      if (c.shifts.length) expect(c.shiftsNote).toContain(`moved more than ${limit}% (the alert setting)`);
    }
  });

  it('says in a sentence that none moved more than the setting', async () => {
    expect((await admin.patch('/api/settings').send({ thresholdShiftPercent: 1000 })).status).toBe(200);
    const c = parseAnswer(RegionBriefContentSchema, await official.get(`/api/briefs/region?run=${runId}`));
    expect(c.shifts).toEqual([]);
    const sentence = `No district’s threshold moved more than 1,000% since run #`;
    expect(c.shiftsNote).toContain(sentence);
    const text = flat(pdfText(await pdf(`/api/briefs/region.pdf?run=${runId}`, 'shifts-none'), { first: 1, last: 1 }));
    expect(text).toContain('Largest threshold shifts');
    expect(text).toContain(sentence);
    expect(text).not.toMatch(/→ [\d,]+ \(0%\)/);
    expect((await admin.patch('/api/settings').send({ thresholdShiftPercent: 10 })).status).toBe(200);
  });
});

describe('region locale', () => {
  afterAll(async () => {
    await admin.patch('/api/settings').send({ regionLocale: 'en-GB' });
  });

  it('refuses a tag that is not canonical BCP 47 or has no locale data (Intl.getCanonicalLocales, supportedLocalesOf)', async () => {
    for (const bad of ['de_DE', 'de-de', 'xx-ZZ', ''])
      expect((await admin.patch('/api/settings').send({ regionLocale: bad })).status).toBe(400);
    expect((await admin.get('/api/settings')).body.settings.regionLocale).toBe('en-GB');
    expect((await official.get('/api/me')).body.regionLocale).toBe('en-GB');
  });

  it('writes a brief’s numbers and dates in de-DE once the setting says so', async () => {
    const before = parseAnswer(RegionBriefContentSchema, await official.get('/api/briefs/region'));
    expect((await admin.patch('/api/settings').send({ regionLocale: 'de-DE' })).status).toBe(200);
    expect((await official.get('/api/me')).body.regionLocale).toBe('de-DE');
    const after = parseAnswer(RegionBriefContentSchema, await official.get('/api/briefs/region'));
    // CLDR (Node's ICU): de-DE groups thousands with "." and writes "4. Dezember 2026";
    // en-GB groups with "," and writes "4 December 2026". Thresholds are ≥ 1,000 at three
    // significant figures, so they differ only in the separator.
    const grouped = before.table.rows.filter((r) => /^\d{1,3}(,\d{3})+$/.test(r.threshold));
    expect(grouped.length).toBeGreaterThan(0);
    for (const r of grouped) {
      const de = after.table.rows.find((a) => a.code === r.code)!;
      expect(de.threshold).toBe(r.threshold.replace(/,/g, '.'));
    }
    expect(before.subtitle).toMatch(/ of \d{1,2} [A-Z][a-z]+ \d{4}$/);
    expect(after.subtitle).toMatch(
      / of \d{1,2}\. (Januar|Februar|März|April|Mai|Juni|Juli|August|September|Oktober|November|Dezember) \d{4}$/,
    );
    const file = await pdf('/api/briefs/region.pdf', 'locale-de');
    const text = flat(pdfText(file));
    expect(text).toContain(after.subtitle);
    for (const r of grouped.slice(0, 5)) expect(text).toContain(r.threshold.replace(/,/g, '.'));
    // The document language follows the locale (the catalog's /Lang, PDF 1.7 §14.9.2).
    expect(readFileSync(file).toString('latin1')).toContain('/Lang (de-DE)');
  });
});
