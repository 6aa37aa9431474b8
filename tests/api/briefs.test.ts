/**
 * Briefs end to end over the demo region: a run is published inside the test, then the
 * district brief of every district and the region brief are read back with poppler —
 * page size and count (pdfinfo), the words (pdftotext), word positions (pdftotext -bbox),
 * the embedded fonts (pdffonts) — and page 1 is rendered to PNG (pdftoppm) into
 * tests/artifacts/briefs/ for people to look at. Then: US Letter after the setting
 * changes, the JSON content of the print view, published runs only, 401 for anonymous,
 * and the region brief attached to the digest in the mail catcher.
 */
import { existsSync, statSync } from 'node:fs';
import type { Server } from 'node:http';
import request from 'supertest';
import type TestAgent from 'supertest/lib/agent';
import type { CrestwatchApp } from '../../api/app';
import { renderRegionPdf } from '../../api/briefs/pdf/region-pdf';
import { missingGlyphs } from '../../api/briefs/pdf/fonts';
import { CAUTIONS, STANDING_LABEL } from '../../api/briefs/words';
import { loadConfig } from '../../api/config';
import { seedDemoIfEmpty } from '../../api/demo/seed';
import type { Jobs } from '../../api/jobs/boss';
import { startMailCatcher, type MailCatcher } from '../../api/mail/catcher';
import { createMailer } from '../../api/mail/mailer';
import { deliverOutbox } from '../../api/outbox/sender';
import { ensureDemoAccounts } from '../../api/people/service';
import type { EstimateRecord } from '../../api/runs/estimate-record';
import { mainRecords } from '../../api/runs/store';
import { DistrictBriefContentSchema, RegionBriefContentSchema, type RegionBriefContent } from '../../contracts/briefs';
import { closeServer, DEMO, listen, signInAs } from '../support/auth';
import { parseAnswer } from '../support/contract';
import { copyDistrictSeries } from '../support/synthetic';
import { startRunAndWait, testJobs, until, workIn } from '../support/jobs';
import { flat, pdfFonts, pdfInfo, pdfText, pdfWords, renderFirstPage, savePdf } from '../support/poppler';
import { testApp } from '../support/test-app';
import { freshDatabase, type TestDatabase } from '../support/test-db';

jest.setTimeout(240_000);

let t: TestDatabase;
let app: CrestwatchApp;
let server: Server;
let jobs: Jobs;
let catcher: MailCatcher;
let analyst: TestAgent;
let official: TestAgent;
let admin: TestAgent;

/** A name far longer than a title line, with letters from four scripts. */
const LONG_CODE = 'D90';
const LONG_NAME =
  'Upper Amberlyn Reach and the Southern Estuary Parishes of Łęczyca-Ørsted, Şelé-Çamlık, Θεσσαλονίκη Όρμος and Новгородская Слобода (Joint Statistical District)';

beforeAll(async () => {
  t = await freshDatabase();
  await seedDemoIfEmpty(t.db);
  await ensureDemoAccounts(t.db);
  // The long-named district gets D01's series, so it is estimated like any other.
  const [{ id }] = await t.db('districts').insert({ code: LONG_CODE, name: LONG_NAME }).returning('id');
  await copyDistrictSeries(t.db, 'D01', id);
  catcher = await startMailCatcher(t.db, 0);
  const config = { ...loadConfig({ CRESTWATCH_MODE: 'test' }), mailCatcherPort: catcher.port, mailRetrySeconds: 1 };
  jobs = await testJobs(t.url);
  // One analyst prints every district's brief here, past the per-person limit of 30 a minute
  // (tests/security/compute-limits.test.ts checks that limit).
  app = testApp(
    t.db,
    { mailCatcherPort: catcher.port, mailRetrySeconds: 1, computeRequestsPerMinute: 1000 },
    createMailer(config),
  );
  app.locals.ctx.jobs = jobs;
  await workIn(app.locals.ctx, jobs);
  server = await listen(app);
  analyst = (await signInAs(server, DEMO.analyst)).agent;
  official = (await signInAs(server, DEMO.official)).agent;
  admin = (await signInAs(server, DEMO.admin)).agent;
});
afterAll(async () => {
  await jobs?.stop();
  if (server) await closeServer(server, app);
  await catcher?.stop();
  await t?.drop();
});

async function runToReview(): Promise<number> {
  const { status, run } = await startRunAndWait(analyst);
  expect(status).toBe(202);
  return run.id;
}

