/**
 * The signed-in person as every /api request needs it (id, e-mail, name, role, active),
 * cached per process for at most PERSON_CACHE_MS. Every request used to read the users
 * table again; now a burst of requests from one person reads it once. A role change,
 * deactivation, identity reset or deletion made through this process forgets the entry at
 * once; one made through another process (a second server, a worker, SQL by hand) takes
 * effect within the cache's lifetime.
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
}
