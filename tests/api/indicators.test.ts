/**
 * The indicator catalogue and derived series (plumbing checks over the invented demo
 * region: expected values are the same divisions done in JavaScript on the same doubles).
 */
import { DEMO_INDICATORS } from '../../api/demo/catalogue';
import { IndicatorsResponseSchema } from '../../contracts/settings';
import { parseAnswer } from '../support/contract';
import { storedValue, upload, uploadWorld, type UploadWorld } from './upload-helpers';

let w: UploadWorld;
beforeAll(async () => {
  w = await uploadWorld();
});
afterAll(async () => w.close());

const post = (body: object) => w.analyst.post('/api/indicators').send(body);

describe('indicator catalogue', () => {
  it('lists the demo catalogue with how much data each indicator has', async () => {
    const res = await w.official.get('/api/indicators');
    expect(res.status).toBe(200);
    const { indicators } = parseAnswer(IndicatorsResponseSchema, res);
    expect(indicators.map((i) => i.code)).toEqual(DEMO_INDICATORS.map((i) => i.code));
    const e = indicators[0];
    expect(e).toMatchObject({
      code: 'emissions_pc',
      mustBePositive: true,
      derivation: null,
      stats: { districts: 24, firstYear: 1995, lastYear: 2025 },
    });
  });

  it('lets analysts add and change indicators, not officials', async () => {
    const denied = await w.official.post('/api/indicators').send({ code: 'x_any', name: 'X', unit: 'u' });
    expect(denied.status).toBe(403);
    const made = await post({ code: 'co2_total', name: 'CO2 emissions', unit: 't CO2', mustBePositive: true });
    expect(made.status).toBe(201);
    expect(made.body).toMatchObject({
      indicator: { code: 'co2_total', derivation: null, stats: { values: 0 } },
      recomputed: null,
    });
    expect((await post({ code: 'co2_total', name: 'again', unit: 't' })).body.error.code).toBe('indicator_exists');
    const renamed = await w.analyst
      .patch('/api/indicators/co2_total')
      .send({ description: 'Territorial emissions, all sectors.' });
    expect(renamed.status).toBe(200);
    expect(renamed.body.indicator.description).toBe('Territorial emissions, all sectors.');
  });

  it('records who publishes a series and under which terms, editable, blank clearing it', async () => {
    const listed = parseAnswer(IndicatorsResponseSchema, await w.official.get('/api/indicators'));
    // The demo catalogue's invented source and licence (api/demo/catalogue.ts).
    expect(listed.indicators.find((i) => i.code === 'pm25')).toMatchObject({
      unit: 'µg/m³',
      source: 'Demo region statistics office (invented)',
      licence: 'Invented demonstration data: free to copy and change, describes no real place',
    });
    const made = await post({
      code: 'nox_pc',
      name: 'NOx emissions per person',
      unit: 'kg per person',
      source: '  Regional air office  ',
      licence: 'CC BY 4.0',
    });
    expect(made.status).toBe(201);
    expect(made.body.indicator).toMatchObject({ source: 'Regional air office', licence: 'CC BY 4.0' });
    const changed = await w.analyst.patch('/api/indicators/nox_pc').send({ licence: 'Open Government Licence' });
    expect(changed.body.indicator).toMatchObject({ source: 'Regional air office', licence: 'Open Government Licence' });
    const cleared = await w.analyst.patch('/api/indicators/nox_pc').send({ source: '' });
    expect(cleared.body.indicator).toMatchObject({ source: null, licence: 'Open Government Licence' });
    const tooLong = await w.analyst.patch('/api/indicators/nox_pc').send({ source: 'x'.repeat(301) });
    expect(tooLong.status).toBe(400);
    expect(JSON.stringify(tooLong.body.error)).toContain('source is at most 300 characters');
    expect((await w.official.patch('/api/indicators/nox_pc').send({ source: 'me' })).status).toBe(403);
  });

  it('refuses derivations that cannot hold', async () => {
    await post({ code: 'net_flow', name: 'Net flow', unit: 'units', mustBePositive: false });
    const notPositive = await post({
      code: 'bad_ratio',
      name: 'Bad',
      unit: 'u',
      derivation: { kind: 'per_person', source: 'co2_total', divisor: 'net_flow' },
    });
    expect(notPositive.status).toBe(422);
    expect(notPositive.body.error.message).toMatch(/net_flow must be a positive-only indicator/);
    const missing = await post({
      code: 'bad_ratio',
      name: 'Bad',
      unit: 'u',
      derivation: { kind: 'per_person', source: 'nothing_here', divisor: 'population' },
    });
    expect(missing.body.error).toMatchObject({ code: 'bad_derivation', details: { missing: ['nothing_here'] } });
    const typed = await w.analyst
      .patch('/api/indicators/emissions_pc')
      .send({ derivation: { kind: 'per_person', source: 'co2_total', divisor: 'population' } });
    expect(typed.status).toBe(409);
    expect(typed.body.error.code).toBe('has_uploaded_values');
  });
});

