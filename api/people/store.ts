/** Users: the only place their SQL lives. */
import type { Knex } from 'knex';
import type { Role } from '../http/routes';

export interface UserRow {
  id: number;
  email: string;
  name: string;
  role: Role;
  active: boolean;
  googleSub: string | null;
  createdAt: string;
  lastSignInAt: string | null;
  invitedBy: number | null;
  invitedAt: string | null;
  /** When the invitation lapses unless used; null for accounts never sent one (first admin, demo). */
  invitationExpiresAt: string | null;
}

const columns = [
  'id',
  'email',
  'name',
  'role',
  'active',
  'google_sub',
  'created_at',
  'last_sign_in_at',
  'invited_by',
  'invited_at',
  'invitation_expires_at',
];

function toUser(r: Record<string, unknown>): UserRow {
  const iso = (v: unknown) => (v ? new Date(v as string).toISOString() : null);
  return {
    id: Number(r.id),
    email: String(r.email),
    name: String(r.name),
    role: r.role as Role,
    active: Boolean(r.active),
    googleSub: (r.google_sub as string | null) ?? null,
    createdAt: iso(r.created_at)!,
    lastSignInAt: iso(r.last_sign_in_at),
    invitedBy: r.invited_by === null ? null : Number(r.invited_by),
    invitedAt: iso(r.invited_at),
    invitationExpiresAt: iso(r.invitation_expires_at),
  };
}

export async function findById(db: Knex, id: number): Promise<UserRow | null> {
  const r = await db('users').where({ id }).first(columns);
  return r ? toUser(r) : null;
}

export async function findByEmail(db: Knex, email: string): Promise<UserRow | null> {
  const r = await db('users').whereRaw('lower(email) = lower(?)', [email]).first(columns);
  return r ? toUser(r) : null;
}

export async function list(db: Knex): Promise<UserRow[]> {
  return (
    await db('users')
      .orderBy([{ column: 'role' }, { column: 'email' }])
      .select(columns)
  ).map(toUser);
}

export async function countAdmins(db: Knex): Promise<number> {
  const [{ count }] = await db('users')
    .where({ role: 'admin', active: true })
    .count<{ count: string }[]>({ count: '*' });
  return Number(count);
}

export async function insert(
  db: Knex,
  u: { email: string; name: string; role: Role; active?: boolean; invitedBy?: number | null; invitationDays?: number },
): Promise<UserRow> {
  const [r] = await db('users')
    .insert({
      email: u.email,
      name: u.name,
      role: u.role,
      active: u.active ?? true,
      invited_by: u.invitedBy ?? null,
      invited_at: u.invitedBy ? db.fn.now() : null,
      invitation_expires_at:
        u.invitedBy && u.invitationDays ? db.raw(`now() + make_interval(days => ?)`, [u.invitationDays]) : null,
    })
    .returning(columns);
  return toUser(r);
}

/** Adds an account unless one with its address (in any case) exists; returns whether it was added. */
export async function insertIfAbsent(
  db: Knex,
  u: { email: string; name: string; role: Role; active: boolean },
): Promise<boolean> {
  const r = await db.raw(
    `INSERT INTO users (email, name, role, active) VALUES (?, ?, ?, ?) ON CONFLICT ((lower(email))) DO NOTHING`,
    [u.email, u.name, u.role, u.active],
  );
  return Number(r.rowCount) > 0;
}

export async function update(
  db: Knex,
  id: number,
  patch: { role?: Role; active?: boolean; name?: string },
): Promise<UserRow> {
  const [r] = await db('users').where({ id }).update(patch).returning(columns);
  return toUser(r);
}

export async function remove(db: Knex, id: number): Promise<void> {
  await db('users').where({ id }).delete();
}

export async function findByGoogleSub(db: Knex, googleSub: string): Promise<UserRow | null> {
  const r = await db('users').where({ google_sub: googleSub }).first(columns);
  return r ? toUser(r) : null;
}

/** A sign-in: pins the Google subject when none is stored yet (never replaces one). */
export async function recordSignIn(db: Knex, id: number, googleSub: string, name: string): Promise<void> {
  await db('users')
    .where({ id })
    .update({
      google_sub: db.raw('COALESCE(google_sub, ?)', [googleSub]),
      last_sign_in_at: db.fn.now(),
      name: db.raw("CASE WHEN name = '' THEN ? ELSE name END", [name]),
    });
}

/** Re-sending an invitation: sent now, lapsing `days` from now. */
export async function renewInvitation(db: Knex, id: number, invitedBy: number, days: number): Promise<UserRow> {
  const [r] = await db('users')
    .where({ id })
    .update({
      invited_by: invitedBy,
      invited_at: db.fn.now(),
      invitation_expires_at: db.raw(`now() + make_interval(days => ?)`, [days]),
    })
    .returning(columns);
  return toUser(r);
}

/** Forgets the pinned Google subject: the next sign-in pins whichever identity arrives. */
export async function clearGoogleSub(db: Knex, id: number): Promise<UserRow> {
  const [r] = await db('users').where({ id }).update({ google_sub: null }).returning(columns);
  return toUser(r);
}

/** Ends every session of one person. */
export async function endSessions(db: Knex, id: number): Promise<void> {
  await db.raw(`DELETE FROM session WHERE sess->'passport'->>'user' = ?`, [String(id)]);
}
