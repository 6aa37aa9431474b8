/**
 * The district list's and the region's standings are built in SQL from the stored records
 * (estimates/store.ts mainSummaryRows); they must equal summaryOf on the decoded records, field
 * for field, for every district of a published demo run (every shape, substitutes, unbounded
 * intervals), and the list names the run they come from.
 */
import type { CrestwatchApp } from '../../api/app';
import { seedDemoIfEmpty } from '../../api/demo/seed';
import { publishedSummaries, region, summaryOf } from '../../api/estimates/service';
import { ensureDemoAccounts } from '../../api/people/service';
import * as runs from '../../api/runs/store';
import { publishDefaultRun } from '../support/published-run';
import { testApp } from '../support/test-app';
import { freshDatabase, type TestDatabase } from '../support/test-db';

jest.setTimeout(180_000);

let t: TestDatabase;
let app: CrestwatchApp;
let runId: number;
beforeAll(async () => {
  t = await freshDatabase();
  await seedDemoIfEmpty(t.db);
  await ensureDemoAccounts(t.db);
  app = testApp(t.db);
  runId = await publishDefaultRun(app, t.url);
});
afterAll(async () => {
  await app?.locals.close();
  await t?.drop();
});

it('builds the same summaries in SQL as summaryOf on the full records', async () => {
  const records = await runs.mainRecords(t.db, runId);
  expect(records.length).toBe(24);
  const { run, byCode } = await publishedSummaries(t.db);
  expect(run?.id).toBe(runId);
  expect(byCode.size).toBe(records.length);
  for (const r of records) expect({ code: r.code, ...byCode.get(r.code) }).toEqual({ code: r.code, ...summaryOf(r) });
  // The demo region covers the cases that differ in shape: substitutes and unbounded intervals.
  const all = [...byCode.values()];
  expect(all.some((s) => s.status === 'substitute')).toBe(true);
  expect(all.some((s) => s.intervalBounded === false)).toBe(true);
});

it('names the published run in the region answer', async () => {
  const list = await region(t.db);
  expect(list.run).toEqual(
    expect.objectContaining({
      id: runId,
      specName: expect.any(String),
      model: expect.objectContaining({ level: 0.95 }),
    }),
  );
});
