import type { Server } from 'node:http';
import request from 'supertest';
import type TestAgent from 'supertest/lib/agent';
import { DEMO_DISTRICTS, generateDemoRegion } from '../../api/demo/generate';
import { seedDemoIfEmpty } from '../../api/demo/seed';
import { DistrictDetailResponseSchema, DistrictListResponseSchema } from '../../contracts/districts';
import { parseAnswer } from '../support/contract';
import { signedInApp, type SignedInApp } from '../support/signed-in-app';
import type { TestDatabase } from '../support/test-db';

let t: TestDatabase;
let server: Server;
let agent: TestAgent;
let env: SignedInApp;
beforeAll(async () => {
  env = await signedInApp({ as: 'official' });
  ({ t, server, agent } = env);
});
afterAll(async () => env.close());

describe('districts API over the seeded demo region', () => {
  it('lists every district sorted by name, with its code and name only (what the search needs)', async () => {
    const res = await agent.get('/api/districts');
    expect(res.status).toBe(200);
    const list = parseAnswer(DistrictListResponseSchema, res).districts;
    expect(list).toHaveLength(DEMO_DISTRICTS.length);
    const names = list.map((d) => d.name);
    expect(names).toEqual([...names].sort((a, b) => a.localeCompare(b, 'en')));
    for (const row of res.body.districts) expect(Object.keys(row).sort()).toEqual(['code', 'name']);
    expect(list.find((d) => d.code === 'D01')?.name).toBe(DEMO_DISTRICTS.find((d) => d.code === 'D01')?.name);
  });

  it("gives a district's span and latest values with the district itself", async () => {
    const d01 = parseAnswer(DistrictDetailResponseSchema, await agent.get('/api/districts/D01'));
    expect(d01.district).toMatchObject({ firstYear: 1995, lastYear: 2025, nYears: 31 });
    const expected = generateDemoRegion().observations.find(
      (o) => o.districtCode === 'D01' && o.year === 2025 && o.indicator === 'income_pc',
    )!;
    expect(d01.series.find((r) => r.year === 2025)?.incomePc).toBe(expected.value);
  });

  it('returns a district series with gap years present as nulls', async () => {
    const res = await agent.get('/api/districts/D09');
    expect(res.status).toBe(200);
    const body = parseAnswer(DistrictDetailResponseSchema, res);
    expect(body.district).toMatchObject({ code: 'D09', firstYear: 1995, lastYear: 2025, nYears: 30 });
    expect(body.series).toHaveLength(31);
    const gap = body.series.find((r) => r.year === 2008);
    expect(gap).toEqual({ year: 2008, emissionsPc: null, incomePc: null, population: null, popDensity: null });
    expect(body.indicators.map((i) => i.code)).toEqual(['emissions_pc', 'income_pc', 'population', 'pop_density']);
  });

  it('keeps non-Latin names intact', async () => {
    const res = await agent.get('/api/districts/D24');
    expect(res.body.district.name).toBe('Yarrowgate (Jarłowo-Şelé / Жарово)');
  });

  it('refuses anonymous callers', async () => {
    expect((await request(server).get('/api/districts')).status).toBe(401);
  });

  it('answers an unknown code with 404 and a bad code with 400', async () => {
    const missing = await agent.get('/api/districts/ZZ99');
    expect(missing.status).toBe(404);
    expect(missing.body.error).toMatchObject({ code: 'not_found', details: { code: 'ZZ99' } });
    const bad = await agent.get('/api/districts/%3Cscript%3E');
    expect(bad.status).toBe(400);
    expect(bad.body.error.code).toBe('invalid_request');
  });

  it('seeding again leaves existing data alone', async () => {
    const before = await t.db('observations').count<{ count: string }[]>({ count: '*' });
    const r = await seedDemoIfEmpty(t.db);
    expect(r.seeded).toBe(false);
    const after = await t.db('observations').count<{ count: string }[]>({ count: '*' });
    expect(after[0].count).toBe(before[0].count);
  });
});