describe('derived series computed on load', () => {
  let perPersonUpload: number;
  it('computes per-person values from an uploaded total and the stored population', async () => {
    const made = await post({
      code: 'co2_pc_derived',
      name: 'CO2 per person (derived)',
      unit: 't CO2 per person',
      mustBePositive: true,
      derivation: { kind: 'per_person', source: 'co2_total', divisor: 'population' },
    });
    expect(made.status).toBe(201);
    expect(made.body.indicator.derivation).toMatchObject({
      kind: 'per_person',
      source: 'co2_total',
      divisor: 'population',
      formula: 'co2_total ÷ population',
    });
    const csv =
      'district_code,indicator,year,value\nD01,co2_total,2020,812345.5\nD01,co2_total,2021,798000\nD01,co2_total,2022,790100.25\n';
    const res = await upload(w.analyst, csv, 'co2.csv', { commit: true });
    expect(res.status).toBe(201);
    perPersonUpload = res.body.upload.id;
    expect(res.body.preview.derived).toEqual([{ indicator: 'co2_pc_derived', insert: 3, change: 0, remove: 0 }]);
    for (const [year, total] of [
      [2020, 812345.5],
      [2021, 798000],
      [2022, 790100.25],
    ]) {
      const pop = await storedValue(w.t.db, 'D01', 'population', year);
      expect(await storedValue(w.t.db, 'D01', 'co2_pc_derived', year)).toBe(total / pop!);
    }
  });

  it('recomputes a derived value when a source is revised, and refuses to take the derived series as input', async () => {
    const pop = await storedValue(w.t.db, 'D01', 'population', 2021);
    const res = await upload(
      w.analyst,
      `district_code,indicator,year,value\nD01,population,2021,${pop! + 500}\n`,
      'pop.csv',
      { commit: true },
    );
    expect(res.status).toBe(201);
    expect(res.body.preview.derived).toEqual([{ indicator: 'co2_pc_derived', insert: 0, change: 1, remove: 0 }]);
    expect(await storedValue(w.t.db, 'D01', 'co2_pc_derived', 2021)).toBe(798000 / (pop! + 500));
    const typed = await upload(
      w.analyst,
      'district_code,indicator,year,value\nD01,co2_pc_derived,2019,9.5\n',
      'typed.csv',
    );
    expect(typed.status).toBe(422);
    expect(typed.body.error.details.problems[0]).toMatchObject({ line: 2, column: 2, code: 'derived_indicator' });
    // Revert the revision first (it changed a derived value the first upload wrote), then the first one.
    const conflict = await w.analyst.post(`/api/uploads/${perPersonUpload}/revert`);
    expect(conflict.status).toBe(409);
    expect((await w.analyst.post(`/api/uploads/${res.body.upload.id}/revert`)).status).toBe(200);
    expect(await storedValue(w.t.db, 'D01', 'co2_pc_derived', 2021)).toBe(798000 / pop!);
    const reverted = await w.analyst.post(`/api/uploads/${perPersonUpload}/revert`);
    expect(reverted.status).toBe(200);
    expect(await storedValue(w.t.db, 'D01', 'co2_pc_derived', 2020)).toBeNull();
    expect(await storedValue(w.t.db, 'D01', 'co2_total', 2020)).toBeNull();
  });

  it('computes real values from nominal ones and a price index with its base year', async () => {
    await post({
      code: 'income_nominal',
      name: 'Income per person, current prices',
      unit: 'currency units per person',
      mustBePositive: true,
    });
    await post({ code: 'price_index', name: 'Consumer price index', unit: 'index, 2020 = 100', mustBePositive: true });
    const csv =
      'district_code,year,income_nominal,price_index\nD02,2019,30500,97.2\nD02,2020,31800,100\nD02,2021,33900,104.1\n';
    expect((await upload(w.analyst, csv, 'nominal.csv', { commit: true })).status).toBe(201);
    // Defined after the sources are in: the series is computed at once, as a change set of its own.
    const made = await post({
      code: 'income_real',
      name: 'Real income per person',
      unit: '2020 currency units per person',
      mustBePositive: true,
      derivation: { kind: 'real_from_nominal', source: 'income_nominal', divisor: 'price_index', baseYear: 2020 },
    });
    expect(made.status).toBe(201);
    expect(made.body.recomputed).toMatchObject({
      kind: 'derivation',
      status: 'committed',
      counts: { insert: 3 },
      canRevert: true,
    });
    expect(made.body.indicator.derivation.formula).toBe(
      'income_nominal ÷ price_index × 100 (price_index = 100 in 2020)',
    );
    expect(await storedValue(w.t.db, 'D02', 'income_real', 2021)).toBe((33900 / 104.1) * 100);
    expect(await storedValue(w.t.db, 'D02', 'income_real', 2020)).toBe(31800);
    // Changing the base year recomputes nothing here (the formula does not use it) but is kept.
    const patched = await w.analyst.patch('/api/indicators/income_real').send({
      derivation: { kind: 'real_from_nominal', source: 'income_nominal', divisor: 'price_index', baseYear: 2015 },
    });
    expect(patched.status).toBe(200);
    expect(patched.body).toMatchObject({ recomputed: null, indicator: { derivation: { baseYear: 2015 } } });
    const undo = await w.analyst.post(`/api/uploads/${made.body.recomputed.id}/revert`);
    expect(undo.status).toBe(200);
    expect(await storedValue(w.t.db, 'D02', 'income_real', 2021)).toBeNull();
  });
});
