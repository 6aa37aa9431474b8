/**
 * Caps on what one request may ask of the engine, and per-person limits on heavy routes:
 * /api/estimate takes at most 8 controls (a row's and the model's, as saved specs) and a
 * Newey–West lag of at most n − 1 (400 `lag_too_large`); a run's district too short for
 * the spec's lag is not_estimable with that reason (never clamped); compute routes answer
 * 429 `rate_limited` with Retry-After past 30 a minute or 2 at once per person.
 */
import { loadConfig } from '../../api/config';
import { fitDistrict } from '../../api/runs/district-fit';
import type { DistrictData } from '../../api/runs/estimate-record';
import { maximalEstimateBody } from '../support/maximal-estimate';
import { signedInApp, type SignedInApp } from '../support/signed-in-app';

jest.setTimeout(180_000);

let s: SignedInApp;
beforeAll(async () => {
  s = await signedInApp({ as: 'analyst' });
});
afterAll(async () => s?.close());

/** A small valid body: n rows, the given controls on every row. */
function smallBody(n: number, controls: string[], model: Record<string, unknown> = {}) {
  const rows = Array.from({ length: n }, (_, i) => ({
    year: 2000 + i,
    x: 10000 + 900 * i,
    y: 5 + 0.8 * i - 0.02 * i * i + 0.3 * Math.sin(i),
    controls: Object.fromEntries(controls.map((c, j) => [c, 2 + ((i * (j + 3)) % 7) + 0.1 * j])),
  }));
  return { model: { form: 'quadratic', transform: 'log', covariance: 'newey_west', ...model }, rows };
}
const names = (k: number) => Array.from({ length: k }, (_, j) => `c${j + 1}`);

describe('POST /api/estimate caps', () => {
  it('refuses a row with more than 8 controls, naming the row and field', async () => {
    const body = smallBody(30, names(9));
    const res = await s.agent.post('/api/estimate').send(body);
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/rows\.0\.controls: at most 8 controls a row/);
  });

  it('refuses model.controls longer than 8', async () => {
    const body = smallBody(30, names(8), { controls: names(9) });
    const res = await s.agent.post('/api/estimate').send(body);
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/model\.controls: Too big: expected array to have <=8 items/);
  });

  it('refuses a lag of n or more with lag_too_large, before fitting, and accepts n − 1', async () => {
    const res = await s.agent.post('/api/estimate').send(smallBody(30, [], { lag: 30 }));
    expect(res.status).toBe(400);
    // n − 1 = 29 is the largest lag with a weight left (Newey & West 1987: weights 1 − j/(L+1), j ≤ L < n).
    expect(res.body.error).toMatchObject({ code: 'lag_too_large', details: { lag: 30, n: 30, max: 29 } });
    const ok = await s.agent.post('/api/estimate').send(smallBody(30, [], { lag: 29 }));
    expect(ok.status).toBe(200);
    expect(ok.body.result.status).toBe('ok');
  });

  it('fits the maximal body (1,000 rows, 8 controls, lag 999) in the pool', async () => {
    const res = await s.agent.post('/api/estimate').send(maximalEstimateBody());
    expect(res.status).toBe(200);
    expect(res.body.result.status).toBe('ok');
    expect(res.body.result.n).toBe(1000);
  });
});

