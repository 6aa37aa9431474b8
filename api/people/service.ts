/**
 * People: invitations (a user row with its role, and an e-mail through nodemailer) that
 * lapse after the `invitationDays` setting and can be re-sent, role changes, deactivation,
 * and resetting the Google identity an account is pinned to. Every change is written to
 * the audit log with before and after.
 */
import type { Knex } from 'knex';
import * as audit from '../audit/service';
import type { AppContext } from '../context';
import { AppError, NotFoundError } from '../http/errors';
import type { Caller, Role } from '../http/routes';
import { forgetPerson, type ForgetResult } from '../retention/service';
import { getSettings } from '../settings/service';
import { DEMO_ACCOUNTS } from '../common/demo-accounts';
import { forgetSessionPerson } from './session-person';
import * as store from './store';

export type PersonStatus = 'active' | 'invited' | 'expired' | 'deactivated';

/** True when the invitation was never used and its expiry has passed. */
export function invitationExpired(
  u: Pick<store.UserRow, 'lastSignInAt' | 'invitationExpiresAt'>,
  now = Date.now(),
): boolean {
  return u.lastSignInAt === null && u.invitationExpiresAt !== null && Date.parse(u.invitationExpiresAt) <= now;
}

function statusOf(u: store.UserRow): PersonStatus {
  if (!u.active) return 'deactivated';
  if (u.lastSignInAt) return 'active';
  return invitationExpired(u) ? 'expired' : 'invited';
}

const publicUser = (u: store.UserRow) => ({
  id: u.id,
  email: u.email,
  name: u.name,
  role: u.role,
  active: u.active,
  status: statusOf(u),
  createdAt: u.createdAt,
  lastSignInAt: u.lastSignInAt,
  invitedAt: u.invitedAt,
  invitationExpiresAt: u.invitationExpiresAt,
  /** Whether a Google identity is pinned (the subject itself stays on the server). */
  identityPinned: u.googleSub !== null,
});
export type PublicUser = ReturnType<typeof publicUser>;

const actor = (c: Caller) => ({ actorId: c.id, actorEmail: c.email });

export async function listPeople(db: Knex): Promise<PublicUser[]> {
  return (await store.list(db)).map(publicUser);
}

