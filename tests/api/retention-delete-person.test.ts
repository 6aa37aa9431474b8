/**
 * Deleting a person: an admin deletes someone who was invited, signed in, subscribed and
 * changed settings. Their sessions and subscriptions go at once; their audit entries stay,
 * with a pseudonym where their address and name were, so the log still shows what was done.
 */
import type { Server } from 'node:http';
import type { CrestwatchApp } from '../../api/app';
import { seedDemoIfEmpty } from '../../api/demo/seed';
import { ensureDemoAccounts } from '../../api/people/service';
import { closeServer, DEMO, listen, signInAs, type SignedIn } from '../support/auth';
import { testApp } from '../support/test-app';
import { freshDatabase, type TestDatabase } from '../support/test-db';
import { upload } from './upload-helpers';

jest.setTimeout(120_000);

const LEAVER = 'lee.leaver@crestwatch.example';
const LEAVER_NAME = 'Lee Leaver';

let t: TestDatabase;
let app: CrestwatchApp;
let server: Server;
let admin: SignedIn;
let leaver: SignedIn;
let leaverId: number;

/** Every place in the audit log that could still carry the address or the name. */
async function auditMentions(text: string): Promise<number> {
  const [{ n }] = await t
    .db('audit_log')
    .whereRaw(`position(lower(?) IN lower(concat_ws(' ', actor_email, before::text, after::text))) > 0`, [text])
    .count<{ n: string }[]>({ n: '*' });
  return Number(n);
}

beforeAll(async () => {
  t = await freshDatabase();
  await seedDemoIfEmpty(t.db);
  await ensureDemoAccounts(t.db);
  app = testApp(t.db);
  server = await listen(app);
  admin = await signInAs(server, DEMO.admin);
  const invited = await admin.agent
    .post('/api/people/invitations')
    .send({ email: LEAVER, role: 'admin', name: LEAVER_NAME });
  expect(invited.status).toBe(201);
  leaverId = invited.body.user.id;
  leaver = await signInAs(server, LEAVER);
  expect((await leaver.agent.get('/api/me')).status).toBe(200);
  expect((await leaver.agent.post('/api/subscriptions').send({ scope: 'region', delivery: 'instant' })).status).toBe(
    201,
  );
  expect((await leaver.agent.patch('/api/settings').send({ thresholdShiftPercent: 12 })).status).toBe(200);
  const preview = await upload(
    leaver.agent,
    'district_code,indicator,year,value\nD02,income_pc,2025,33333\n',
    'leaver-preview.csv',
  );
  expect(preview.status).toBe(200);
  expect((await admin.agent.patch(`/api/people/${leaverId}`).send({ role: 'analyst' })).status).toBe(200);
});

afterAll(async () => {
  await closeServer(server, app);
  await t.drop();
});

