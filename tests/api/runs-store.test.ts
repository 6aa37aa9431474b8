/**
 * The write path of a run: estimates written with COPY (text escaping, idempotent
 * rewrite of a retried chunk), compact records, and the series a chunk job carries.
 * Invented records and series; each expectation is the input given back unchanged
 * (plumbing checks), or the field list of estimate-record.ts.
 */
import { createComputePool } from '../../api/compute/pool';
import { seedDemoIfEmpty } from '../../api/demo/seed';
import { currentDataVersion, loadSeries, packSeries, unpackSeries } from '../../api/runs/data-store';
import { fitDistrict } from '../../api/runs/district-fit';
import type { EstimateRecord } from '../../api/runs/estimate-record';
import { fitPooled } from '../../api/runs/jobs';
import * as store from '../../api/runs/store';
import { loadConfig } from '../../api/config';
import type { Jobs } from '../../api/jobs/boss';
import { createMailer } from '../../api/mail/mailer';
import { startRun } from '../../api/runs/service';
import { testJobs } from '../support/jobs';
import { freshDatabase, type TestDatabase } from '../support/test-db';

jest.setTimeout(60_000);

let t: TestDatabase;
let jobs: Jobs;
let runId: number;
let runSpec: store.RunSpec;

beforeAll(async () => {
  t = await freshDatabase();
  await seedDemoIfEmpty(t.db);
  // A queued run of the default spec (no worker picks it up here).
  const config = loadConfig({ CRESTWATCH_MODE: 'test' });
  jobs = await testJobs(t.url);
  const run = await startRun(
    { db: t.db, config, log: () => {}, mailer: createMailer(config), jobs, compute: createComputePool(0) },
    null,
    {},
  );
  runId = run.id;
  runSpec = run.spec;
});
afterAll(async () => {
  await jobs?.stop();
  await t.drop();
});

async function fittedRows() {
  const series = await loadSeries(t.db, await currentDataVersion(t.db), runSpec.selection);
  const pooled = fitPooled(series, runSpec);
  const ok = pooled.status === 'ok' ? (pooled as Exclude<typeof pooled, { status: 'failed' }>) : null;
  return series.slice(0, 3).flatMap((s) =>
    fitDistrict({ spec: runSpec.model, controls: runSpec.selection.controls }, s.data, ok as never).map((record) => ({
      districtId: s.districtId,
      record,
    })),
  );
}

const stored = async () =>
  (await t
    .db('run_estimates')
    .where({ run_id: runId })
    .orderBy(['district_id', 'variant'])
    .select('district_id', 'variant', 'standing', 'threshold', 'result')) as {
    district_id: number;
    variant: string;
    standing: string;
    threshold: number | null;
    result: EstimateRecord;
  }[];

describe('writeEstimates', () => {
  it('stores every record as given, through COPY text escaping', async () => {
    const rows = await fittedRows();
    // A message with every character COPY's text format escapes, and JSON's own escapes.
    const tricky = 'tab\there, line\nbreak, return\r, back\\slash, "quoted", \\N and \\t as text';
    rows[0].record = { ...rows[0].record, reason: { code: 'too_few_rows', message: tricky } };
    await t.db.transaction((trx) => store.writeEstimates(trx, runId, rows));
    const back = await stored();
    expect(back).toHaveLength(rows.length);
    const byKey = new Map(back.map((r) => [`${r.district_id}|${r.variant}`, r]));
    for (const { districtId, record } of rows) {
      const r = byKey.get(`${districtId}|${record.variant}`)!;
      expect(r.result).toEqual(JSON.parse(JSON.stringify(record)));
      expect(r.standing).toBe(record.standing.standing);
      expect(r.threshold === null ? null : Number(r.threshold)).toBe(record.threshold?.level ?? null);
    }
    expect(byKey.get(`${rows[0].districtId}|${rows[0].record.variant}`)!.result.reason!.message).toBe(tricky);
  });

  it('rewrites a retried chunk instead of adding to it', async () => {
    const rows = await fittedRows();
    const changed = rows.map((r) => ({ ...r, record: { ...r.record, gapPercent: 12.5 } }));
    await t.db.transaction((trx) => store.writeEstimates(trx, runId, changed));
    const back = await stored();
    expect(back).toHaveLength(rows.length);
    expect(back.every((r) => r.result.gapPercent === 12.5)).toBe(true);
  });
});

