/**
 * Plumbing checks of the demo region's three pressures (invented data, not a correctness
 * reference): every district has CO2, PM2.5 and SO2 series; fitted with the demo's default
 * spec (log–quadratic, density as control, Newey–West, Fieller), the tracks disagree where
 * api/demo/pressures.ts says they should; the PM2.5 revision file moves one district across
 * its PM2.5 band and nothing else. The standings expected below are the demo's design
 * (pressures.ts), read with the product's own engine.
 */
import fs from 'node:fs';
import path from 'node:path';
import { DEMO_INDICATORS } from '../../api/demo/catalogue';
import { DEMO_DISTRICTS, generateDemoRegion, type DemoObservation } from '../../api/demo/generate';
import { fitPanel, ModelSpec, type FitPanelResult } from '../../api/estimation';
import { fitDistrict } from '../../api/runs/district-fit';
import type { EstimateRecord } from '../../api/runs/estimate-record';

const SPEC = ModelSpec.parse({
  form: 'quadratic',
  transform: 'log',
  covariance: 'newey_west',
  intervalMethod: 'fieller',
  levelControls: [],
  controls: ['pop_density'],
  level: 0.95,
  alpha: 0.05,
});

/** Every district's main estimate for one emissions indicator, as a run of the default spec fits it. */
function fitTrack(obs: DemoObservation[], indicator: string): Map<string, EstimateRecord> {
  const by = new Map<string, Map<number, Record<string, number>>>();
  for (const o of obs) {
    const years = by.get(o.districtCode) ?? new Map<number, Record<string, number>>();
    by.set(o.districtCode, years);
    const row = years.get(o.year) ?? {};
    years.set(o.year, row);
    row[o.indicator] = o.value;
  }
  const series = [...by.entries()].map(([code, m]) => {
    const years = [...m.keys()].sort((a, b) => a - b).filter((y) => m.get(y)![indicator] !== undefined);
    return {
      code,
      data: {
        years,
        x: years.map((y) => m.get(y)!.income_pc),
        y: years.map((y) => m.get(y)![indicator]),
        controls: { pop_density: years.map((y) => m.get(y)!.pop_density) },
        droppedYears: [],
      },
    };
  });
  const rows = series.flatMap((s) =>
    s.data.years.map((year, i) => ({
      district: s.code,
      year,
      y: s.data.y[i],
      x: s.data.x[i],
      controls: { pop_density: s.data.controls.pop_density[i] },
    })),
  );
  const pooled: FitPanelResult = fitPanel(rows, { ...SPEC, covariance: 'cluster', controls: ['pop_density'] });
  return new Map(
    series.map((s) => [s.code, fitDistrict({ spec: SPEC, controls: ['pop_density'] }, s.data, pooled)[0]]),
  );
}

const region = generateDemoRegion();
const co2 = fitTrack(region.observations, 'emissions_pc');
const pm25 = fitTrack(region.observations, 'pm25');
const so2 = fitTrack(region.observations, 'so2_pc');

it('gives every district a PM2.5 and an SO2 series next to CO2, with units, source and licence in the catalogue', () => {
  for (const d of DEMO_DISTRICTS) {
    for (const indicator of ['emissions_pc', 'pm25', 'so2_pc'] as const) {
      const n = region.observations.filter((o) => o.districtCode === d.code && o.indicator === indicator).length;
      expect({ code: d.code, indicator, some: n > 0 }).toEqual({ code: d.code, indicator, some: true });
    }
  }
  const units = Object.fromEntries(DEMO_INDICATORS.map((i) => [i.code, i.unit]));
  // The units: PM2.5 as a concentration in µg/m³, SO2 in kg per person.
  expect(units.pm25).toBe('µg/m³');
  expect(units.so2_pc).toBe('kg per person');
  for (const i of DEMO_INDICATORS) {
    expect(i.source).toBe('Demo region statistics office (invented)');
    expect(i.licence.length).toBeGreaterThan(10);
  }
});

it('leaves the CO2 series as they were (the other pressures draw from streams of their own)', () => {
  // Before PM2.5 and SO2 were added the generator wrote 2,776 values (24 districts × 4 series),
  // and D01's first year read as below (the generator at that commit, seed 20261201).
  const before = region.observations.filter((o) => o.indicator !== 'pm25' && o.indicator !== 'so2_pc');
  expect(before).toHaveLength(2776);
  expect(before.filter((o) => o.districtCode === 'D01' && o.year === 1995)).toEqual([
    { districtCode: 'D01', indicator: 'emissions_pc', year: 1995, value: 5.8634 },
    { districtCode: 'D01', indicator: 'income_pc', year: 1995, value: 8103 },
    { districtCode: 'D01', indicator: 'population', year: 1995, value: 701582 },
    { districtCode: 'D01', indicator: 'pop_density', year: 1995, value: 2081.48 },
  ]);
});

it('D13 is approaching for CO2 and past the turn for PM2.5', () => {
  expect(co2.get('D13')!.standing.standing).toBe('approaching');
  expect(co2.get('D13')!.status).toBe('ok');
  expect(pm25.get('D13')!.standing.standing).toBe('past_turn');
  expect(pm25.get('D13')!.status).toBe('ok');
});

it('D22 is past the turn for CO2 and at the turn for PM2.5', () => {
  expect(co2.get('D22')!.standing.standing).toBe('past_turn');
  expect(pm25.get('D22')!.standing.standing).toBe('at_turn');
});

it('D07 cannot be estimated on its own for SO2 (series from 2022) while CO2 and PM2.5 have their own curves', () => {
  const years = region.observations
    .filter((o) => o.districtCode === 'D07' && o.indicator === 'so2_pc')
    .map((o) => o.year);
  expect(Math.min(...years)).toBe(2022);
  const rec = so2.get('D07')!;
  expect(rec.status).toBe('substitute');
  expect(rec.reason?.code).toBe('too_few_rows');
  expect(co2.get('D07')!.status).toBe('ok');
  expect(pm25.get('D07')!.status).toBe('ok');
});

it('the PM2.5 revision file moves D22 from at the turn to past the turn, and no other PM2.5 standing', () => {
  const file = fs.readFileSync(
    path.join(__dirname, '..', '..', 'assets', 'demo-data', 'pm25-revision-2025.csv'),
    'utf8',
  );
  const revised = new Map<string, number>();
  const lines = file.trim().split('\n');
  expect(lines[0]).toBe('district_code,indicator,year,value');
  for (const line of lines.slice(1)) {
    const [code, indicator, year, value] = line.split(',');
    expect(indicator).toBe('pm25');
    revised.set(`${code}|${year}`, Number(value));
  }
  const after = fitTrack(
    region.observations.map((o) =>
      o.indicator === 'pm25' && revised.has(`${o.districtCode}|${o.year}`)
        ? { ...o, value: revised.get(`${o.districtCode}|${o.year}`)! }
        : o,
    ),
    'pm25',
  );
  const moved = [...pm25.keys()].filter(
    (code) => pm25.get(code)!.standing.standing !== after.get(code)!.standing.standing,
  );
  expect(moved).toEqual(['D22']);
  expect(after.get('D22')!.standing.standing).toBe('past_turn');
});
