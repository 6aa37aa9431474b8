/**
 * Item 7 of the hardening issue: sessions end when idle or too old and say why; the row is
 * written back at most once a minute; production cookies are Secure with the __Host-
 * prefix; TRUST_PROXY decides whose forwarded headers count.
 */
import type { Server } from 'node:http';
import request from 'supertest';
import type { CrestwatchApp } from '../../api/app';
import { sessionEnd } from '../../api/auth/session';
import { loadConfig, parseTrustProxy, type Config } from '../../api/config';
import { ensureDemoAccounts } from '../../api/people/service';
import {
  cachedSession,
  forgetSession,
  forgetSessionPerson,
  keepSession,
  PERSON_CACHE_MS,
} from '../../api/people/session-person';
import { closeServer, DEMO, listen, signInAs } from '../support/auth';
import { testApp } from '../support/test-app';
import { freshDatabase, type TestDatabase } from '../support/test-db';

jest.setTimeout(60_000);

const MIN = 60_000;
const HOUR = 3_600_000;
let t: TestDatabase;
let app: CrestwatchApp;
let server: Server;

beforeAll(async () => {
  t = await freshDatabase();
  await ensureDemoAccounts(t.db);
  app = testApp(t.db);
  server = await listen(app);
});
afterAll(async () => {
  await closeServer(server, app);
  await t.drop();
});

/** The one session row of a person (tests sign each person in once per check). */
async function sessionOf(userId: number): Promise<{ sid: string; sess: Record<string, unknown>; expire: Date }[]> {
  return t
    .db('session')
    .whereRaw(`sess->'passport'->>'user' = ?`, [String(userId)])
    .select('sid', 'sess', 'expire');
}

/**
 * Moves a session's clock back: the stored timestamps, since PostgreSQL's clock cannot be
 * moved. The row is changed behind the server's back, as by another process, so the
 * server's copy is dropped too, as PERSON_CACHE_MS later.
 */
async function age(sid: string, field: 'createdAt' | 'lastSeenAt', byMs: number): Promise<void> {
  await t.db.raw(
    `UPDATE session SET sess = jsonb_set(sess::jsonb, ?, to_jsonb((sess->>?)::bigint - ?))::json WHERE sid = ?`,
    [`{${field}}`, field, byMs, sid],
  );
  forgetSession(sid);
}

describe('defaults', () => {
  it('are 30 idle minutes and 12 hours (the issue’s defaults)', () => {
    const c = loadConfig({ CRESTWATCH_MODE: 'test' });
    expect(c.sessionIdleMinutes).toBe(30);
    expect(c.sessionMaxHours).toBe(12);
  });

  it('names the limit that passed first', () => {
    const limits = { sessionIdleMinutes: 30, sessionMaxHours: 12 };
    const t0 = Date.UTC(2026, 11, 4, 8);
    expect(sessionEnd({ createdAt: t0, lastSeenAt: t0 + 29 * MIN }, t0 + 58 * MIN, limits)).toBeNull();
    expect(sessionEnd({ createdAt: t0, lastSeenAt: t0 }, t0 + 30 * MIN, limits)).toBe('idle');
    expect(sessionEnd({ createdAt: t0, lastSeenAt: t0 + 12 * HOUR - MIN }, t0 + 12 * HOUR, limits)).toBe('lifetime');
    // Idle since 11:40 after sign-in, seen at 12:01: the idle limit passed (12:10) after the lifetime (12:00).
    expect(sessionEnd({ createdAt: t0, lastSeenAt: t0 + 11 * HOUR + 40 * MIN }, t0 + 12 * HOUR + MIN, limits)).toBe(
      'lifetime',
    );
    expect(sessionEnd({ createdAt: t0, lastSeenAt: t0 + HOUR }, t0 + 13 * HOUR, limits)).toBe('idle');
    expect(sessionEnd({}, t0, limits)).toBe('lifetime');
  });
});

