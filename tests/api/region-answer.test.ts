/**
 * The region answer is compact: each district row carries what the region list, map and
 * counts show (standing and its marks, the gap, the crossing, the years of data) at the
 * precision they show it, and nothing only the card shows. The demo region, one published
 * run of the default spec (plumbing checks: the expected values are the full summaries).
 */
import type { Server } from 'node:http';
import type { CrestwatchApp } from '../../api/app';
import { seedDemoIfEmpty } from '../../api/demo/seed';
import { publishedSummaries } from '../../api/estimates/service';
import { ensureDemoAccounts } from '../../api/people/service';
import { RegionResponseSchema } from '../../contracts/estimates';
import { closeServer, DEMO, listen, signInAs } from '../support/auth';
import { parseAnswer } from '../support/contract';
import { publishDefaultRun } from '../support/published-run';
import { testApp } from '../support/test-app';
import { freshDatabase, type TestDatabase } from '../support/test-db';

jest.setTimeout(180_000);

let t: TestDatabase;
let app: CrestwatchApp;
let server: Server;

beforeAll(async () => {
  t = await freshDatabase();
  await seedDemoIfEmpty(t.db);
  await ensureDemoAccounts(t.db);
  app = testApp(t.db);
  await publishDefaultRun(app, t.url);
  server = await listen(app);
});
afterAll(async () => {
  await closeServer(server, app);
  await t.drop();
});

describe('GET /api/region rows', () => {
  it('carry only what the list, map and counts show, with the same words as the full figures', async () => {
    const official = (await signInAs(server, DEMO.official)).agent;
    const res = await official.get('/api/region');
    const region = parseAnswer(RegionResponseSchema, res);
    const full = (await publishedSummaries(t.db)).byCode;
    expect(region.districts.length).toBeGreaterThan(0);
    let estimated = 0;
    for (const row of res.body.districts) {
      expect(Object.keys(row).sort()).toEqual(['code', 'estimate', 'firstYear', 'lastYear', 'nYears', 'name']);
      const e = full.get(row.code);
      if (!e) {
        expect(row.estimate).toBeNull();
        continue;
      }
      estimated++;
      expect(Object.keys(row.estimate).sort()).toEqual([
        'crossingYear',
        'gapPercent',
        'intervalBounded',
        'projectionStatus',
        'shape',
        'standing',
        'status',
        'threshold',
      ]);
      expect(row.estimate).toMatchObject({
        status: e.status,
        standing: e.standing,
        intervalBounded: e.intervalBounded,
        shape: e.shape,
        crossingYear: e.crossingYear,
        projectionStatus: e.projectionStatus,
      });
      // Rounded to what the list shows (lib/estimate-words.ts gapShort): whole percent below
      // +200 %, above it a factor with one decimal (×3.4), i.e. tens of percent …
      if (e.gapPercent === null) expect(row.estimate.gapPercent).toBeNull();
      else if (Math.abs(e.gapPercent) < 200) expect(row.estimate.gapPercent).toBe(Math.round(e.gapPercent));
      else expect(Math.abs(row.estimate.gapPercent - e.gapPercent)).toBeLessThanOrEqual(5);
      // … and a threshold is there, and positive, exactly when it was (three significant digits).
      expect(row.estimate.threshold === null).toBe(e.threshold === null);
      if (e.threshold !== null) {
        expect(row.estimate.threshold > 0).toBe(e.threshold > 0);
        expect(Math.abs(row.estimate.threshold - e.threshold)).toBeLessThanOrEqual(Math.abs(e.threshold) * 0.005);
      }
    }
    expect(estimated).toBeGreaterThan(0);
    // The counts per standing are the rows' standings counted.
    const counted: Record<string, number> = {};
    for (const d of region.districts) {
      const s = d.estimate?.standing ?? 'not_estimable';
      counted[s] = (counted[s] ?? 0) + 1;
    }
    expect(region.counts).toEqual(counted);
  });
});
