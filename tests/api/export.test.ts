/**
 * GET /api/runs/:id/export.csv: one row per district with every figure of the card at full
 * precision, text cells that a spreadsheet would take for a formula escaped, and who may
 * export which run (every signed-in role a published run; analysts and admins a run in
 * review; anonymous 401).
 */
import type { Server } from 'node:http';
import { parse } from 'csv-parse/sync';
import request from 'supertest';
import type TestAgent from 'supertest/lib/agent';
import type { CrestwatchApp } from '../../api/app';
import { EXPORT_COLUMNS } from '../../api/briefs/export-csv';
import { seedDemoIfEmpty } from '../../api/demo/seed';
import type { Jobs } from '../../api/jobs/boss';
import { ensureDemoAccounts } from '../../api/people/service';
import { mainRecords } from '../../api/runs/store';
import { closeServer, DEMO, listen, signInAs } from '../support/auth';
import { copyDistrictSeries } from '../support/synthetic';
import { startRunAndWait, testJobs, workIn } from '../support/jobs';
import { testApp } from '../support/test-app';
import { freshDatabase, type TestDatabase } from '../support/test-db';

jest.setTimeout(180_000);

let t: TestDatabase;
let app: CrestwatchApp;
let server: Server;
let jobs: Jobs;
let analyst: TestAgent;
let official: TestAgent;

/** District names a spreadsheet would run as formulas if written as they are. */
const HOSTILE = [
  { code: 'X01', name: '=HYPERLINK("http://example.invalid","click")' },
  { code: 'X02', name: '+1+2' },
  { code: 'X03', name: '-2+3' },
  { code: 'X04', name: '@SUM(A1:A9)' },
];

beforeAll(async () => {
  t = await freshDatabase();
  await seedDemoIfEmpty(t.db);
  await ensureDemoAccounts(t.db);
  // Each hostile name gets D01's series, so it has an estimate like any district.
  for (const h of HOSTILE) {
    const [{ id }] = await t.db('districts').insert(h).returning('id');
    await copyDistrictSeries(t.db, 'D01', id);
  }
  jobs = await testJobs(t.url);
  app = testApp(t.db);
  app.locals.ctx.jobs = jobs;
  await workIn(app.locals.ctx, jobs);
  server = await listen(app);
  analyst = (await signInAs(server, DEMO.analyst)).agent;
  official = (await signInAs(server, DEMO.official)).agent;
});
afterAll(async () => {
  await jobs?.stop();
  if (server) await closeServer(server, app);
  await t?.drop();
});

async function runToReview(): Promise<number> {
  const { status, run } = await startRunAndWait(analyst);
  expect(status).toBe(202);
  return run.id;
}

const rowsOf = (csv: string): Record<string, string>[] =>
  parse(csv, { columns: true, bom: true, skip_empty_lines: true });