describe('deleting a person', () => {
  it('is for admins only, never oneself, and answers 404 for someone unknown', async () => {
    const analyst = await signInAs(server, DEMO.analyst);
    expect((await analyst.agent.delete(`/api/people/${leaverId}`)).status).toBe(403);
    const me = (await admin.agent.get('/api/me')).body;
    const self = await admin.agent.delete(`/api/people/${me.id}`);
    expect(self.status).toBe(409);
    expect(self.body.error.code).toBe('cannot_delete_self');
    const unknown = await admin.agent.delete('/api/people/999999');
    expect(unknown.status).toBe(404);
    expect(unknown.body.error).toMatchObject({ code: 'not_found' });
  });

  it('ends their sessions and removes their subscriptions and user row', async () => {
    const entriesBefore = Number((await t.db('audit_log').count<{ n: string }[]>({ n: '*' }))[0].n);
    const res = await admin.agent.delete(`/api/people/${leaverId}`);
    expect(res.status).toBe(200);
    // One signed-in session, one subscription (set up above).
    expect(res.body.deleted).toMatchObject({ id: leaverId, sessions: 1, subscriptions: 1 });
    expect(res.body.deleted.pseudonym).toMatch(/^former-person-[0-9a-f]{10}$/);

    expect((await leaver.agent.get('/api/me')).status).toBe(401);
    expect(await t.db('users').where({ id: leaverId }).first()).toBeUndefined();
    expect(await t.db('subscriptions').where({ user_id: leaverId }).first()).toBeUndefined();
    const [{ n }] = await t
      .db('session')
      .whereRaw(`sess->'passport'->>'user' = ?`, [String(leaverId)])
      .count<{ n: string }[]>({ n: '*' });
    expect(Number(n)).toBe(0);
    // Nothing was removed from the log: one entry more (the deletion itself).
    expect(Number((await t.db('audit_log').count<{ n: string }[]>({ n: '*' }))[0].n)).toBe(entriesBefore + 1);
    expect((await admin.agent.get('/api/people')).body.people.map((p: { email: string }) => p.email)).not.toContain(
      LEAVER,
    );
  });

  it('keeps their audit entries under the pseudonym, with no trace of the address or name', async () => {
    const deletion = await t
      .db('audit_log')
      .where({ action: 'person.delete', target_id: String(leaverId) })
      .first('before', 'actor_email');
    const pseudonym = deletion.before.pseudonym as string;
    expect(deletion.actor_email).toBe(DEMO.admin);

    expect(await auditMentions(LEAVER)).toBe(0);
    expect(await auditMentions(LEAVER_NAME)).toBe(0);

    const entries = (await admin.agent.get('/api/audit').query({ limit: 100 })).body.entries as {
      action: string;
      actorEmail: string | null;
      actorId: number | null;
      targetId: string | null;
      before: Record<string, unknown> | null;
      after: Record<string, unknown> | null;
    }[];
    // Their own actions stay (newest first: the settings change, then their sign-in), now by the pseudonym.
    const theirs = entries.filter((e) => e.actorEmail === pseudonym);
    expect(theirs.map((e) => e.action)).toEqual(['settings.update', 'sign_in']);
    expect(theirs.every((e) => e.actorId === null)).toBe(true);
    expect(theirs[0].after).toEqual({ thresholdShiftPercent: 12 });
    // The entries about them stay too, with the pseudonym for the address and no name.
    const invite = entries.find((e) => e.action === 'person.invite' && e.targetId === String(leaverId));
    expect(invite?.after).toMatchObject({ email: pseudonym, name: '', role: 'admin' });
    const update = entries.find((e) => e.action === 'person.update' && e.targetId === String(leaverId));
    expect(update?.before).toMatchObject({ email: pseudonym, role: 'admin' });
    expect(update?.after).toMatchObject({ email: pseudonym, role: 'analyst' });
  });

  it('keeps the upload they previewed, under the pseudonym', async () => {
    const pseudonym = (
      await t
        .db('audit_log')
        .where({ action: 'person.delete', target_id: String(leaverId) })
        .first('before')
    ).before.pseudonym;
    const rows = await t.db('uploads').where({ file_name: 'leaver-preview.csv' }).select('user_id', 'user_email');
    expect(rows).toEqual([{ user_id: null, user_email: pseudonym }]);
  });

  it('leaves the address in no row of any table', async () => {
    const { rows: tables } = await t.db.raw(`SELECT tablename FROM pg_tables WHERE schemaname = 'public' ORDER BY 1`);
    const holding: string[] = [];
    for (const { tablename } of tables as { tablename: string }[]) {
      const { rows } = await t.db.raw(
        `SELECT count(*)::int AS n FROM "${tablename}" x WHERE position(lower(?) IN lower(x::text)) > 0`,
        [LEAVER],
      );
      if (rows[0].n > 0) holding.push(`${tablename}: ${rows[0].n}`);
    }
    expect(holding).toEqual([]);
  });

  it('leaves everyone else’s entries and access alone', async () => {
    expect((await admin.agent.get('/api/me')).status).toBe(200);
    expect(await auditMentions(DEMO.admin)).toBeGreaterThan(0);
    expect(await t.db('users').whereRaw('lower(email) = ?', [DEMO.official]).first('id')).toBeDefined();
  });
});
