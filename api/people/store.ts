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
}

const columns = ['id', 'email', 'name', 'role', 'active', 'google_sub', 'created_at', 'last_sign_in_at', 'invited_by', 'invited_at'];

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
  return (await db('users').orderBy([{ column: 'role' }, { column: 'email' }]).select(columns)).map(toUser);
}

export async function countAdmins(db: Knex): Promise<number> {
  const [{ count }] = await db('users').where({ role: 'admin', active: true }).count<{ count: string }[]>({ count: '*' });
  return Number(count);
}

export async function insert(
  db: Knex,
  u: { email: string; name: string; role: Role; active?: boolean; invitedBy?: number | null },
): Promise<UserRow> {
  const [r] = await db('users')
    .insert({
      email: u.email,
      name: u.name,
      role: u.role,
      active: u.active ?? true,
      invited_by: u.invitedBy ?? null,
      invited_at: u.invitedBy ? db.fn.now() : null,
    })
    .returning(columns);
  return toUser(r);
}

export async function update(db: Knex, id: number, patch: { role?: Role; active?: boolean; name?: string }): Promise<UserRow> {
  const [r] = await db('users').where({ id }).update(patch).returning(columns);
  return toUser(r);
}

export async function remove(db: Knex, id: number): Promise<void> {
  await db('users').where({ id }).delete();
}

export async function recordSignIn(db: Knex, id: number, googleSub: string, name: string): Promise<void> {
  await db('users')
    .where({ id })
    .update({ google_sub: googleSub, last_sign_in_at: db.fn.now(), name: db.raw("CASE WHEN name = '' THEN ? ELSE name END", [name]) });
}