async function pdfOf(agent: TestAgent, url: string): Promise<Buffer> {
  const res = await agent
    .get(url)
    .buffer(true)
    .parse((r, cb) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => cb(null, Buffer.concat(chunks)));
    });
  expect(res.status).toBe(200);
  expect(res.headers['content-type']).toMatch(/^application\/pdf/);
  return res.body as Buffer;
}

// The rounding rule, written out again here from DEVELOPERS.md ("Briefs: rounding") rather
// than imported, so a mistake in api/briefs/format.ts cannot hide behind itself:
// three significant figures, points half away from zero, interval ends outward.
const SUPERSCRIPT = '⁰¹²³⁴⁵⁶⁷⁸⁹';
function threeFigures(v: number, mode: 'round' | 'floor' | 'ceil'): string {
  const e = Math.floor(Math.log10(Math.abs(v)));
  const step = 10 ** (e - 2);
  const scaled = v / step;
  // Guard against binary noise in v/step (e.g. 14300/100 = 142.99999…).
  const near = Math.abs(scaled - Math.round(scaled)) < 1e-9 ? Math.round(scaled) : scaled;
  const n =
    mode === 'floor'
      ? Math.floor(near)
      : mode === 'ceil'
        ? Math.ceil(near)
        : Math.sign(near) * Math.floor(Math.abs(near) + 0.5);
  if (Math.abs(v) >= 1e9 || Math.abs(v) < 1e-3) {
    // n has three digits (or 1000 after rounding up): m.mm × 10ᵉ
    const [digits, exp] = Math.abs(n) >= 1000 ? [n / 10, e + 1] : [n, e];
    const mantissa = (digits / 100).toFixed(2).replace(/\.?0+$/, '');
    const power = String(exp)
      .replace('-', '⁻')
      .replace(/\d/g, (d) => SUPERSCRIPT[Number(d)]);
    return `${mantissa.replace('-', '\u2212')} × 10${power}`;
  }
  const value = n * step;
  const places = Math.max(0, 2 - e);
  return value
    .toLocaleString('en-GB', { minimumFractionDigits: places, maximumFractionDigits: places })
    .replace('-', '\u2212');
}

/** For names: pdftotext joins a word broken after a hyphen at a line end and drops the hyphen. */
const loose = (s: string) => flat(s).replace(/-/g, '');

/** What the brief must say about a record's threshold, by the rule of docs/method.md and the rounding rule. */
function expectedThreshold(r: EstimateRecord): string[] {
  const tp = r.threshold;
  if (!tp || tp.level === null) return ['none'];
  const out = [threeFigures(tp.level, 'round')];
  if (tp.fieller.kind === 'bounded') {
    const lo = r.standing.intervalMethod === 'delta' ? tp.delta.levelLo! : tp.fieller.levelLo!;
    const hi = r.standing.intervalMethod === 'delta' ? tp.delta.levelHi! : tp.fieller.levelHi!;
    out.push(threeFigures(lo, 'floor'), threeFigures(hi, 'ceil'));
  } else {
    out.push(`not bounded at ${Math.round(r.model.level * 1000) / 10}%`);
  }
  return out;
}

