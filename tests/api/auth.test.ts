/**
 * Sign-in through the OAuth stand-in, sessions, refusals, CSRF, invitations by e-mail
 * through the real mail catcher, and the audit log.
 */
import type { Server } from 'node:http';
import request from 'supertest';
import type { CrestwatchApp } from '../../api/app';
import { createMailer } from '../../api/mail/mailer';
import { startMailCatcher, type MailCatcher } from '../../api/mail/catcher';
import { ensureDemoAccounts } from '../../api/people/service';
import { loadConfig } from '../../api/config';
import { MeResponseSchema } from '../../contracts/districts';
import {
  AuditResponseSchema,
  InviteAnswerSchema,
  MailboxResponseSchema,
  PeopleResponseSchema,
  PersonAnswerSchema,
} from '../../contracts/people';
import { parseAnswer } from '../support/contract';
import { closeServer, DEMO, listen, signInAs, startSignIn } from '../support/auth';
import { testApp } from '../support/test-app';
import { freshDatabase, type TestDatabase } from '../support/test-db';

let t: TestDatabase;
let app: CrestwatchApp;
let server: Server;
let catcher: MailCatcher;

beforeAll(async () => {
  t = await freshDatabase();
  await ensureDemoAccounts(t.db);
  catcher = await startMailCatcher(t.db, 0);
  const config = { ...loadConfig({ CRESTWATCH_MODE: 'test' }), mailCatcherPort: catcher.port };
  app = testApp(t.db, { mailCatcherPort: catcher.port }, createMailer(config));
  server = await listen(app);
});
afterAll(async () => {
  await closeServer(server, app);
  await catcher.stop();
  await t.drop();
});

describe('sign-in through the stand-in', () => {
  it.each([
    [DEMO.admin, 'admin'],
    [DEMO.analyst, 'analyst'],
    [DEMO.official, 'official'],
  ])('%s signs in and has the role %s', async (email, role) => {
    const s = await signInAs(server, email);
    expect(s.landedOn).toBe('/');
    const me = await s.agent.get('/api/me');
    expect(me.status).toBe(200);
    expect(me.body).toMatchObject({ email, role });
    expect(me.body.csrfToken).toMatch(/^[A-Za-z0-9_-]{20,}$/);
  });

  it('gives two people signing in at the same moment each their own identity', async () => {
    // The stand-in's tokens were once identical within one second (same claims, same key), so
    // the second sign-in's userinfo answered the first person's address.
    const [analyst, official] = await Promise.all([signInAs(server, DEMO.analyst), signInAs(server, DEMO.official)]);
    expect((await analyst.agent.get('/api/me')).body).toMatchObject({ email: DEMO.analyst, role: 'analyst' });
    expect((await official.agent.get('/api/me')).body).toMatchObject({ email: DEMO.official, role: 'official' });
  });

  it('sends the session cookie httpOnly and SameSite=Lax, and rotates it at sign-in', async () => {
    const agent = request.agent(server);
    const start = await agent.get(`/api/auth/google?login_hint=${DEMO.analyst}`);
    const before = String(start.headers['set-cookie']).match(/cw\.sid=([^;]+)/)![1];
    const authorize = await fetch(start.headers.location, { redirect: 'manual' });
    const back = new URL(authorize.headers.get('location')!);
    const cb = await agent.get(back.pathname + back.search);
    const cookie = String(cb.headers['set-cookie']);
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    expect(cookie.match(/cw\.sid=([^;]+)/)![1]).not.toBe(before);
  });

  it('gives an account that was not invited no session and the no-access page', async () => {
    const s = await signInAs(server, 'stranger@elsewhere.example');
    expect(s.landedOn).toBe('/no-access?reason=not_invited');
    expect((await s.agent.get('/api/me')).status).toBe(401);
    expect((await s.agent.get('/api/people')).status).toBe(401);
  });

  it('refuses a deactivated account', async () => {
    const s = await signInAs(server, DEMO.former);
    expect(s.landedOn).toBe('/no-access?reason=deactivated');
    expect((await s.agent.get('/api/me')).status).toBe(401);
  });

  it('refuses a forged state', async () => {
    const agent = request.agent(server);
    const cb = await startSignIn(agent, DEMO.admin);
    const forged = cb.replace(/state=[^&]+/, 'state=forged-by-someone-else');
    const res = await agent.get(forged);
    expect(res.headers.location).toBe('/sign-in?error=failed');
    expect((await agent.get('/api/me')).status).toBe(401);
  });

  it('refuses a replayed callback', async () => {
    const first = await signInAs(server, DEMO.analyst);
    const other = request.agent(server);
    const replay = await other.get(first.callbackPath);
    expect(replay.headers.location).toBe('/sign-in?error=failed');
    expect((await other.get('/api/me')).status).toBe(401);
    // The same browser replaying its own callback after signing in gets nothing new either.
    const again = await first.agent.get(first.callbackPath);
    expect(again.headers.location).toBe('/sign-in?error=failed');
  });

  it('rate-limits the sign-in routes', async () => {
    const limitedApp = testApp(t.db, { authRateLimitPerMinute: 3 });
    const statuses: number[] = [];
    const agent = request.agent(limitedApp);
    for (let i = 0; i < 5; i++) statuses.push((await agent.get('/api/auth/google')).status);
    await limitedApp.locals.close();
    expect(statuses).toEqual([302, 302, 302, 429, 429]);
  });
});

