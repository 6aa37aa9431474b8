/**
 * Subscriptions (district codes looked up once, through the districts service; the signed
 * unsubscribe link) and the named advisory locks (the default spec no longer waits on the
 * observations lock an upload holds).
 */
import type { Server } from 'node:http';
import request from 'supertest';
import type TestAgent from 'supertest/lib/agent';
import { loadConfig } from '../../api/config';
import { LOCKS, lockForTransaction } from '../../api/db/locks';
import { unsubscribeUrl } from '../../api/subscriptions/service';
import { DEMO, signInAs } from '../support/auth';
import { signedInApp, type SignedInApp } from '../support/signed-in-app';
import type { TestDatabase } from '../support/test-db';

let env: SignedInApp;
let t: TestDatabase;
let server: Server;
let official: TestAgent;
beforeAll(async () => {
  env = await signedInApp({ as: 'official' });
  ({ t, server, agent: official } = env);
});
afterAll(async () => env.close());

describe('subscriptions', () => {
  it('refuses unknown district codes, naming every one, and stores nothing', async () => {
    const res = await official
      .post('/api/subscriptions')
      .send({ scope: 'districts', districtCodes: ['D01', 'NOPE', 'ZZ9'], delivery: 'digest' });
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('not_found');
    expect(res.body.error.message).toBe('No district with code NOPE, ZZ9');
    expect(res.body.error.details).toEqual({ missing: ['NOPE', 'ZZ9'] });
    expect((await official.get('/api/subscriptions')).body.subscriptions).toEqual([]);
  });

  it('keeps each named district once', async () => {
    const res = await official
      .post('/api/subscriptions')
      .send({ scope: 'districts', districtCodes: ['D02', 'D01', 'D02'], delivery: 'digest' });
    expect(res.status).toBe(201);
    expect(res.body.subscription.districtCodes).toEqual(['D01', 'D02']);
    expect((await official.delete(`/api/subscriptions/${res.body.subscription.id}`)).status).toBe(204);
  });

  it('ends a subscription through the signed e-mail link, without signing in, once', async () => {
    const created = await official.post('/api/subscriptions').send({ scope: 'region', delivery: 'instant' });
    expect(created.status).toBe(201);
    // The same secret the test app runs with (test mode's default).
    const url = new URL(
      unsubscribeUrl(
        { publicUrl: 'http://127.0.0.1', sessionSecret: loadConfig({ CRESTWATCH_MODE: 'test' }).sessionSecret },
        created.body.subscription.id,
      ),
    );
    const token = url.searchParams.get('token')!;
    const anonymous = request(server);
    const page = await anonymous.get(`${url.pathname}${url.search}`);
    expect(page.status).toBe(200);
    expect(page.type).toBe('text/html');
    const first = await anonymous.post('/api/subscriptions/unsubscribe').type('form').send({ token });
    expect(first.status).toBe(200);
    expect(first.text).toContain('You will get no more e-mails from this subscription.');
    expect((await official.get('/api/subscriptions')).body.subscriptions).toEqual([]);
    const again = await anonymous.post('/api/subscriptions/unsubscribe').type('form').send({ token });
    expect(again.status).toBe(200);
    expect(again.text).toContain('This subscription had already been removed.');
    const forged = await anonymous
      .post('/api/subscriptions/unsubscribe')
      .type('form')
      .send({ token: `${token}x` });
    expect(forged.status).toBe(400);
  });
});

describe('advisory locks', () => {
  it('gives every named lock its own id', () => {
    const ids = Object.values(LOCKS);
    expect(new Set(ids).size).toBe(ids.length);
  });

  it('saves the starting spec and the first track while an upload holds the observations lock', async () => {
    const analyst = (await signInAs(server, DEMO.analyst)).agent;
    const [{ count }] = await t.db('model_specs').count<{ count: string }[]>({ count: '*' });
    expect(Number(count)).toBe(0); // a fresh database: the track list below must save the starting spec
    const upload = await t.db.transaction();
    try {
      await lockForTransaction(upload, 'observations');
      const timedOut = new Promise<'timed out'>((resolve) => setTimeout(() => resolve('timed out'), 15_000).unref());
      const res = await Promise.race([analyst.get('/api/tracks'), timedOut]);
      expect(res).not.toBe('timed out');
      if (res === 'timed out') return;
      expect(res.status).toBe(200);
      expect(res.body.tracks).toHaveLength(1);
      const specs = await Promise.race([analyst.get('/api/specs'), timedOut]);
      if (specs === 'timed out') throw new Error('the spec list waited on the upload');
      expect(specs.body.specs.map((s: { id: number }) => s.id)).toEqual([specs.body.headlineSpecId]);
      expect(specs.body.specs[0].tracks).toEqual([res.body.tracks[0].name]);
    } finally {
      await upload.rollback();
    }
  });
});