describe('briefs', () => {
  let runId: number;
  let records: (EstimateRecord & { code: string; name: string })[];

  it('answers 401 to anonymous callers and 404 before anything is published', async () => {
    for (const url of [
      '/api/briefs/district/D01.pdf',
      '/api/briefs/district/D01',
      '/api/briefs/region.pdf',
      '/api/briefs/region',
    ]) {
      const anon = await request(server).get(url);
      expect(anon.status).toBe(401);
      expect(anon.body.error.code).toBe('unauthenticated');
      const early = await official.get(url);
      expect(early.status).toBe(404);
      expect(early.body.error.code).toBe('no_published_run');
    }
  });

  it('publishes a run over the demo region', async () => {
    runId = await runToReview();
    // A run in review is not a brief's source.
    const notYet = await official.get(`/api/briefs/district/D01.pdf?run=${runId}`);
    expect(notYet.status).toBe(404);
    expect(
      (
        await analyst
          .put(`/api/runs/${runId}/districts/D01/note`)
          .send({ note: 'Income for 2024 was revised by the statistics office; the band moved little.' })
      ).status,
    ).toBe(204);
    expect((await analyst.post(`/api/runs/${runId}/publish`)).status).toBe(200);
    records = await mainRecords(t.db, runId);
    expect(records).toHaveLength(25);
  });

  it('prints a one-page A4 district brief for every district with the stored figures, the run and the cautions', async () => {
    const runInfo = (await analyst.get(`/api/runs/${runId}`)).body;
    const problems: string[] = [];
    for (const r of records) {
      const file = savePdf(`district-${r.code}`, await pdfOf(official, `/api/briefs/district/${r.code}.pdf`));
      const info = pdfInfo(file);
      // A4 is 595.28 × 841.89 pt (ISO 216: 210 × 297 mm at 72 pt per inch).
      if (info.pages !== 1 || Math.abs(info.width - 595.28) > 0.1 || Math.abs(info.height - 841.89) > 0.1)
        problems.push(`${r.code}: ${info.pages} pages, ${info.width}×${info.height}`);
      const text = flat(pdfText(file));
      if (!loose(text).includes(loose(r.name))) problems.push(`${r.code}: missing the name "${r.name}"`);
      const must = [
        STANDING_LABEL[r.standing.standing],
        ...expectedThreshold(r),
        `Run #${runId}`,
        `data version ${runInfo.dataVersion} (hash ${String(runInfo.dataHash).slice(0, 12)})`,
        `Crestwatch ${runInfo.softwareVersion}`,
        'Page 1 of 1',
        ...CAUTIONS.map(flat),
      ];
      for (const m of must) if (!text.includes(flat(m))) problems.push(`${r.code}: missing "${m}"`);
      // Never a bounded interval where Fieller is two rays or the whole line.
      if (r.threshold && r.threshold.fieller.kind !== 'bounded' && /Fieller interval \d/.test(text))
        problems.push(`${r.code}: prints a Fieller interval for a ${r.threshold.fieller.kind} set`);
      renderFirstPage(file, `district-${r.code}`);
    }
    expect(problems).toEqual([]);
    for (const code of ['D01', 'D24', 'D10', LONG_CODE])
      expect(statSync(`${__dirname}/../artifacts/briefs/district-${code}.png`).size).toBeGreaterThan(20_000);
  });

  it('covers the special cases: a whole-line or two-rays district, the regional substitute, the analyst note', async () => {
    const unbounded = records.filter((r) => r.threshold && r.threshold.fieller.kind !== 'bounded');
    expect(unbounded.length).toBeGreaterThan(0);
    for (const r of unbounded) {
      const text = flat(
        pdfText(savePdf(`district-${r.code}`, await pdfOf(official, `/api/briefs/district/${r.code}.pdf`))),
      );
      expect(text).toContain(
        `not bounded at 95% (the Fieller set is ${r.threshold!.fieller.kind === 'two_rays' ? 'two rays' : 'the whole line'})`,
      );
    }
    // D10 has 2018–2025 only: the pooled curve stands in, and the brief says so.
    const d10 = records.find((r) => r.code === 'D10')!;
    expect(d10.status).toBe('substitute');
    const d10text = flat(pdfText(`${__dirname}/../artifacts/briefs/district-D10.pdf`));
    expect(d10text).toContain('the regional pooled curve stands in');
    expect(d10text).toContain('THRESHOLD (REGIONAL)');
    const d01text = flat(pdfText(`${__dirname}/../artifacts/briefs/district-D01.pdf`));
    expect(d01text).toContain('Income for 2024 was revised by the statistics office');
    expect(flat(pdfText(`${__dirname}/../artifacts/briefs/district-D02.pdf`))).not.toContain(
      'Income for 2024 was revised',
    );
  });

  it('sets names from other scripts and a very long name inside the page, in the embedded Inter, with no missing glyph', async () => {
    for (const code of ['D24', LONG_CODE]) {
      const file = `${__dirname}/../artifacts/briefs/district-${code}.pdf`;
      const name = records.find((r) => r.code === code)!.name;
      expect(missingGlyphs(name)).toEqual([]);
      const fonts = pdfFonts(file);
      expect(fonts.map((f) => f.name.replace(/^[A-Z]{6}\+/, '')).sort()).toEqual(['Inter-Bold', 'Inter-Regular']);
      for (const f of fonts) expect(f).toMatchObject({ embedded: true, subset: true, unicode: true });
      // Every word of the name comes back as written (a missing glyph would not).
      expect(loose(pdfText(file))).toContain(loose(name));
      const words = pdfWords(file);
      const info = pdfInfo(file);
      const outside = words.filter((w) => w.xMin < 39.5 || w.xMax > info.width - 39.5 || w.yMax > info.height - 4);
      expect(outside.map((w) => `${w.text} ${w.xMin}-${w.xMax}`)).toEqual([]);
      // The title lines come first and sit above the standing label, which sits above the figures.
      const record = records.find((r) => r.code === code)!;
      const chipAt = words.findIndex(
        (w) => w.text === STANDING_LABEL[record.standing.standing].toUpperCase().split(' ')[0],
      );
      expect(chipAt).toBeGreaterThan(0);
      const nameWords = new Set(name.split(/\s+/));
      const title = words.slice(0, chipAt).filter((w) => w.yMin > 45 && nameWords.has(w.text));
      expect(title.length).toBeGreaterThanOrEqual(nameWords.size - 1);
      expect(Math.max(...title.map((w) => w.yMax))).toBeLessThanOrEqual(words[chipAt].yMin);
      expect(words[chipAt].yMax).toBeLessThan(words.find((w) => w.text === 'STANDING')!.yMin);
    }
  });

  it('prints the region brief: the summary, every district in the table, the pooled curve, the run and the cautions', async () => {
    const file = savePdf('region', await pdfOf(official, '/api/briefs/region.pdf'));
    const info = pdfInfo(file);
    expect(Math.abs(info.width - 595.28)).toBeLessThan(0.1);
    expect(info.pages).toBeGreaterThanOrEqual(2);
    const all = flat(pdfText(file));
    const summary = flat(pdfText(file, { first: 1, last: 1 }));
    expect(summary).toContain('Region brief');
    expect(summary).toContain('25 districts in this run');
    expect(summary).toContain('This is the first published run: there is nothing to compare with.');
    expect(summary).toContain('Regional pooled curve');
    for (const c of CAUTIONS) expect(summary).toContain(flat(c));
    const counts = new Map<string, number>();
    for (const r of records) counts.set(r.standing.standing, (counts.get(r.standing.standing) ?? 0) + 1);
    for (const [standing, n] of counts) expect(summary).toContain(`${n} ${STANDING_LABEL[standing].toLowerCase()}`);
    const table = flat(pdfText(file, { first: 2, last: info.pages }));
    for (const r of records) {
      expect(table).toContain(r.code);
      if (r.code !== LONG_CODE) expect(loose(table)).toContain(loose(r.name));
      for (const e of expectedThreshold(r)) expect(table).toContain(e);
    }
    expect(table).toContain('Upper Amberlyn Reach');
    for (let p = 1; p <= info.pages; p++) expect(all).toContain(`Page ${p} of ${info.pages}`);
    expect(all).toContain(`Run #${runId}`);
    renderFirstPage(file, 'region');
  });

  it('repeats the table header on every page of a long region table', async () => {
    const content = parseAnswer(RegionBriefContentSchema, await official.get('/api/briefs/region'));
    const rows = Array.from({ length: 12 }, (_, k) =>
      content.table.rows.map((r) => ({ ...r, code: `${r.code}-${k}` })),
    ).flat();
    const file = savePdf('region-long', await renderRegionPdf({ ...content, table: { ...content.table, rows } }));
    const info = pdfInfo(file);
    expect(info.pages).toBeGreaterThanOrEqual(6);
    // Each table page starts with the same header row: the column titles on one line, above every row.
    const words = pdfWords(file);
    const titles = ['Code', 'District', 'Standing', 'Gap', 'Threshold', 'interval', 'Crossing'];
    for (let p = 2; p <= info.pages; p++) {
      const onPage = words.filter((w) => w.page === p);
      const head = titles.map((title) => onPage.find((w) => w.text === title));
      expect(head.every(Boolean)).toBe(true);
      const y = head[0]!.yMin;
      for (const h of head) expect(Math.abs(h!.yMin - y)).toBeLessThan(1);
      const firstRow = onPage.find((w) => /^D\d\d-\d+$/.test(w.text))!;
      expect(firstRow.yMin).toBeGreaterThan(y);
      expect(flat(pdfText(file, { first: p, last: p }))).toContain(`Page ${p} of ${info.pages}`);
    }
    const table = flat(pdfText(file, { first: 2, last: info.pages }));
    for (const r of rows) expect(table).toContain(` ${r.code} `);
  });

  it('answers the same content as JSON for the print view', async () => {
    const anon = await request(server).get('/api/briefs/district/D01');
    expect(anon.status).toBe(401);
    const c = parseAnswer(DistrictBriefContentSchema, await official.get('/api/briefs/district/D01'));
    const d01 = records.find((r) => r.code === 'D01')!;
    expect(c).toMatchObject({
      kind: 'district',
      code: 'D01',
      name: d01.name,
      paperSize: 'A4',
      pdfPath: '/api/briefs/district/D01.pdf?track=emissions-pc',
    });
    expect(c.trace.runId).toBe(runId);
    expect(c.figures.find((f) => f.key === 'threshold')!.value).toBe(threeFigures(d01.threshold!.level!, 'round'));
    expect(c.charts.curve.items.length).toBeGreaterThan(20);
    const pdf = flat(pdfText(`${__dirname}/../artifacts/briefs/district-D01.pdf`));
    for (const f of c.figures) {
      expect(pdf).toContain(flat(f.value));
      if (f.detail) expect(pdf).toContain(flat(f.detail));
    }
    expect(pdf).toContain(flat(c.headline));
    const missing = await official.get('/api/briefs/district/NOPE');
    expect(missing.status).toBe(404);
    const region = (await official.get(`/api/briefs/region?run=${runId}`)).body as RegionBriefContent;
    expect(region.table.rows).toHaveLength(25);
    expect(region.trace.runId).toBe(runId);
  });

  it('prints US Letter after the setting changes', async () => {
    expect((await admin.patch('/api/settings').send({ briefPaperSize: 'LETTER' })).status).toBe(200);
    for (const [name, url] of [
      ['district-D24-letter', '/api/briefs/district/D24.pdf'],
      [`district-${LONG_CODE}-letter`, `/api/briefs/district/${LONG_CODE}.pdf`],
      ['region-letter', '/api/briefs/region.pdf'],
    ]) {
      const file = savePdf(name, await pdfOf(official, url));
      const info = pdfInfo(file);
      // US Letter is 8.5 × 11 in = 612 × 792 pt.
      expect([info.width, info.height]).toEqual([612, 792]);
      if (name.startsWith('district')) expect(info.pages).toBe(1);
      const outside = pdfWords(file).filter((w) => w.xMax > 612 - 39.5 || w.yMax > 792 - 4);
      expect(outside).toEqual([]);
      renderFirstPage(file, name);
    }
    expect((await admin.patch('/api/settings').send({ briefPaperSize: 'A4' })).status).toBe(200);
  });

  it('attaches the region brief to the digest of the next publish for a subscriber who asked for it', async () => {
    expect(
      (await official.post('/api/subscriptions').send({ scope: 'region', delivery: 'digest', attachBrief: true }))
        .status,
    ).toBe(201);
    // A data revision moves a district across its band, so the publish has alerts to send.
    const candidate = records.find((r) => r.standing.standing === 'approaching' || r.standing.standing === 'at_turn')!;
    expect(candidate).toBeDefined();
    const csv = `district_code,indicator,year,value\n${candidate.code},income_pc,${candidate.lastYear},${Math.round(candidate.threshold!.level! * 2)}\n`;
    expect(
      (await analyst.post('/api/uploads?commit=true').attach('file', Buffer.from(csv), 'brief-revision.csv')).status,
    ).toBe(201);
    const second = await runToReview();
    const pub = await analyst.post(`/api/runs/${second}/publish`);
    expect(pub.status).toBe(200);
    expect(pub.body.mails).toBeGreaterThanOrEqual(1);
    const mail = await until('digest with the brief', async () => {
      await deliverOutbox(app.locals.ctx);
      const rows = await t
        .db('caught_mail')
        .whereRaw('? = ANY(envelope_to)', [DEMO.official])
        .select('subject', 'text_body', 'attachments');
      return rows.find((m: { subject: string }) => m.subject.includes(`published run #${second}`));
    });
    expect(mail.text_body).toContain('The region brief is attached.');
    expect(mail.attachments).toEqual([
      {
        filename: `crestwatch-region-emissions-pc-run-${second}.pdf`,
        contentType: 'application/pdf',
        size: expect.any(Number),
      },
    ]);
    expect(mail.attachments[0].size).toBeGreaterThan(10_000);
    // The region brief of that run lists the district that crossed.
    const file = savePdf('region-second', await pdfOf(official, `/api/briefs/region.pdf?run=${second}`));
    const summary = flat(pdfText(file, { first: 1, last: 1 }));
    expect(summary).toContain('Crossed since the last publish');
    expect(summary).toMatch(new RegExp(`${candidate.code} .*${STANDING_LABEL[candidate.standing.standing]} →`));
    expect(summary).toContain('Largest threshold shifts');
    expect(existsSync(renderFirstPage(file, 'region-second'))).toBe(true);
    // The earlier run can still be printed by id, with its own number.
    expect(
      flat(pdfText(savePdf('region-first', await pdfOf(official, `/api/briefs/region.pdf?run=${runId}`)))),
    ).toContain(`Run #${runId}`);
  });
});
