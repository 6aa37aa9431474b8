/**
 * The signed-in person as every /api request needs it (id, e-mail, name, role, active),
 * cached per process for at most PERSON_CACHE_MS. Every request used to read the users
 * table again; now a burst of requests from one person reads it once. A role change,
 * deactivation, identity reset or deletion made through this process forgets the entry at
 * once; one made through another process (a second server, a worker, SQL by hand) takes
 * effect within the cache's lifetime.
 *
 * The session rows themselves are cached the same way (`cachedSession`, for the session
 * store in api/auth/session.ts): a session written or ended through this process is current
 * at once; one ended elsewhere (sign-out through a second server) ends here within
 * PERSON_CACHE_MS, as a deactivation does.
 */
import type { Knex } from 'knex';
import type { Caller } from '../http/routes';
import * as store from './store';

export const PERSON_CACHE_MS = 5_000;
/** A bound on entries, so a flood of distinct sessions cannot grow the map without limit. */
const MAX_ENTRIES = 10_000;

const cache = new Map<number, { caller: Caller | null; until: number }>();

export async function sessionPerson(db: Knex, id: number, now = Date.now()): Promise<Caller | null> {
  const hit = cache.get(id);
  if (hit && hit.until > now) return hit.caller;
  const u = await store.findById(db, id);
  const caller = u ? { id: u.id, email: u.email, name: u.name, role: u.role, active: u.active } : null;
  if (cache.size >= MAX_ENTRIES) cache.clear();
  cache.set(id, { caller, until: now + PERSON_CACHE_MS });
  return caller;
}

/** After a change to a person made here: the next request reads them again. */
export function forgetSessionPerson(id: number): void {
  cache.delete(id);
  for (const [sid, kept] of sessions) if (kept.userId === String(id)) sessions.delete(sid);
}

/** Session rows by session id, as JSON (each reader gets its own copy to change). */
const sessions = new Map<string, { json: string; userId: string | null; until: number }>();

/** The session kept for `sid` while it is at most PERSON_CACHE_MS old; undefined otherwise. */
export function cachedSession(sid: string, now = Date.now()): unknown {
  const kept = sessions.get(sid);
  if (!kept) return undefined;
  if (kept.until > now) return JSON.parse(kept.json);
  sessions.delete(sid);
  return undefined;
}

/** Keeps a session as just read or written. */
export function keepSession(sid: string, sess: unknown, now = Date.now()): void {
  if (sessions.size >= MAX_ENTRIES) sessions.clear();
  const user = (sess as { passport?: { user?: unknown } } | null)?.passport?.user;
  sessions.set(sid, {
    json: JSON.stringify(sess),
    userId: user === undefined ? null : String(user),
    until: now + PERSON_CACHE_MS,
  });
}

/** A session ended through this process: the next request reads the store. */
export function forgetSession(sid: string): void {
  sessions.delete(sid);
}
