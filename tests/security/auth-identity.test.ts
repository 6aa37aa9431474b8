/**
 * Item 4 of the hardening issue: an account is pinned to its Google identity. Every
 * refusal goes end to end: our server → the stand-in (answering a test-only identity) →
 * our callback.
 */
import type { Server } from 'node:http';
import type { CrestwatchApp } from '../../api/app';
import { ensureDemoAccounts } from '../../api/people/service';
import { closeServer, DEMO, listen, signInAs } from '../support/auth';
import { memoryMailer, testApp } from '../support/test-app';
import { freshDatabase, type TestDatabase } from '../support/test-db';
import {
  up as addInvitationExpiry,
  down as dropInvitationExpiry,
} from '../../migrations/20261204100000_add_invitation_expiry';
import { signInWithIdentity } from './identity-sign-in';

jest.setTimeout(60_000);

const DAY = 86_400_000;
let t: TestDatabase;
let app: CrestwatchApp;
let server: Server;
const mailer = memoryMailer();

beforeAll(async () => {
  t = await freshDatabase();
  await ensureDemoAccounts(t.db);
  app = testApp(t.db, {}, mailer);
  server = await listen(app);
});
afterAll(async () => {
  await closeServer(server, app);
  await t.drop();
});

const userRow = (email: string) => t.db('users').whereRaw('lower(email) = ?', [email]).first();

describe('the Google identity behind an account', () => {
  it('refuses a profile whose e-mail is not verified, and pins nothing', async () => {
    const s = await signInWithIdentity(server, DEMO.analyst, '#unverified');
    expect(s.landedOn).toBe('/no-access?reason=email_unverified');
    expect((await s.agent.get('/api/me')).status).toBe(401);
    expect((await userRow(DEMO.analyst)).google_sub).toBeNull();
  });

  it('pins the subject at the first sign-in and refuses another subject for the same address', async () => {
    const first = await signInWithIdentity(server, DEMO.official);
    expect(first.landedOn).toBe('/');
    const pinned = (await userRow(DEMO.official)).google_sub;
    expect(pinned).toMatch(/^standin-[0-9a-f]{20}$/);

    const other = await signInWithIdentity(server, DEMO.official, '#sub=recycled-mailbox');
    expect(other.landedOn).toBe('/no-access?reason=identity_mismatch');
    expect((await other.agent.get('/api/me')).status).toBe(401);
    expect((await userRow(DEMO.official)).google_sub).toBe(pinned);
    const refused = await t.db('audit_log').where({ action: 'sign_in.refused', actor_email: DEMO.official }).first();
    expect(refused.after).toEqual({ reason: 'identity_mismatch' });

    // The rightful identity still gets in.
    expect((await signInWithIdentity(server, DEMO.official)).landedOn).toBe('/');
  });

  it('lets an admin reset the pinned identity (audited, sessions ended); the next sign-in pins the new one', async () => {
    const admin = await signInAs(server, DEMO.admin);
    const person = await signInWithIdentity(server, DEMO.official);
    const id = (await userRow(DEMO.official)).id;

    const official = await signInAs(server, DEMO.official);
    const forbidden = await official.agent.post(`/api/people/${id}/identity-reset`);
    expect(forbidden.status).toBe(403);

    const reset = await admin.agent.post(`/api/people/${id}/identity-reset`);
    expect(reset.status).toBe(200);
    expect(reset.body.person).toMatchObject({ id, identityPinned: false });
    expect((await person.agent.get('/api/me')).status).toBe(401);
    const entry = await t
      .db('audit_log')
      .where({ action: 'person.identity_reset', target_id: String(id) })
      .first();
    expect(entry.actor_email).toBe(DEMO.admin);
    expect(entry.before.identityPinned).toBe(true);
    expect(entry.after.identityPinned).toBe(false);

    const moved = await signInWithIdentity(server, DEMO.official, '#sub=new-account');
    expect(moved.landedOn).toBe('/');
    expect((await userRow(DEMO.official)).google_sub).toBe('standin-other-new-account');
    expect((await signInWithIdentity(server, DEMO.official)).landedOn).toBe('/no-access?reason=identity_mismatch');

    const again = await admin.agent.post(`/api/people/${id}/identity-reset`);
    expect(again.status).toBe(200);
    const twice = await admin.agent.post(`/api/people/${id}/identity-reset`);
    expect(twice.status).toBe(409);
    expect(twice.body.error.code).toBe('identity_not_pinned');
  });

  it('checks the userinfo hd claim against GOOGLE_HOSTED_DOMAIN', async () => {
    const scoped = testApp(t.db, { googleHostedDomain: 'crestwatch.example' });
    const scopedServer = await listen(scoped);
    try {
      // The stand-in answers hd = the address's domain, as Google does for a Workspace account.
      expect((await signInWithIdentity(scopedServer, DEMO.analyst)).landedOn).toBe('/');
      expect((await signInWithIdentity(scopedServer, DEMO.analyst, '#hd=elsewhere.example')).landedOn).toBe(
        '/no-access?reason=wrong_domain',
      );
      // A consumer account has no hd at all.
      const none = await signInWithIdentity(scopedServer, DEMO.analyst, '#hd=');
      expect(none.landedOn).toBe('/no-access?reason=wrong_domain');
      expect((await none.agent.get('/api/me')).status).toBe(401);
    } finally {
      await closeServer(scopedServer, scoped);
    }
  });
});

