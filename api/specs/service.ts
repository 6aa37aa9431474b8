/** Saved model specs: a library of named specs that tracks take up; every change is audited. */
import type { Knex } from 'knex';
import * as audit from '../audit/service';
import { lockForTransaction } from '../db/locks';
import { AppError, NotFoundError } from '../http/errors';
import { knownIndicatorCodes } from '../indicators/service';
import type { Caller } from '../http/routes';
import { DEFAULT_SPEC, type SavedSpec, type SavedSpecInput } from './schema';
import * as store from './store';

async function checkIndicators(db: Knex, s: SavedSpecInput): Promise<void> {
  const codes = [s.emissionsIndicator, s.driverIndicator, ...s.controls];
  const known = new Set(await knownIndicatorCodes(db, codes));
  const unknown = codes.filter((c) => !known.has(c));
  if (unknown.length)
    throw new AppError(400, 'unknown_indicator', `Unknown indicator: ${unknown.join(', ')}`, { unknown });
  const missing = s.levelControls.filter((c) => !s.controls.includes(c));
  if (missing.length)
    throw new AppError(400, 'invalid_request', `levelControls must be among the controls: ${missing.join(', ')}`, {
      missing,
    });
}

const unique = (err: unknown) => (err as { code?: string }).code === '23505';

export async function createSpec(db: Knex, caller: Caller, input: SavedSpecInput): Promise<SavedSpec> {
  await checkIndicators(db, input);
  return db.transaction(async (trx) => {
    try {
      const spec = await store.insert(trx, input, caller.id);
      await audit.record(trx, {
        actorId: caller.id,
        actorEmail: caller.email,
        action: 'spec.create',
        targetType: 'model_spec',
        targetId: spec.id,
        after: spec,
      });
      return spec;
    } catch (err) {
      if (unique(err)) throw new AppError(409, 'name_taken', `A spec named "${input.name}" exists already.`);
      throw err;
    }
  });
}

export async function updateSpec(db: Knex, caller: Caller, id: number, input: SavedSpecInput): Promise<SavedSpec> {
  await checkIndicators(db, input);
  return db.transaction(async (trx) => {
    const before = await store.find(trx, id);
    if (!before || before.archived) throw new NotFoundError(`No model spec with id ${id}`, { id });
    try {
      const after = await store.update(trx, id, input);
      await audit.record(trx, {
        actorId: caller.id,
        actorEmail: caller.email,
        action: 'spec.update',
        targetType: 'model_spec',
        targetId: id,
        before,
        after,
      });
      return after;
    } catch (err) {
      if (unique(err)) throw new AppError(409, 'name_taken', `A spec named "${input.name}" exists already.`);
      throw err;
    }
  });
}

export async function archiveSpec(db: Knex, caller: Caller, id: number): Promise<void> {
  await db.transaction(async (trx) => {
    const before = await store.find(trx, id);
    if (!before || before.archived) throw new NotFoundError(`No model spec with id ${id}`, { id });
    const tracks = await store.trackCodesUsing(trx, id);
    if (tracks.length)
      throw new AppError(
        409,
        'spec_in_use',
        `Spec "${before.name}" is the spec of track ${tracks.join(', ')}: give the track another spec first.`,
        { tracks },
      );
    await store.archive(trx, id);
    await audit.record(trx, {
      actorId: caller.id,
      actorEmail: caller.email,
      action: 'spec.archive',
      targetType: 'model_spec',
      targetId: id,
      before,
    });
  });
}

/**
 * The spec a first track is made from when no track exists yet: the oldest spec in the
 * library, or the built-in starting spec, saved on first use.
 */
export async function starterSpec(db: Knex): Promise<SavedSpec> {
  const found = await store.findOldest(db);
  if (found) return found;
  return db.transaction(async (trx) => {
    // Its own lock: saving the starting spec must not wait on an upload holding the observations lock.
    await lockForTransaction(trx, 'starterSpec');
    return (await store.findOldest(trx)) ?? store.insert(trx, DEFAULT_SPEC, null);
  });
}

/** The headline track's spec id (null before any track exists). */
export const headlineSpecId = (db: Knex) => store.headlineSpecId(db);

export const listSpecs = (db: Knex) => store.list(db);
export async function getSpec(db: Knex, id: number): Promise<SavedSpec> {
  const s = await store.find(db, id);
  if (!s) throw new NotFoundError(`No model spec with id ${id}`, { id });
  return s;
}