describe('CSRF and sign-out', () => {
  it('refuses a state-changing call without the token, or from another site', async () => {
    const s = await signInAs(server, DEMO.admin);
    const bare = request.agent(server);
    // Same cookie jar, no token header.
    const jar = s.agent as unknown as { jar: unknown };
    (bare as unknown as { jar: unknown }).jar = jar.jar;
    const noToken = await bare
      .post('/api/people/invitations')
      .send({ email: 'x@crestwatch.example', role: 'official' });
    expect(noToken.status).toBe(403);
    expect(noToken.body.error.code).toBe('csrf_failed');
    const crossSite = await s.agent
      .post('/api/people/invitations')
      .set('Origin', 'http://evil.example')
      .send({ email: 'x@crestwatch.example', role: 'official' });
    expect(crossSite.status).toBe(403);
    expect(await t.db('users').where({ email: 'x@crestwatch.example' }).first()).toBeUndefined();
  });

  it('signs out: the session is gone', async () => {
    const s = await signInAs(server, DEMO.official);
    const out = await s.agent.post('/api/auth/sign-out');
    expect(out.status).toBe(204);
    expect((await s.agent.get('/api/me')).status).toBe(401);
  });
});

describe('invitations', () => {
  it('admin invites, the catcher receives the mail, the invitee signs in with the role', async () => {
    const admin = await signInAs(server, DEMO.admin);
    const res = await admin.agent
      .post('/api/people/invitations')
      .send({ email: 'new.analyst@crestwatch.example', role: 'analyst' });
    expect(res.status).toBe(201);
    const invited = parseAnswer(InviteAnswerSchema, res);
    expect(invited.mail).toEqual({ sent: true });
    expect(invited.user).toMatchObject({ email: 'new.analyst@crestwatch.example', role: 'analyst', status: 'invited' });

    const mail = await t.db('caught_mail').whereRaw("'new.analyst@crestwatch.example' = ANY(envelope_to)").first();
    expect(mail.subject).toBe('You are invited to Crestwatch');
    expect(mail.text_body).toContain('an analyst');
    expect(mail.text_body).toContain('/sign-in');

    const box = await admin.agent.get('/api/mailbox?to=new.analyst@crestwatch.example');
    expect(parseAnswer(MailboxResponseSchema, box).messages).toHaveLength(1);
    const people = parseAnswer(PeopleResponseSchema, await admin.agent.get('/api/people'));
    expect(people.people.find((p) => p.email === 'new.analyst@crestwatch.example')?.status).toBe('invited');

    const invitee = await signInAs(server, 'new.analyst@crestwatch.example');
    expect(invitee.landedOn).toBe('/');
    expect(parseAnswer(MeResponseSchema, await invitee.agent.get('/api/me')).role).toBe('analyst');

    const dup = await admin.agent
      .post('/api/people/invitations')
      .send({ email: 'NEW.analyst@crestwatch.example', role: 'official' });
    expect(dup.status).toBe(409);
  });

  it('changes a role and deactivates, ending the person’s sessions, all in the audit log', async () => {
    const admin = await signInAs(server, DEMO.admin);
    const person = await signInAs(server, DEMO.official);
    const id = (await person.agent.get('/api/me')).body.id;
    const promoted = await admin.agent.patch(`/api/people/${id}`).send({ role: 'analyst' });
    expect(parseAnswer(PersonAnswerSchema, promoted).person.role).toBe('analyst');
    expect((await person.agent.get('/api/me')).body.role).toBe('analyst');
    const off = await admin.agent.patch(`/api/people/${id}`).send({ active: false });
    expect(off.body.person.status).toBe('deactivated');
    expect((await person.agent.get('/api/me')).status).toBe(401);

    const log = await admin.agent.get(`/api/audit?targetType=user`);
    parseAnswer(AuditResponseSchema, log);
    const actions = log.body.entries
      .filter((e: { targetId: string }) => e.targetId === String(id))
      .map((e: { action: string }) => e.action);
    expect(actions).toEqual(expect.arrayContaining(['person.update', 'person.deactivate']));
    const update = log.body.entries.find(
      (e: { action: string; targetId: string }) => e.action === 'person.update' && e.targetId === String(id),
    );
    expect(update.before.role).toBe('official');
    expect(update.after.role).toBe('analyst');
    expect(update.actorEmail).toBe(DEMO.admin);
    const filtered = await admin.agent.get('/api/audit?action=person.invite');
    expect(filtered.body.entries.every((e: { action: string }) => e.action === 'person.invite')).toBe(true);
  });

  it('keeps at least one active admin', async () => {
    const admin = await signInAs(server, DEMO.admin);
    const me = (await admin.agent.get('/api/me')).body;
    await t.db('users').where('role', 'admin').whereNot('id', me.id).update({ active: false });
    const res = await admin.agent.patch(`/api/people/${me.id}`).send({ role: 'official' });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('last_admin');
  });
});
