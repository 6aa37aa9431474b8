import request from 'supertest';
import { createDb } from '../../api/db';
import { databaseIsUp, PROBE_MS } from '../../api/health/service';
import { HealthResponseSchema } from '../../contracts/districts';
import { parseAnswer } from '../support/contract';
import { freshDatabase, type TestDatabase } from '../support/test-db';
import { testApp } from '../support/test-app';

let t: TestDatabase;
beforeAll(async () => {
  t = await freshDatabase();
});
afterAll(async () => t.drop());

describe('GET /api/health', () => {
  it('reports the database as up when it answers', async () => {
    const res = await request(testApp(t.db)).get('/api/health');
    expect(res.status).toBe(200);
    expect(parseAnswer(HealthResponseSchema, res)).toEqual({ status: 'ok', database: 'up' });
  });

  it('reports the database as down (503) when it does not answer', async () => {
    // Port 1 on loopback: nothing listens there, so the query fails fast.
    const dead = createDb('postgres://postgres@127.0.0.1:1/none', { pool: { min: 0, max: 1 }, quiet: true });
    try {
      const res = await request(testApp(dead)).get('/api/health');
      expect(res.status).toBe(503);
      expect(res.body).toEqual({ status: 'degraded', database: 'down' });
    } finally {
      await dead.destroy();
    }
  });

  it('asks the database at most once a second, sharing one probe among callers', async () => {
    const db = createDb(t.url, { pool: { min: 0, max: 2 }, quiet: true });
    let queries = 0;
    db.on('query', () => queries++);
    try {
      const now = 1_000_000;
      expect(await Promise.all([databaseIsUp(db, now), databaseIsUp(db, now), databaseIsUp(db, now + 10)])).toEqual([
        true,
        true,
        true,
      ]);
      expect(await databaseIsUp(db, now + PROBE_MS - 1)).toBe(true);
      expect(queries).toBe(1);
      expect(await databaseIsUp(db, now + PROBE_MS)).toBe(true);
      expect(queries).toBe(2);
    } finally {
      await db.destroy();
    }
  });

  it('answers unknown API paths with the one error shape', async () => {
    const res = await request(testApp(t.db)).get('/api/no-such-thing');
    expect(res.status).toBe(404);
    expect(res.body.error).toMatchObject({ code: 'not_found' });
    expect(typeof res.body.error.message).toBe('string');
  });

  it('refuses malformed JSON with a 400 in the error shape', async () => {
    const res = await request(testApp(t.db))
      .post('/api/districts')
      .set('content-type', 'application/json')
      .send('{"a":');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('malformed_json');
  });

  it('sends security headers (helmet)', async () => {
    const res = await request(testApp(t.db)).get('/api/health');
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['content-security-policy']).toContain("default-src 'self'");
    expect(res.headers['x-powered-by']).toBeUndefined();
  });
});

describe('GET /api/openapi.json', () => {
  it('documents every route of the route table', async () => {
    const res = await request(testApp(t.db)).get('/api/openapi.json');
    expect(res.status).toBe(200);
    expect(res.body.openapi).toBe('3.1.0');
    expect(res.body.paths['/api/districts/{code}'].get.parameters).toEqual([
      expect.objectContaining({ name: 'code', in: 'path', required: true }),
    ]);
    expect(Object.keys(res.body.paths)).toEqual(
      expect.arrayContaining(['/api/health', '/api/districts', '/api/openapi.json']),
    );
  });
});