describe("a run's district too short for the spec's lag", () => {
  it('is not_estimable with lag_too_large in every variant, not clamped and not substituted', () => {
    const years = Array.from({ length: 14 }, (_, i) => 2010 + i);
    const data: DistrictData = {
      years,
      x: years.map((_, i) => 12000 + 800 * i),
      y: years.map((_, i) => 6 + 0.5 * i - 0.03 * i * i + 0.2 * Math.cos(i)),
      controls: {},
      droppedYears: [],
    };
    const spec = {
      form: 'quadratic',
      transform: 'log',
      covariance: 'newey_west',
      lag: 20,
      level: 0.95,
      alpha: 0.05,
      criticalValue: 't',
      intervalMethod: 'fieller',
      levelControls: [],
      trendYears: 10,
      clusterAdjustment: 'n_over_n_minus_k',
    } as const;
    const records = fitDistrict({ spec: { ...spec, levelControls: [] }, controls: [] }, data, null);
    for (const r of records) {
      expect(r.status).toBe('not_estimable');
      expect(r.reason?.code).toBe('lag_too_large');
      expect(r.reason?.message).toMatch(/14 years are too few for the spec's Newey–West lag of 20/);
    }
    // With a lag the series can carry (13 = n − 1), the same district fits.
    const fits = fitDistrict({ spec: { ...spec, lag: 13, levelControls: [] }, controls: [] }, data, null);
    expect(fits.find((r) => r.variant === 'main')!.status).toBe('ok');
  });
});

describe('per-person limits on compute routes', () => {
  it('answers 429 rate_limited with Retry-After past 2 heavy requests at once', async () => {
    const other = await signedInApp({ as: 'official' });
    try {
      const body = maximalEstimateBody(3);
      const answers = await Promise.all([1, 2, 3].map(() => other.agent.post('/api/estimate').send(body)));
      const statuses = answers.map((a) => a.status).sort();
      expect(statuses).toEqual([200, 200, 429]);
      const refused = answers.find((a) => a.status === 429)!;
      expect(refused.body.error.code).toBe('rate_limited');
      expect(refused.body.error.details.retryAfterSeconds).toBeGreaterThanOrEqual(1);
      expect(refused.headers['retry-after']).toBe(String(refused.body.error.details.retryAfterSeconds));
    } finally {
      await other.close();
    }
  });

  it('answers 429 past 30 compute requests a minute, shared across compute routes, per person', async () => {
    const other = await signedInApp({ as: 'official' });
    try {
      const small = smallBody(12, []);
      let used = 0;
      // Estimates and CSV exports count against one bucket ('compute').
      for (; used < 20; used++) expect((await other.agent.post('/api/estimate').send(small)).status).toBe(200);
      for (; used < 30; used++) expect((await other.agent.get('/api/districts/D01/observations.csv')).status).toBe(200);
      const refused = await other.agent.post('/api/estimate').send(small);
      expect(refused.status).toBe(429);
      expect(refused.body.error.code).toBe('rate_limited');
      const wait = refused.body.error.details.retryAfterSeconds;
      expect(wait).toBeGreaterThanOrEqual(1);
      expect(wait).toBeLessThanOrEqual(60);
      expect(refused.headers['retry-after']).toBe(String(wait));
      // Another person is not held back by this one's count; readers are not limited at all.
      expect((await s.agent.post('/api/estimate').send(small)).status).toBe(200);
      expect((await other.agent.get('/api/districts/D01')).status).toBe(200);
    } finally {
      await other.close();
    }
  });

  it('takes the per-minute figure from COMPUTE_RATE_LIMIT_PER_MINUTE', async () => {
    expect(loadConfig({ CRESTWATCH_MODE: 'test' }).computeRequestsPerMinute).toBe(30);
    expect(loadConfig({ CRESTWATCH_MODE: 'test', COMPUTE_RATE_LIMIT_PER_MINUTE: '3' }).computeRequestsPerMinute).toBe(
      3,
    );
    expect(() => loadConfig({ CRESTWATCH_MODE: 'test', COMPUTE_RATE_LIMIT_PER_MINUTE: '0' })).toThrow(
      /COMPUTE_RATE_LIMIT_PER_MINUTE must be a positive integer/,
    );
    const other = await signedInApp({ as: 'official', config: { computeRequestsPerMinute: 3 } });
    try {
      for (let i = 0; i < 3; i++)
        expect((await other.agent.get('/api/districts/D01/observations.csv')).status).toBe(200);
      expect((await other.agent.get('/api/districts/D01/observations.csv')).status).toBe(429);
    } finally {
      await other.close();
    }
  });

  it('declares the limit in the route table for estimate, briefs, exports and reproduce', () => {
    const limited = s.app.locals.routes
      .filter((r) => r.rateLimit)
      .map((r) => `${r.method} ${r.path}`)
      .sort();
    expect(limited).toEqual(
      [
        'get /api/briefs/district/:code',
        'get /api/briefs/district/:code.pdf',
        'get /api/briefs/district/:code/summary.pdf',
        'get /api/briefs/region',
        'get /api/briefs/region.pdf',
        'get /api/districts/:code/observations.csv',
        'get /api/runs/:id/export.csv',
        'post /api/estimate',
        'post /api/runs/:id/reproduce',
      ].sort(),
    );
    for (const r of s.app.locals.routes.filter((x) => x.rateLimit))
      expect(r.rateLimit).toEqual({ bucket: 'compute', perMinute: 30, inFlight: 2 });
  });
});
