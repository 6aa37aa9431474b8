/**
 * People: invitations (a user row with its role, and an e-mail through nodemailer), role
 * changes, deactivation. Every change is written to the audit log with before and after.
 */
import type { Knex } from 'knex';
import * as audit from '../audit/store';
import { DEMO_ACCOUNTS } from '../auth/demo-accounts';
import type { AppContext } from '../context';
import { AppError, NotFoundError } from '../http/errors';
import type { Caller, Role } from '../http/routes';
import { forgetPerson, type ForgetResult } from '../retention/service';
import * as store from './store';

const publicUser = (u: store.UserRow) => ({
  id: u.id,
  email: u.email,
  name: u.name,
  role: u.role,
  active: u.active,
  status: !u.active ? 'deactivated' : u.lastSignInAt ? 'active' : 'invited',
  createdAt: u.createdAt,
  lastSignInAt: u.lastSignInAt,
  invitedAt: u.invitedAt,
});
export type PublicUser = ReturnType<typeof publicUser>;

const actor = (c: Caller) => ({ actorId: c.id, actorEmail: c.email });

export async function listPeople(db: Knex): Promise<PublicUser[]> {
  return (await store.list(db)).map(publicUser);
}

export function invitationText(ctx: Pick<AppContext, 'config'>, role: Role, inviter: string) {
  const link = `${ctx.config.publicUrl}/sign-in`;
  return {
    subject: 'You are invited to Crestwatch',
    text: [
      `${inviter} has invited you to Crestwatch as ${role === 'admin' ? 'an admin' : `an ${role}`}.`,
      '',
      `Sign in with your Google account at ${link}`,
      '',
      'Crestwatch shows each district’s emissions–income estimates and where it stands against its threshold.',
      'The estimates are statistical associations, not causal laws or forecasts; they do not replace statutory standards or the judgement of qualified staff.',
    ].join('\n'),
  };
}

export async function invite(
  ctx: Pick<AppContext, 'db' | 'config' | 'mailer'>,
  caller: Caller,
  input: { email: string; role: Role; name?: string },
): Promise<{ user: PublicUser; mail: { sent: boolean; error?: string } }> {
  const { db } = ctx;
  const email = input.email.trim().toLowerCase();
  const existing = await store.findByEmail(db, email);
  if (existing) throw new AppError(409, 'already_invited', `${email} already has access (${existing.role}).`, { email });
  const user = await db.transaction(async (trx) => {
    const u = await store.insert(trx, { email, name: input.name ?? '', role: input.role, invitedBy: caller.id });
    await audit.record(trx, { ...actor(caller), action: 'person.invite', targetType: 'user', targetId: u.id, after: publicUser(u) });
    return u;
  });
  const message = invitationText(ctx, input.role, caller.name || caller.email);
  try {
    await ctx.mailer.send({ to: email, ...message });
    return { user: publicUser(user), mail: { sent: true } };
  } catch (err) {
    return { user: publicUser(user), mail: { sent: false, error: `The invitation is saved but the e-mail could not be sent: ${(err as Error).message}` } };
  }
}

export async function updatePerson(
  db: Knex,
  caller: Caller,
  id: number,
  patch: { role?: Role; active?: boolean; name?: string },
): Promise<PublicUser> {
  return db.transaction(async (trx) => {
    const before = await store.findById(trx, id);
    if (!before) throw new NotFoundError(`No person with id ${id}`, { id });
    const demotesLastAdmin =
      before.role === 'admin' && before.active && (patch.active === false || (patch.role && patch.role !== 'admin'));
    if (demotesLastAdmin && (await store.countAdmins(trx)) <= 1) {
      throw new AppError(409, 'last_admin', 'Crestwatch needs at least one active admin: make someone else admin first.');
    }
    const after = await store.update(trx, id, patch);
    if (patch.active === false) {
      // End their sessions at once.
      await trx.raw(`DELETE FROM session WHERE sess->'passport'->>'user' = ?`, [String(id)]);
    }
    const action = patch.active === false ? 'person.deactivate' : patch.active === true ? 'person.reactivate' : 'person.update';
    await audit.record(trx, { ...actor(caller), action, targetType: 'user', targetId: id, before: publicUser(before), after: publicUser(after) });
    return publicUser(after);
  });
}

/**
 * Deletes a person: their sessions, subscriptions, read marks and pending mail go; their
 * audit entries (and uploads, notes) stay under a pseudonym. Not oneself (so an admin always remains).
 */
export async function deletePerson(db: Knex, caller: Caller, id: number): Promise<{ id: number } & ForgetResult> {
  if (id === caller.id) throw new AppError(409, 'cannot_delete_self', 'You cannot delete your own account: ask another admin.');
  return db.transaction(async (trx) => {
    const before = await store.findById(trx, id);
    if (!before) throw new NotFoundError(`No person with id ${id}`, { id });
    const forgotten = await forgetPerson(trx, before);
    await store.remove(trx, id);
    await audit.record(trx, {
      ...actor(caller),
      action: 'person.delete',
      targetType: 'user',
      targetId: id,
      before: { pseudonym: forgotten.pseudonym, role: before.role, status: publicUser(before).status },
      after: { sessions: forgotten.sessions, subscriptions: forgotten.subscriptions, auditEntries: forgotten.auditEntries },
    });
    return { id, ...forgotten };
  });
}

/** Start-up: make sure the first admin (from CRESTWATCH_FIRST_ADMIN) exists when there is none. */
export async function ensureFirstAdmin(db: Knex, email: string | null): Promise<void> {
  if (!email || (await store.countAdmins(db)) > 0) return;
  const existing = await store.findByEmail(db, email);
  if (existing) await store.update(db, existing.id, { role: 'admin', active: true });
  else await store.insert(db, { email: email.toLowerCase(), name: '', role: 'admin' });
  await audit.record(db, { actorId: null, actorEmail: null, action: 'person.first_admin', targetType: 'user', after: { email } });
}

/** Demo and test mode: the demo accounts, one per role plus a deactivated one. */
export async function ensureDemoAccounts(db: Knex): Promise<void> {
  for (const a of DEMO_ACCOUNTS) {
    await db.raw(`INSERT INTO users (email, name, role, active) VALUES (?, ?, ?, ?) ON CONFLICT ((lower(email))) DO NOTHING`, [
      a.email,
      a.name,
      a.role,
      a.active,
    ]);
  }
}
