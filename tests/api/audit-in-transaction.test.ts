/**
 * Every audit row is written in the transaction of the change it records: when the row
 * cannot be written, the change is not kept either. The test database refuses, by a
 * trigger, the audit rows whose target is marked below; the change that row belongs to must
 * then leave no trace (before, the indicator catalogue committed its change first and wrote
 * the row afterwards, so a failed row left an unaudited change behind).
 */
import type { Server } from 'node:http';
import type { CrestwatchApp } from '../../api/app';
import { seedDemoIfEmpty } from '../../api/demo/seed';
import { ensureDemoAccounts } from '../../api/people/service';
import { closeServer, DEMO, listen, signInAs, type SignedIn } from '../support/auth';
import { testApp } from '../support/test-app';
import { freshDatabase, type TestDatabase } from '../support/test-db';

jest.setTimeout(120_000);

let t: TestDatabase;
let app: CrestwatchApp;
let server: Server;
let admin: SignedIn;

/** From now on, audit rows of these actions are refused (the insert raises); others are written. */
async function refuseAuditOf(actions: string[]): Promise<void> {
  await t.db.raw(`CREATE TABLE test_refused_audit (action text PRIMARY KEY)`);
  await t.db('test_refused_audit').insert(actions.map((action) => ({ action })));
  await t.db.raw(`CREATE FUNCTION test_refuse_audit() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      IF EXISTS (SELECT 1 FROM test_refused_audit WHERE action = NEW.action) THEN
        RAISE EXCEPTION 'audit row refused by the test: %', NEW.action;
      END IF;
      RETURN NEW;
    END $$`);
  await t.db.raw(
    `CREATE TRIGGER test_refuse_audit BEFORE INSERT ON audit_log FOR EACH ROW EXECUTE FUNCTION test_refuse_audit()`,
  );
}

async function auditCount(action: string): Promise<number> {
  const [{ n }] = await t.db('audit_log').where({ action }).count<{ n: string }[]>({ n: '*' });
  return Number(n);
}

beforeAll(async () => {
  t = await freshDatabase();
  await seedDemoIfEmpty(t.db);
  await ensureDemoAccounts(t.db);
  app = testApp(t.db);
  server = await listen(app);
  admin = await signInAs(server, DEMO.admin);
});

afterAll(async () => {
  await closeServer(server, app);
  await t.drop();
});

describe('audit rows commit or roll back with their change', () => {
  it('writes one audit row with each change while the log accepts them', async () => {
    const made = await admin.agent
      .post('/api/indicators')
      .send({ code: 'audited_total', name: 'Audited total', unit: 't', mustBePositive: true });
    expect(made.status).toBe(201);
    expect(await auditCount('indicator.create')).toBe(1);
    expect(
      (await admin.agent.patch('/api/indicators/audited_total').send({ description: 'Changed once.' })).status,
    ).toBe(200);
    expect(await auditCount('indicator.update')).toBe(1);
    expect((await admin.agent.patch('/api/settings').send({ thresholdShiftPercent: 11 })).status).toBe(200);
    expect(await auditCount('settings.update')).toBe(1);
  });

  it('keeps no indicator, setting or person change whose audit row failed', async () => {
    await refuseAuditOf(['indicator.create', 'indicator.update', 'settings.update', 'person.invite', 'person.update']);

    const made = await admin.agent.post('/api/indicators').send({
      code: 'unaudited_pc',
      name: 'Unaudited per person',
      unit: 't per person',
      mustBePositive: true,
      derivation: { kind: 'per_person', source: 'audited_total', divisor: 'population' },
    });
    expect(made.status).toBe(500);
    expect(await t.db('indicators').where({ code: 'unaudited_pc' }).first()).toBeUndefined();

    const changed = await admin.agent.patch('/api/indicators/audited_total').send({ description: 'Changed twice.' });
    expect(changed.status).toBe(500);
    expect((await t.db('indicators').where({ code: 'audited_total' }).first('description')).description).toBe(
      'Changed once.',
    );

    expect((await admin.agent.patch('/api/settings').send({ thresholdShiftPercent: 13 })).status).toBe(500);
    expect((await admin.agent.get('/api/settings')).body.settings.thresholdShiftPercent).toBe(11);

    const invited = await admin.agent
      .post('/api/people/invitations')
      .send({ email: 'never.audited@crestwatch.example', role: 'analyst' });
    expect(invited.status).toBe(500);
    expect(
      await t.db('users').whereRaw('lower(email) = ?', ['never.audited@crestwatch.example']).first(),
    ).toBeUndefined();

    const analyst = await t.db('users').whereRaw('lower(email) = ?', [DEMO.analyst]).first('id', 'role');
    expect((await admin.agent.patch(`/api/people/${analyst.id}`).send({ role: 'official' })).status).toBe(500);
    expect((await t.db('users').where({ id: analyst.id }).first('role')).role).toBe('analyst');

    expect(await auditCount('indicator.create')).toBe(1);
    expect(await auditCount('indicator.update')).toBe(1);
    expect(await auditCount('settings.update')).toBe(1);
  });
});