describe('writeEstimatesText', () => {
  it('stores what a pool thread made of the fits exactly as writeEstimates stores the records', async () => {
    const rows = await fittedRows();
    await t.db.transaction((trx) => store.writeEstimates(trx, runId, rows));
    const direct = await stored();
    // The same districts fitted in two pool threads, as the run's chunks do, two slices
    // streamed into one COPY in order; a slice that is still fitting is awaited.
    const pool = createComputePool(2);
    try {
      const series = (await loadSeries(t.db, await currentDataVersion(t.db), runSpec.selection)).slice(0, 3);
      const model = { spec: runSpec.model, controls: runSpec.selection.controls };
      const pooledFit = fitPooled(await loadSeries(t.db, await currentDataVersion(t.db), runSpec.selection), runSpec);
      const pooled = pooledFit.status === 'ok' ? (pooledFit as Exclude<typeof pooledFit, { status: 'failed' }>) : null;
      const parts = [series.slice(0, 1), series.slice(1)].map((part) =>
        pool.run({
          kind: 'district-fits-copy',
          runId,
          model,
          districts: part.map((s) => ({ districtId: s.districtId, data: s.data })),
          pooled,
        }),
      );
      await t.db.transaction((trx) =>
        store.writeEstimatesText(
          trx,
          runId,
          series.map((s) => s.districtId),
          parts,
        ),
      );
    } finally {
      await pool.close();
    }
    const viaPool = await stored();
    expect(viaPool).toHaveLength(direct.length);
    expect(viaPool).toEqual(direct);
  });

  it('rolls the chunk back when a slice fails, leaving the rows it had', async () => {
    const before = await stored();
    const failing = Promise.reject(new Error('slice failed'));
    failing.catch(() => {});
    await expect(
      t.db.transaction((trx) =>
        store.writeEstimatesText(
          trx,
          runId,
          before.map((r) => r.district_id),
          [Promise.resolve(''), failing],
        ),
      ),
    ).rejects.toThrow('slice failed');
    expect(await stored()).toEqual(before);
  });
});

describe('loadSeries', () => {
  it('keeps a year only when every selected indicator has a value, and lists the others as dropped', async () => {
    const sel = runSpec.selection;
    const all = await loadSeries(t.db, await currentDataVersion(t.db), sel);
    const d = all[0];
    const year = d.data.years[1];
    const control = await t.db('indicators').where({ code: sel.controls[0] }).first('id');
    // One control value removed in a transaction that is rolled back: that year drops.
    await t.db
      .transaction(async (trx) => {
        await trx('observations').where({ district_id: d.districtId, indicator_id: control.id, year }).del();
        const [after] = await loadSeries(trx, await currentDataVersion(trx), sel, [d.districtId]);
        expect(after.data.years).toEqual(d.data.years.filter((y) => y !== year));
        expect(after.data.droppedYears).toEqual([...d.data.droppedYears, year].sort((a, b) => a - b));
        const i = d.data.years.indexOf(year);
        const drop = <T>(v: T[]) => v.filter((_x, j) => j !== i);
        expect(after.data.y).toEqual(drop(d.data.y));
        expect(after.data.x).toEqual(drop(d.data.x));
        expect(after.data.controls[sel.controls[0]]).toEqual(drop(d.data.controls[sel.controls[0]]));
        throw new Error('roll back');
      })
      .catch((err: Error) => {
        if (err.message !== 'roll back') throw err;
      });
    // The selection in district-code order, one series per district with values.
    const codes = all.map((s) => s.code);
    expect(codes).toEqual([...codes].sort());
  });
});

describe('compact records', () => {
  it('leave out what no reader reads, and variants keep only their summaries', async () => {
    const rows = await fittedRows();
    for (const { record } of rows) {
      // Fields dropped from every record (estimate-record.ts).
      for (const k of ['standardErrors', 'pValues', 'residualStandardError']) expect(record).not.toHaveProperty(k);
      if (record.variant === 'main') continue;
      expect(record).toMatchObject({
        terms: [],
        coefficients: [],
        rSquared: null,
        turningPoints: [],
        uTest: null,
        wald: null,
        elasticity: null,
        trendPerYear: null,
        points: [],
        curve: [],
        pooledCurve: [],
        diagnostics: null,
      });
    }
    const main = rows.find((r) => r.record.variant === 'main' && r.record.status === 'ok')!.record;
    expect(main.coefficients.length).toBeGreaterThan(0);
    expect(main.points.length).toBe(main.n);
  });
});

describe('packSeries / unpackSeries', () => {
  it('give back the exact series, controls and dropped years', async () => {
    const series = await loadSeries(t.db, await currentDataVersion(t.db), runSpec.selection);
    expect(series.length).toBeGreaterThan(20); // the demo region's 24 districts
    // An invented district with a dropped year and awkward doubles.
    const c = runSpec.selection.controls[0];
    series.push({
      districtId: 999,
      code: 'ZZ9',
      name: 'Invented',
      data: {
        years: [2000, 2002],
        x: [0.1 + 0.2, 1e-300],
        y: [Math.PI, -0],
        controls: { [c]: [5e-324, 1.7976931348623157e308] },
        droppedYears: [2001],
      },
    });
    const packed = JSON.parse(JSON.stringify(packSeries(series, runSpec.selection.controls)));
    expect(unpackSeries(packed, runSpec.selection.controls)).toEqual(series);
  });
});