describe('an ended session', () => {
  it.each([
    ['lastSeenAt', 31 * MIN, 'idle', /30 minutes without activity/],
    ['createdAt', 12 * HOUR + MIN, 'lifetime', /at most 12 hours/],
  ] as const)(
    'moved %s back by %d ms answers 401 session_expired (%s), on every route until sign-in',
    async (field, by, reason, words) => {
      const s = await signInAs(server, DEMO.analyst);
      const me = (await s.agent.get('/api/me')).body;
      const [row] = await sessionOf(me.id);
      await age(row.sid, field, by);
      const res = await s.agent.get('/api/me');
      expect(res.status).toBe(401);
      expect(res.body.error).toMatchObject({ code: 'session_expired', details: { reason } });
      expect(res.body.error.message).toMatch(words);
      // Still ended, and no longer anyone's session; public routes keep answering.
      const later = await s.agent.get('/api/districts');
      expect(later.body.error).toMatchObject({ code: 'session_expired', details: { reason } });
      expect(await sessionOf(me.id)).toEqual([]);
      expect((await s.agent.get('/api/auth/options')).status).toBe(200);
      // A state-changing call is refused too (CSRF token gone with the person).
      expect((await s.agent.post('/api/auth/sign-out')).status).toBe(401);
      // Signing in again starts a fresh session.
      const again = await signInAs(server, DEMO.analyst);
      expect((await again.agent.get('/api/me')).status).toBe(200);
      await again.agent.post('/api/auth/sign-out');
    },
  );

  it('answers a stranger without a session plain unauthenticated', async () => {
    const res = await request(server).get('/api/me');
    expect(res.body.error.code).toBe('unauthenticated');
  });
});

describe('the session kept per process', () => {
  it('keeps a session at most PERSON_CACHE_MS, each reader getting its own copy', () => {
    const now = 5_000_000;
    keepSession('sid-a', { passport: { user: 41 }, lastSeenAt: 1 }, now);
    const copy = cachedSession('sid-a', now + PERSON_CACHE_MS - 1) as { lastSeenAt: number };
    expect(copy).toEqual({ passport: { user: 41 }, lastSeenAt: 1 });
    copy.lastSeenAt = 2;
    expect(cachedSession('sid-a', now + 1)).toEqual({ passport: { user: 41 }, lastSeenAt: 1 });
    expect(cachedSession('sid-a', now + PERSON_CACHE_MS)).toBeUndefined();
  });

  it('forgets every kept session of a person whose role or standing changed here', () => {
    const now = Date.now();
    keepSession('sid-b', { passport: { user: 42 } }, now);
    keepSession('sid-c', { passport: { user: 42 } }, now);
    keepSession('sid-d', { passport: { user: 43 } }, now);
    forgetSessionPerson(42);
    expect(cachedSession('sid-b', now)).toBeUndefined();
    expect(cachedSession('sid-c', now)).toBeUndefined();
    expect(cachedSession('sid-d', now)).toEqual({ passport: { user: 43 } });
  });

  it('answers a burst from its kept copy; a sign-out here ends the session at once', async () => {
    const s = await signInAs(server, DEMO.analyst);
    const me = await s.agent.get('/api/me');
    expect(me.status).toBe(200);
    // The row goes behind the server's back (as through another process): the kept copy
    // still answers, which shows the burst is not reading the row...
    const [row] = await sessionOf(me.body.id);
    await t.db('session').where({ sid: row.sid }).del();
    for (let i = 0; i < 5; i++) expect((await s.agent.get('/api/me')).status).toBe(200);
    // ...until it is PERSON_CACHE_MS old (forgetting it stands in for the wait).
    forgetSession(row.sid);
    expect((await s.agent.get('/api/me')).status).toBe(401);

    const again = await signInAs(server, DEMO.analyst);
    const csrf = (await again.agent.get('/api/me')).body.csrfToken;
    expect((await again.agent.post('/api/auth/sign-out').set('x-csrf-token', csrf)).status).toBeLessThan(400);
    expect((await again.agent.get('/api/me')).status).toBe(401);
  });
});

describe('writing the session back', () => {
  it('does not roll the row or the cookie on every request; at most once a minute', async () => {
    const s = await signInAs(server, DEMO.official);
    const id = (await s.agent.get('/api/me')).body.id;
    const [before] = await sessionOf(id);
    const setCookies: unknown[] = [];
    for (let i = 0; i < 6; i++) {
      const r = await s.agent.get(i % 2 ? '/api/me' : '/api/districts');
      expect(r.status).toBe(200);
      setCookies.push(r.headers['set-cookie']);
    }
    const [after] = await sessionOf(id);
    expect(setCookies.every((c) => c === undefined)).toBe(true);
    expect(after.expire.getTime()).toBe(before.expire.getTime());
    expect(after.sess.lastSeenAt).toBe(before.sess.lastSeenAt);
    expect(after.sess.createdAt).toBe(before.sess.createdAt);

    // A minute later (the stored clock moved back 61 s) the next request writes it once.
    await age(before.sid, 'lastSeenAt', 61_000);
    const moved = await s.agent.get('/api/me');
    expect(String(moved.headers['set-cookie'])).toMatch(/^cw\.sid=/);
    const [written] = await sessionOf(id);
    expect(Number(written.sess.lastSeenAt)).toBeGreaterThan(Number(before.sess.lastSeenAt));
    expect(written.sess.createdAt).toBe(before.sess.createdAt);
    // The store keeps whole seconds: within the same second the expiry is equal, never earlier.
    expect(written.expire.getTime()).toBeGreaterThanOrEqual(before.expire.getTime());
    const next = await s.agent.get('/api/me');
    expect(next.headers['set-cookie']).toBeUndefined();
  });

  it('keeps today’s cookie in test mode: cw.sid, httpOnly, Lax, not Secure', async () => {
    const agent = request.agent(server);
    const start = await agent.get(`/api/auth/google?login_hint=${DEMO.analyst}`);
    const cookie = String(start.headers['set-cookie']);
    expect(cookie).toMatch(/^cw\.sid=/);
    expect(cookie).toMatch(/HttpOnly/);
    expect(cookie).not.toMatch(/Secure/i);
  });
});