describe('invitations that lapse', () => {
  it('gives a new invitation the invitationDays setting (default 14) and the demo accounts no expiry', async () => {
    const admin = await signInAs(server, DEMO.admin);
    const before = Date.now();
    const res = await admin.agent
      .post('/api/people/invitations')
      .send({ email: 'fortnight@crestwatch.example', role: 'official' });
    expect(res.status).toBe(201);
    // 14 days: the default the issue sets for invitationDays.
    const expires = Date.parse(res.body.user.invitationExpiresAt);
    expect(expires).toBeGreaterThanOrEqual(before + 14 * DAY - 5_000);
    expect(expires).toBeLessThanOrEqual(Date.now() + 14 * DAY + 5_000);
    expect(mailer.sent.at(-1)!.text).toContain(res.body.user.invitationExpiresAt.slice(0, 10));

    expect((await admin.agent.patch('/api/settings').send({ invitationDays: 3 })).status).toBe(200);
    const short = await admin.agent
      .post('/api/people/invitations')
      .send({ email: 'three.days@crestwatch.example', role: 'official' });
    expect(Date.parse(short.body.user.invitationExpiresAt) - Date.now()).toBeLessThanOrEqual(3 * DAY + 5_000);
    expect(Date.parse(short.body.user.invitationExpiresAt) - Date.now()).toBeGreaterThan(3 * DAY - 60_000);
    expect((await admin.agent.patch('/api/settings').send({ invitationDays: 0 })).status).toBe(400);
    await admin.agent.patch('/api/settings').send({ invitationDays: 14 });

    for (const email of Object.values(DEMO)) expect((await userRow(email)).invitation_expires_at).toBeNull();
    // A demo account never signed in has no invitation to re-send, so it cannot be made to lapse.
    await t.db('users').insert({ email: 'never.invited@crestwatch.example', role: 'official' });
    const never = (await userRow('never.invited@crestwatch.example')).id;
    const refused = await admin.agent.post(`/api/people/${never}/invitation`);
    expect(refused.status).toBe(409);
    expect(refused.body.error.code).toBe('no_invitation');
    expect((await userRow('never.invited@crestwatch.example')).invitation_expires_at).toBeNull();
  });

  it('shows an expired invitation as expired, refuses it, and a re-sent one (audited) works', async () => {
    const admin = await signInAs(server, DEMO.admin);
    const invited = await admin.agent
      .post('/api/people/invitations')
      .send({ email: 'late@crestwatch.example', role: 'analyst' });
    const id = invited.body.user.id;
    // The clock cannot be moved inside PostgreSQL: the stored expiry is moved into the past instead.
    await t
      .db('users')
      .where({ id })
      .update({ invitation_expires_at: new Date(Date.now() - 60_000) });

    const people = (await admin.agent.get('/api/people')).body.people;
    expect(people.find((p: { id: number }) => p.id === id).status).toBe('expired');

    const late = await signInWithIdentity(server, 'late@crestwatch.example');
    expect(late.landedOn).toBe('/no-access?reason=invitation_expired');
    expect((await late.agent.get('/api/me')).status).toBe(401);
    expect((await userRow('late@crestwatch.example')).last_sign_in_at).toBeNull();

    const sentBefore = mailer.sent.length;
    const resent = await admin.agent.post(`/api/people/${id}/invitation`);
    expect(resent.status).toBe(200);
    expect(resent.body.user.status).toBe('invited');
    expect(Date.parse(resent.body.user.invitationExpiresAt)).toBeGreaterThan(Date.now() + 13 * DAY);
    expect(resent.body.mail).toEqual({ sent: true });
    expect(mailer.sent.length).toBe(sentBefore + 1);
    expect(mailer.sent.at(-1)!.to).toBe('late@crestwatch.example');
    const entry = await t
      .db('audit_log')
      .where({ action: 'person.invitation_resend', target_id: String(id) })
      .first();
    expect(entry.before.status).toBe('expired');
    expect(entry.after.status).toBe('invited');

    expect((await signInWithIdentity(server, 'late@crestwatch.example')).landedOn).toBe('/');
    const used = await admin.agent.post(`/api/people/${id}/invitation`);
    expect(used.status).toBe(409);
    expect(used.body.error.code).toBe('already_signed_in');
  });

  it('the migration gives pending invitations 14 days from then and keeps stored subjects', async () => {
    const m = await freshDatabase();
    try {
      await dropInvitationExpiry(m.db);
      const [inviter] = await m
        .db('users')
        .insert({
          email: 'boss@crestwatch.example',
          role: 'admin',
          google_sub: 'sub-boss',
          last_sign_in_at: new Date(),
        })
        .returning('id');
      await m.db('users').insert([
        {
          email: 'pending@crestwatch.example',
          role: 'official',
          invited_by: inviter.id,
          invited_at: new Date(Date.now() - 40 * DAY),
        },
        { email: 'first.admin@crestwatch.example', role: 'admin' },
        {
          email: 'used@crestwatch.example',
          role: 'analyst',
          invited_by: inviter.id,
          invited_at: new Date(Date.now() - 40 * DAY),
          last_sign_in_at: new Date(),
          google_sub: 'sub-used',
        },
      ]);
      const at = Date.now();
      await addInvitationExpiry(m.db);
      const rows = await m.db('users').select('email', 'google_sub', 'invitation_expires_at');
      const by = new Map(rows.map((r) => [r.email, r]));
      const pending = Date.parse(by.get('pending@crestwatch.example').invitation_expires_at);
      // 14 days from the migration: the rule for invitations pending at migration.
      expect(Math.abs(pending - (at + 14 * DAY))).toBeLessThan(60_000);
      expect(by.get('first.admin@crestwatch.example').invitation_expires_at).toBeNull();
      expect(by.get('used@crestwatch.example').invitation_expires_at).toBeNull();
      expect(by.get('used@crestwatch.example').google_sub).toBe('sub-used');
      expect(by.get('boss@crestwatch.example').google_sub).toBe('sub-boss');
    } finally {
      await m.drop();
    }
  });
});