describe('run export as CSV', () => {
  let runId: number;

  it('lets analysts export a run in review, not officials, and nobody anonymous', async () => {
    runId = await runToReview();
    expect((await request(server).get(`/api/runs/${runId}/export.csv`)).status).toBe(401);
    const early = await official.get(`/api/runs/${runId}/export.csv`);
    expect(early.status).toBe(403);
    expect(early.body.error.code).toBe('forbidden');
    const staff = await analyst.get(`/api/runs/${runId}/export.csv`);
    expect(staff.status).toBe(200);
    expect(rowsOf(staff.text).every((r) => r.run_state === 'in_review')).toBe(true);
    expect((await official.get('/api/runs/999999/export.csv')).status).toBe(404);
  });

  it('writes one row per district with every figure at full precision', async () => {
    expect((await analyst.post(`/api/runs/${runId}/publish`)).status).toBe(200);
    const res = await official.get(`/api/runs/${runId}/export.csv`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv; charset=utf-8/);
    expect(res.headers['content-disposition']).toMatch(
      new RegExp(`^attachment; filename="?crestwatch-run-${runId}-estimates.csv"?$`),
    );
    // UTF-8 with a byte-order mark (RFC 3629 §6), CRLF line ends (RFC 4180 §2).
    expect(res.text.charCodeAt(0)).toBe(0xfeff);
    expect(res.text).toContain('\r\n');
    const header = res.text.slice(1, res.text.indexOf('\r\n')).split(',');
    // Every text cell is quoted, the header's names included.
    expect(header).toEqual(EXPORT_COLUMNS.map((c) => `"${c}"`));
    const rows = rowsOf(res.text);
    const records = await mainRecords(t.db, runId);
    expect(rows).toHaveLength(records.length);
    expect(rows).toHaveLength(28);
    const run = (await analyst.get(`/api/runs/${runId}`)).body;
    for (const r of records) {
      const row = rows.find((x) => x.district_code === r.code)!;
      expect(row).toBeDefined();
      expect(row).toMatchObject({
        run_id: String(runId),
        run_state: 'published',
        data_hash: run.dataHash,
        software_version: run.softwareVersion,
        standing: r.standing.standing,
        status: r.status,
      });
      // Full precision: the text reads back to the very double the run stored.
      const same = (cell: string, v: number | null | undefined) =>
        v === null || v === undefined ? cell === '' : Number(cell) === v;
      expect(same(row.threshold, r.threshold?.level)).toBe(true);
      expect(same(row.gap_percent, r.gapPercent)).toBe(true);
      expect(same(row.elasticity, r.elasticity?.value)).toBe(true);
      expect(same(row.driver_now, r.range?.levelNow)).toBe(true);
      expect(same(row.crossing_year, r.projection?.crossingYear)).toBe(true);
      expect(same(row.u_test_p, r.uTest?.pValue)).toBe(true);
      // An interval only where it is bounded; two-ray ends in their own columns.
      const kind = r.threshold?.fieller.kind ?? null;
      expect(row.fieller_kind).toBe(kind ?? '');
      if (kind === 'bounded') {
        expect(same(row.fieller_lo, r.threshold!.fieller.levelLo)).toBe(true);
        expect(same(row.fieller_hi, r.threshold!.fieller.levelHi)).toBe(true);
        expect(row.fieller_lower_ray_ends_at).toBe('');
      } else {
        expect([row.fieller_lo, row.fieller_hi, row.interval_lo, row.interval_hi, row.delta_lo, row.delta_hi]).toEqual([
          '',
          '',
          '',
          '',
          '',
          '',
        ]);
        if (kind === 'two_rays') expect(same(row.fieller_upper_ray_starts_at, r.threshold!.fieller.levelHi)).toBe(true);
      }
    }
    const d24 = rows.find((x) => x.district_code === 'D24')!;
    expect(d24.district_name).toBe('Yarrowgate (Jarłowo-Şelé / Жарово)');
  });

  it('escapes text cells that begin with = + - @ so a spreadsheet shows them as text', async () => {
    const res = await official.get(`/api/runs/${runId}/export.csv`);
    const rows = rowsOf(res.text);
    for (const h of HOSTILE) {
      // OWASP "CSV Injection": prefix such cells with a single quote.
      expect(rows.find((r) => r.district_code === h.code)!.district_name).toBe(`'${h.name}`);
    }
    // The raw line carries the quote inside the CSV quoting (the first name has quotes and a comma).
    expect(res.text).toContain(`"'=HYPERLINK(""http://example.invalid"",""click"")"`);
    // Numbers are numbers: a negative elasticity keeps its minus sign, unescaped.
    const negative = rows.find((r) => r.elasticity.startsWith('-'));
    expect(negative).toBeDefined();
    expect(Number(negative!.elasticity)).toBeLessThan(0);
    // No text cell anywhere starts with a formula character.
    for (const r of rows)
      for (const [k, v] of Object.entries(r))
        if (/^[=+@]/.test(v) || (/^-/.test(v) && Number.isNaN(Number(v))))
          throw new Error(`${r.district_code}.${k} = ${v}`);
  });

  it('refuses runs that have nothing to export', async () => {
    const second = await runToReview();
    expect((await analyst.post(`/api/runs/${second}/discard`)).status).toBe(204);
    const res = await analyst.get(`/api/runs/${second}/export.csv`);
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('run_not_ready');
  });
});
