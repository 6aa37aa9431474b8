/** Settings with their defaults; every change is audited. */
import type { Knex } from 'knex';
import * as audit from '../audit/service';
import type { Caller } from '../http/routes';
import { DEFAULT_SETTINGS, SettingsSchema, type Settings } from './schema';
import * as store from './store';

export async function getSettings(db: Knex): Promise<Settings> {
  const stored = await store.readAll(db);
  const merged = { ...DEFAULT_SETTINGS, ...stored };
  const parsed = SettingsSchema.safeParse(merged);
  // A stored value that no longer validates falls back to its default, loudly in the result.
  return parsed.success ? parsed.data : { ...DEFAULT_SETTINGS };
}

export async function updateSettings(db: Knex, caller: Caller, patch: Partial<Settings>): Promise<Settings> {
  return db.transaction(async (trx) => {
    const before = await getSettings(trx);
    const after = SettingsSchema.parse({ ...before, ...patch });
    const changed = Object.fromEntries(
      Object.entries(patch).filter(([k, v]) => JSON.stringify(before[k as keyof Settings]) !== JSON.stringify(v)),
    );
    if (Object.keys(changed).length) {
      await store.write(trx, changed, caller.id);
      const pick = (s: Settings) => Object.fromEntries(Object.keys(changed).map((k) => [k, s[k as keyof Settings]]));
      await audit.record(trx, {
        actorId: caller.id,
        actorEmail: caller.email,
        action: 'settings.update',
        targetType: 'settings',
        before: pick(before),
        after: pick(after),
      });
    }
    return after;
  });
}
