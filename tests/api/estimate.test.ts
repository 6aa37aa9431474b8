/**
 * POST /api/estimate: fitCurve over HTTP, checked against the R reference for panel A
 * (tests/fixtures/reference/panel-A: R 4.2.2 lm + sandwich::NeweyWest(lag = 3,
 * prewhite = FALSE, adjust = TRUE), see the README there), plus a demo-region district and
 * bad input.
 */
import fs from 'node:fs';
import type { Server } from 'node:http';
import path from 'node:path';
import request from 'supertest';
import type TestAgent from 'supertest/lib/agent';
import { WhatIfAnswerSchema } from '../../contracts/settings';
import { parseAnswer } from '../support/contract';
import { signedInApp, type SignedInApp } from '../support/signed-in-app';
import type { TestDatabase } from '../support/test-db';

const ref = path.join(__dirname, '..', 'fixtures', 'reference', 'panel-A');
const results = JSON.parse(fs.readFileSync(path.join(ref, 'panel_A_results.json'), 'utf8'));
const rowsOf = (code: string) =>
  fs
    .readFileSync(path.join(ref, 'panel_A.csv'), 'utf8')
    .trim()
    .split('\n')
    .slice(1)
    .map((l) => l.split(','))
    .filter((c) => c[0] === code)
    .map((c) => ({ year: Number(c[1]), y: Number(c[2]), x: Number(c[3]), controls: { pop_density: Number(c[4]) } }));

const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

let t: TestDatabase;
let server: Server;
let agent: TestAgent;
let env: SignedInApp;
beforeAll(async () => {
  env = await signedInApp({ as: 'official' });
  ({ t, server, agent } = env);
});
afterAll(async () => env.close());

describe('POST /api/estimate', () => {
  it('matches R for panel A district PA01 with Newey–West errors', async () => {
    const res = await agent
      .post('/api/estimate')
      .send({ model: { form: 'quadratic', transform: 'log', covariance: 'newey_west' }, rows: rowsOf('PA01') });
    expect(res.status).toBe(200);
    const fit = res.body.result;
    const r = results.districts.PA01;
    // Coefficients: R lm, relative 1e-8 (reference README tolerance).
    expect(rel(fit.coefficients[1], r.coefficients.ln_income)).toBeLessThan(1e-8);
    expect(rel(fit.coefficients[2], r.coefficients.ln_income_sq)).toBeLessThan(1e-8);
    // Newey–West SEs: sandwich::NeweyWest, relative 1e-6.
    expect(rel(fit.standardErrors[1], r.coef_inference.NeweyWest.se.ln_income)).toBeLessThan(1e-6);
    const tp = fit.turningPoints[0];
    const q = r.quadratic_inference.NeweyWest;
    expect(rel(tp.x, q.turning_point.log_scale_point)).toBeLessThan(1e-8);
    // Fieller with t(n − k): R's explicit formula in compute_reference.R, relative 1e-6.
    const fieller = q.fieller.find((f: { critical_value_kind: string }) => f.critical_value_kind === 't');
    expect(tp.fieller.kind).toBe('bounded');
    expect(rel(tp.fieller.lo, fieller.pieces_log_scale[0].lower)).toBeLessThan(1e-6);
    expect(rel(tp.fieller.hi, fieller.pieces_log_scale[0].upper)).toBeLessThan(1e-6);
    // Lind–Mehlum p (t reference), absolute 1e-8.
    expect(Math.abs(fit.uTest.pValue - q.lind_mehlum.p_value_t)).toBeLessThan(1e-8);
    expect(fit.shape.shape).toBe('inverted_u');
  });

  it('answers for a district of the demo region read from the database', async () => {
    const res = await agent.post('/api/estimate').send({
      model: { form: 'quadratic', transform: 'log', covariance: 'newey_west' },
      district: 'D01',
      controls: ['pop_density'],
    });
    expect(res.status).toBe(200);
    expect(parseAnswer(WhatIfAnswerSchema, res)).toMatchObject({ source: 'district', district: 'D01' });
    expect(res.body.result.status).toBe('ok');
    expect(res.body.result.n).toBe(31);
    expect(res.body.result.terms).toEqual(['const', 'x', 'x2', 'pop_density']);
  });

  it('names the row and the reason for bad input', async () => {
    const rows = rowsOf('PA02');
    rows[6] = { ...rows[6], x: -5 };
    const res = await agent
      .post('/api/estimate')
      .send({ model: { form: 'quadratic', transform: 'log', covariance: 'hc1' }, rows });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('non_positive_under_log');
    expect(res.body.error.details).toMatchObject({ row: 6, year: rows[6].year });
    expect(res.body.error.message).toMatch(/row 6/);
    const dup = await agent.post('/api/estimate').send({
      model: { form: 'quadratic', transform: 'log', covariance: 'hc1' },
      rows: [...rowsOf('PA02'), rowsOf('PA02')[0]],
    });
    expect(dup.status).toBe(400);
    expect(dup.body.error.code).toBe('duplicate_year');
    const schema = await agent.post('/api/estimate').send({ model: { form: 'quartic' }, rows: [] });
    expect(schema.status).toBe(400);
    expect(schema.body.error.code).toBe('invalid_request');
  });

  it('says not_estimable for too few rows', async () => {
    const res = await agent.post('/api/estimate').send({
      model: { form: 'quadratic', transform: 'log', covariance: 'classical' },
      rows: rowsOf('PA03').slice(0, 6),
    });
    expect(res.status).toBe(200);
    expect(res.body.result).toMatchObject({ status: 'not_estimable', reason: { code: 'too_few_rows' } });
  });

  it('needs a session', async () => {
    expect((await request(server).post('/api/estimate').send({})).status).toBe(401);
  });
});