describe('production cookies and TRUST_PROXY', () => {
  /** A production config whose Google endpoints are the test stand-in's. */
  function productionConfig(trustProxy: string): Partial<Config> {
    const prod = loadConfig({
      NODE_ENV: 'production',
      DATABASE_URL: 'postgres://unused',
      SESSION_SECRET: 'a-production-secret-of-more-than-32-bytes',
      GOOGLE_CLIENT_ID: 'id',
      GOOGLE_CLIENT_SECRET: 'secret',
      TRUST_PROXY: trustProxy,
    });
    const { oauth, standInPort } = loadConfig({ CRESTWATCH_MODE: 'test' });
    return { mode: prod.mode, sessionSecret: prod.sessionSecret, trustProxy: prod.trustProxy, oauth, standInPort };
  }

  async function startCookie(trustProxy: string, headers: Record<string, string>): Promise<string> {
    const prodApp = testApp(t.db, productionConfig(trustProxy));
    try {
      const start = await request(prodApp).get(`/api/auth/google?login_hint=${DEMO.analyst}`).set(headers);
      expect(start.status).toBe(302);
      return String(start.headers['set-cookie'] ?? '');
    } finally {
      await prodApp.locals.close();
    }
  }

  it('sets __Host-cw.sid, Secure, Path=/ and no Domain behind a trusted https proxy', async () => {
    const cookie = await startCookie('loopback', { 'X-Forwarded-Proto': 'https' });
    expect(cookie).toMatch(/^__Host-cw\.sid=/);
    expect(cookie).toMatch(/; Secure/);
    expect(cookie).toMatch(/; Path=\//);
    expect(cookie).not.toMatch(/Domain=/i);
  });

  it('never sends the cookie over plain http, nor on the word of a proxy it does not trust', async () => {
    expect(await startCookie('loopback', {})).toBe('');
    // TRUST_PROXY names another address: the loopback caller's X-Forwarded-Proto is ignored.
    expect(await startCookie('10.0.0.1', { 'X-Forwarded-Proto': 'https' })).toBe('');
  });

  it('gives every client behind a trusted proxy its own sign-in rate-limit bucket', async () => {
    const statuses = async (trust: number | string[], ips: string[]) => {
      const limited = testApp(t.db, { authRateLimitPerMinute: 2, trustProxy: trust });
      const out: number[] = [];
      for (const ip of ips)
        out.push((await request(limited).get('/api/auth/google').set('X-Forwarded-For', ip)).status);
      await limited.locals.close();
      return out;
    };
    // One hop trusted: 203.0.113.7 and .8 (documentation addresses, RFC 5737) are two people.
    expect(await statuses(1, ['203.0.113.7', '203.0.113.7', '203.0.113.7', '203.0.113.8'])).toEqual([
      302, 302, 429, 302,
    ]);
    // The proxy is not trusted: everyone is the proxy, one bucket.
    expect(await statuses(['10.0.0.1'], ['203.0.113.7', '203.0.113.7', '203.0.113.8'])).toEqual([302, 302, 429]);
  });

  it('reads TRUST_PROXY as a hop count or addresses, and refuses `true` and nonsense', () => {
    expect(parseTrustProxy(undefined)).toEqual(['loopback']);
    expect(parseTrustProxy('2')).toBe(2);
    expect(parseTrustProxy('10.0.0.0/8, 192.168.1.4,loopback,::1')).toEqual([
      '10.0.0.0/8',
      '192.168.1.4',
      'loopback',
      '::1',
    ]);
    expect(() => parseTrustProxy('true')).toThrow(/hop count/);
    expect(() => parseTrustProxy('proxy.example')).toThrow(/"proxy\.example" is not a hop count/);
    expect(() => loadConfig({ CRESTWATCH_MODE: 'test', TRUST_PROXY: '10.0.0.1/8/2' })).toThrow(/TRUST_PROXY/);
  });
});