export function invitationText(
  ctx: Pick<AppContext, 'config'>,
  role: Role,
  inviter: string,
  expiresAt: string | null = null,
) {
  const link = `${ctx.config.publicUrl}/sign-in`;
  const until = expiresAt
    ? ['', `The invitation can be used until ${expiresAt.slice(0, 10)} (UTC); after that, ask for it to be sent again.`]
    : [];
  return {
    subject: 'You are invited to Crestwatch',
    text: [
      `${inviter} has invited you to Crestwatch as ${role === 'admin' ? 'an admin' : `an ${role}`}.`,
      '',
      `Sign in with your Google account at ${link}`,
      ...until,
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
  if (existing)
    throw new AppError(409, 'already_invited', `${email} already has access (${existing.role}).`, { email });
  const { invitationDays } = await getSettings(db);
  const user = await db.transaction(async (trx) => {
    const u = await store.insert(trx, {
      email,
      name: input.name ?? '',
      role: input.role,
      invitedBy: caller.id,
      invitationDays,
    });
    await audit.record(trx, {
      ...actor(caller),
      action: 'person.invite',
      targetType: 'user',
      targetId: u.id,
      after: publicUser(u),
    });
    return u;
  });
  return { user: publicUser(user), mail: await sendInvitation(ctx, user, caller) };
}

async function sendInvitation(
  ctx: Pick<AppContext, 'config' | 'mailer'>,
  user: store.UserRow,
  caller: Caller,
): Promise<{ sent: boolean; error?: string }> {
  const message = invitationText(ctx, user.role, caller.name || caller.email, user.invitationExpiresAt);
  try {
    await ctx.mailer.send({ to: user.email, ...message });
    return { sent: true };
  } catch (err) {
    return {
      sent: false,
      error: `The invitation is saved but the e-mail could not be sent: ${(err as Error).message}`,
    };
  }
}

/**
 * Sends a pending or lapsed invitation again, valid `invitationDays` from now (audited).
 * Someone who has already signed in needs no invitation.
 */
export async function resendInvitation(
  ctx: Pick<AppContext, 'db' | 'config' | 'mailer'>,
  caller: Caller,
  id: number,
): Promise<{ user: PublicUser; mail: { sent: boolean; error?: string } }> {
  const { invitationDays } = await getSettings(ctx.db);
  const user = await ctx.db.transaction(async (trx) => {
    const before = await store.findById(trx, id);
    if (!before) throw new NotFoundError(`No person with id ${id}`, { id });
    if (before.lastSignInAt)
      throw new AppError(
        409,
        'already_signed_in',
        `${before.email} has already signed in; there is no invitation to re-send.`,
        { id },
      );
    if (!before.active)
      throw new AppError(409, 'deactivated', `${before.email} is deactivated: reactivate them first.`, { id });
    // The first admin and the demo accounts were never sent an invitation, and never lapse.
    if (!before.invitedAt)
      throw new AppError(
        409,
        'no_invitation',
        `${before.email} was not invited by e-mail; there is no invitation to re-send.`,
        { id },
      );
    const after = await store.renewInvitation(trx, id, caller.id, invitationDays);
    await audit.record(trx, {
      ...actor(caller),
      action: 'person.invitation_resend',
      targetType: 'user',
      targetId: id,
      before: publicUser(before),
      after: publicUser(after),
    });
    return after;
  });
  return { user: publicUser(user), mail: await sendInvitation(ctx, user, caller) };
}

/**
 * Forgets the Google identity a person is pinned to (their mailbox moved to a new Google
 * account, say): the next sign-in with their address pins the new one. Their sessions end
 * at once. Audited with before and after.
 */
export async function resetIdentity(db: Knex, caller: Caller, id: number): Promise<PublicUser> {
  const result = await db.transaction(async (trx) => {
    const before = await store.findById(trx, id);
    if (!before) throw new NotFoundError(`No person with id ${id}`, { id });
    if (before.googleSub === null)
      throw new AppError(409, 'identity_not_pinned', `${before.email} is not pinned to a Google identity yet.`, { id });
    const after = await store.clearGoogleSub(trx, id);
    await store.endSessions(trx, id);
    await audit.record(trx, {
      ...actor(caller),
      action: 'person.identity_reset',
      targetType: 'user',
      targetId: id,
      before: publicUser(before),
      after: publicUser(after),
    });
    return publicUser(after);
  });
  // The guard sees the change on this person's next request (other processes within PERSON_CACHE_MS).
  forgetSessionPerson(id);
  return result;
}

export async function updatePerson(
  db: Knex,
  caller: Caller,
  id: number,
  patch: { role?: Role; active?: boolean; name?: string },
): Promise<PublicUser> {
  const result = await db.transaction(async (trx) => {
    const before = await store.findById(trx, id);
    if (!before) throw new NotFoundError(`No person with id ${id}`, { id });
    const demotesLastAdmin =
      before.role === 'admin' && before.active && (patch.active === false || (patch.role && patch.role !== 'admin'));
    if (demotesLastAdmin && (await store.countAdmins(trx)) <= 1) {
      throw new AppError(
        409,
        'last_admin',
        'Crestwatch needs at least one active admin: make someone else admin first.',
      );
    }
    const after = await store.update(trx, id, patch);
    if (patch.active === false) {
      // End their sessions at once.
      await store.endSessions(trx, id);
    }
    const action =
      patch.active === false ? 'person.deactivate' : patch.active === true ? 'person.reactivate' : 'person.update';
    await audit.record(trx, {
      ...actor(caller),
      action,
      targetType: 'user',
      targetId: id,
      before: publicUser(before),
      after: publicUser(after),
    });
    return publicUser(after);
  });
  // The guard sees the change on this person's next request (other processes within PERSON_CACHE_MS).
  forgetSessionPerson(id);
  return result;
}

/**
 * Deletes a person: their sessions, subscriptions, read marks and pending mail go; their
 * audit entries (and uploads, notes) stay under a pseudonym. Not oneself (so an admin always remains).
 */
export async function deletePerson(db: Knex, caller: Caller, id: number): Promise<{ id: number } & ForgetResult> {
  if (id === caller.id)
    throw new AppError(409, 'cannot_delete_self', 'You cannot delete your own account: ask another admin.');
  const result = await db.transaction(async (trx) => {
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
      after: {
        sessions: forgotten.sessions,
        subscriptions: forgotten.subscriptions,
        auditEntries: forgotten.auditEntries,
      },
    });
    return { id, ...forgotten };
  });
  // The guard sees the change on this person's next request (other processes within PERSON_CACHE_MS).
  forgetSessionPerson(id);
  return result;
}

/** Start-up: make sure the first admin (from CRESTWATCH_FIRST_ADMIN) exists when there is none. */
export async function ensureFirstAdmin(db: Knex, email: string | null): Promise<void> {
  if (!email) return;
  await db.transaction(async (trx) => {
    if ((await store.countAdmins(trx)) > 0) return;
    const existing = await store.findByEmail(trx, email);
    if (existing) await store.update(trx, existing.id, { role: 'admin', active: true });
    else await store.insert(trx, { email: email.toLowerCase(), name: '', role: 'admin' });
    await audit.record(trx, {
      actorId: null,
      actorEmail: null,
      action: 'person.first_admin',
      targetType: 'user',
      after: { email },
    });
  });
}

/** Demo and test mode: the demo accounts, one per role plus a deactivated one. */
export async function ensureDemoAccounts(db: Knex): Promise<void> {
  for (const a of DEMO_ACCOUNTS) await store.insertIfAbsent(db, a);
}

/** A person as sign-in sees them (the auth feature decides whether they may enter). */
export type PersonRecord = store.UserRow;

export function findPersonByEmail(db: Knex, email: string): Promise<PersonRecord | null> {
  return store.findByEmail(db, email);
}

export function findPersonByGoogleSub(db: Knex, googleSub: string): Promise<PersonRecord | null> {
  return store.findByGoogleSub(db, googleSub);
}

/** A sign-in: pins the Google subject when none is stored yet and fills an empty name. */
export function recordSignIn(db: Knex, id: number, googleSub: string, name: string): Promise<void> {
  return store.recordSignIn(db, id, googleSub, name);
}

/** The person with this address as a caller (id, e-mail, name, role, active), or null. */
export async function callerByEmail(db: Knex, email: string): Promise<Caller | null> {
  const u = await store.findByEmail(db, email);
  return u ? { id: u.id, email: u.email, name: u.name, role: u.role, active: u.active } : null;
}
